using System.Collections.Immutable;
using System.CommandLine;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Runs;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit compare RUN --truth DATA.h5</c>: a run's catalogue against the injected truth, per class: found,
/// missed and spurious per SNR bin, parameter errors in posterior σ, and the coverage of the 90 % intervals.</summary>
public static class CompareCommand
{
    /// <summary>Injected SNR from which an unmatched injection counts as missed (common practice: 7 is the usual
    /// detection threshold for resolvable galactic binaries).</summary>
    public const double DefaultDetectableSnr = 7.0;

    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "The run folder" };
        var truth = new Option<string>("--truth") { Description = "Observation file whose truth tables hold the injections", Required = true };
        var snr = new Option<double>("--detectable-snr")
        {
            Description = $"Injected SNR from which an unmatched injection counts as missed (default {DefaultDetectableSnr})",
            DefaultValueFactory = _ => DefaultDetectableSnr,
        };
        snr.Validators.Add(r =>
        {
            double v = r.GetValueOrDefault<double>();
            if (!(v >= 0) || double.IsInfinity(v)) r.AddError("--detectable-snr must be finite and at least 0");
        });
        var json = new Option<bool>("--json") { Description = "Print JSON instead of text" };
        var command = new Command("compare", "Compare a run's catalogue with the injected truth of an observation file") { run, truth, snr, json };
        command.SetAction(parse => Run(context, parse.GetValue(run)!, parse.GetValue(truth)!, parse.GetValue(snr), parse.GetValue(json)));
        return command;
    }

    /// <summary>Compares and prints; the demo calls this too.</summary>
    /// <param name="context">Console.</param>
    /// <param name="runFolder">The run folder.</param>
    /// <param name="truthPath">The observation file.</param>
    /// <param name="detectableSnr">Detectable-SNR threshold.</param>
    /// <param name="json">Print JSON.</param>
    /// <returns>The exit code.</returns>
    public static int Run(CliContext context, string runFolder, string truthPath, double detectableSnr, bool json)
    {
        ArgumentNullException.ThrowIfNull(context);
        var layout = RunFolderLayout.OpenExisting(runFolder);
        var plan = RunPlan.Load(layout.ResolvedConfig);
        void Warn(string message) => context.Error.WriteLine($"warning: {message}");
        var catalogue = RunCatalogue.Build(plan, layout, Warn);
        var observation = ObservationFile.Read(truthPath);
        var results = RunComparison.Compare(plan, layout, catalogue, observation, detectableSnr, Warn);
        if (json) context.Out.WriteLine(CliJson.Serialize(ComparisonReport.Json(layout.Root, truthPath, results)));
        else ComparisonReport.Write(context.Out, results);
        return ExitCodes.Success;
    }

    /// <summary>The results as text, for the demo.</summary>
    internal static void Write(TextWriter output, ImmutableArray<ClassComparison> results) => ComparisonReport.Write(output, results);
}
