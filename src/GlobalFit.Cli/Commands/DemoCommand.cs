using System.CommandLine;
using GlobalFit.Cli.Console;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit demo</c>: simulate the built-in scenario, fit it, and compare the catalogue with the truth,
/// with no files needed.</summary>
public static class DemoCommand
{
    /// <summary>Marks a folder as created by the demo, so a rerun may replace its files.</summary>
    public const string MarkerFile = ".globalfit-demo";

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
        if (File.Exists(full)) throw new InvalidInputException(folder, "--out", "is a file, not a folder");
        bool ours = File.Exists(Path.Combine(full, MarkerFile));
        if (Directory.Exists(full) && !ours && Directory.EnumerateFileSystemEntries(full).Any() && !force)
            throw new InvalidInputException(folder, "--out", "exists and was not made by the demo; choose another folder or pass --force");
        Directory.CreateDirectory(full);
        WriteText(Path.Combine(full, MarkerFile), "files in this folder were written by 'globalfit demo' and are replaced when it runs again\n");

        string scenarioPath = Path.Combine(full, "scenario.toml");
        WriteText(scenarioPath, DemoScenario.Toml);
        var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(DemoScenario.Toml, "built-in demo scenario"));
        context.Out.WriteLine($"demo: simulating \"{scenario.Name}\" into {full}");
        string dataPath = Path.Combine(full, "data.h5");
        int status = SimulateCommand.Run(context, scenario, scenarioPath, dataPath, force: true, json: false);
        if (status != ExitCodes.Success) return status;

        context.Out.WriteLine();
        context.Out.WriteLine("demo: inspecting the simulated data");
        status = InspectCommand.Run(context, dataPath, Path.Combine(full, "noise.png"), force: true, json: false);
        if (status != ExitCodes.Success) return status;

        string configPath = Path.Combine(full, "fit.toml");
        WriteText(configPath, DemoFitConfig.Toml(iterations));
        string runFolder = Path.Combine(full, "run");
        if (Directory.Exists(runFolder)) Directory.Delete(runFolder, recursive: true);
        context.Out.WriteLine();
        context.Out.WriteLine($"demo: fitting every class and the noise jointly ({configPath})");
        status = FitCommand.Run(context, options => FitRunner.Start(configPath, options), otlp: null, completed: null);
        if (status != ExitCodes.Success) return status;

        context.Out.WriteLine();
        context.Out.WriteLine($"demo: the catalogue against the truth (globalfit compare {runFolder} --truth {dataPath})");
        status = CompareCommand.Run(context, runFolder, dataPath, CompareCommand.DefaultDetectableSnr, json: false);
        if (status != ExitCodes.Success) return status;
        context.Out.WriteLine();
        context.Out.WriteLine($"demo: the run is in {runFolder}; try 'globalfit status {runFolder}', 'globalfit trace {runFolder}', 'globalfit catalogue {runFolder} --format json'");
        return ExitCodes.Success;
    }

    private static void WriteText(string path, string text) =>
        AtomicFile.Write(path, overwrite: true, stream => stream.Write(System.Text.Encoding.UTF8.GetBytes(text)));
}
