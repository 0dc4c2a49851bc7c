using System.CommandLine;
using System.Globalization;
using GlobalFit.Cli.Console;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.GalacticBinaryBands;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Input;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit demo</c>: simulate the built-in scenario, fit it, and compare the catalogue with the truth,
/// with no files needed.</summary>
public static class DemoCommand
{
    /// <summary>Marks a folder as created by the demo, so a rerun may replace its files.</summary>
    public const string MarkerFile = ".globalfit-demo";

    /// <summary>Optimal SNR from which an injected binary counts as detectable in the comparison (common practice:
    /// a threshold of 7 is the usual choice for resolvable galactic binaries).</summary>
    private const double DetectableSnr = 7.0;

    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var folder = new Option<string>("--out") { Description = "Folder for the demo's files", DefaultValueFactory = _ => "globalfit-demo" };
        var force = new Option<bool>("--force") { Description = "Use the folder even if it was not made by the demo" };
        var iterations = new Option<int>("--iterations")
        {
            Description = $"Blocked-Gibbs iterations of the demo fit (default {DemoFitConfig.Iterations}; fewer for a quick look)",
            DefaultValueFactory = _ => DemoFitConfig.Iterations,
        };
        iterations.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 2) r.AddError("--iterations must be at least 2");
        });
        var command = new Command("demo", "Run globalfit on a built-in invented scenario: simulate a month of data, fit it, compare with the truth") { folder, force, iterations };
        command.SetAction(parse => Run(context, parse.GetValue(folder)!, parse.GetValue(force), parse.GetValue(iterations)));
        return command;
    }

    private static int Run(CliContext context, string folder, bool force, int iterations)
    {
        string full = Path.GetFullPath(folder);
        bool ours = File.Exists(Path.Combine(full, MarkerFile));
        if (Directory.Exists(full) && !ours && Directory.EnumerateFileSystemEntries(full).Any() && !force)
            throw new InvalidInputException(folder, "--out", "exists and was not made by the demo; choose another folder or pass --force");
        Directory.CreateDirectory(full);
        File.WriteAllText(Path.Combine(full, MarkerFile), "files in this folder were written by 'globalfit demo' and are replaced when it runs again\n");

        string scenarioPath = Path.Combine(full, "scenario.toml");
        File.WriteAllText(scenarioPath, DemoScenario.Toml);
        var scenario = SimulationScenario.FromConfig(ConfigDocument.Parse(DemoScenario.Toml, "built-in demo scenario"));
        context.Out.WriteLine($"demo: simulating \"{scenario.Name}\" into {full}");
        string dataPath = Path.Combine(full, "data.h5");
        int status = SimulateCommand.Run(context, scenario, scenarioPath, dataPath, force: true, json: false);
        if (status != ExitCodes.Success) return status;

        context.Out.WriteLine();
        context.Out.WriteLine("demo: inspecting the simulated data");
        status = InspectCommand.Run(context, dataPath, Path.Combine(full, "noise.png"), force: true, json: false);
        if (status != ExitCodes.Success) return status;

        string configPath = Path.Combine(full, "fit.toml");
        File.WriteAllText(configPath, DemoFitConfig.Toml(iterations));
        string runFolder = Path.Combine(full, "run");
        if (Directory.Exists(runFolder)) Directory.Delete(runFolder, recursive: true);
        context.Out.WriteLine();
        context.Out.WriteLine($"demo: fitting galactic binaries and noise jointly ({configPath})");
        var catalogue = System.Collections.Immutable.ImmutableArray<CatalogueRecord>.Empty;
        status = FitCommand.Run(context, options => FitRunner.Start(configPath, options), otlp: null, completed: outcome => catalogue = outcome.Catalogue);
        if (status != ExitCodes.Success) return status;

        context.Out.WriteLine();
        var plan = RunPlan.Load(new RunFolderLayout(runFolder).ResolvedConfig);
        var truth = ObservationFile.Read(dataPath).FindTruth(GalacticBinaryFitClass.Id)
            ?? throw new InvalidInputException(dataPath, "/truth", "the demo data lost its truth table");
        Print(context.Out, plan, catalogue.Where(r => r.ClassId == GalacticBinaryFitClass.Id).ToList(), truth);
        context.Out.WriteLine();
        context.Out.WriteLine($"demo: the run is in {runFolder}; try 'globalfit status {runFolder}', 'globalfit trace {runFolder}', 'globalfit catalogue {runFolder} --format json'");
        return ExitCodes.Success;
    }

    private static void Print(TextWriter o, RunPlan plan, IReadOnlyList<CatalogueRecord> entries, TruthTable truth)
    {
        double df = plan.Shape.DfHz;
        var band = plan.Classes.Single(c => c.ClassId == GalacticBinaryFitClass.Id).Groups.SelectMany(g => g.Workers).ToList();
        double low = band.Min(w => w.Bins.First) * df, high = band.Max(w => w.Bins.End) * df;
        // Four bins: over a month f0 and sky position are degenerate, and an entry caught in a secondary sky mode has its
        // f0 moved by up to the orbital Doppler shift (v/c ≈ 1e-4, 1.3 bins at 5 mHz) on either side of the truth;
        // the f0 posterior itself is a small fraction of a bin wide. An entry farther away is another signal.
        var result = TruthComparison.Compare(entries, truth, "f0_hz", 4 * df, low, high, DetectableSnr);
        o.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"demo: galactic binaries {low * 1e3:F2}-{high * 1e3:F2} mHz: {result.DetectableCount} injected with SNR >= {DetectableSnr}; found {result.Found.Length}, missed {result.Missed.Length}; {entries.Count} catalogue entries, {result.Spurious.Length} spurious"));
        o.WriteLine("  found (median - truth in posterior sigma):");
        o.WriteLine("    truth          entry      SNR inj  SNR fit  conf    f0     fdot   amp    beta   lambda");
        foreach (var f in result.Found)
        {
            string E(string name) => f.ErrorsInSigma.TryGetValue(name, out double v) ? (Math.Round(v, 1) == 0 ? 0.0 : v).ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture).PadLeft(6) : "     -";
            o.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"    {f.TruthId,-14} {f.EntryId,-10} {f.InjectedSnr,7:F1}  {f.EntrySnr,7:F1}  {f.Confidence,4:F2}  {E("f0_hz")} {E("fdot_hz_s")} {E("amp")} {E("beta_rad")} {E("lambda_rad")}"));
        }
        foreach (var m in result.Missed)
            o.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  missed {m.TruthId} at {m.Key * 1e3:F5} mHz, SNR {m.InjectedSnr:F1}"));
        foreach (var s in result.Spurious)
            o.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  spurious {s.Id} at {s.Median[s.ParameterNames.IndexOf("f0_hz")] * 1e3:F5} mHz, SNR {s.Snr:F1}, confidence {s.Confidence:F2}"));
    }
}
