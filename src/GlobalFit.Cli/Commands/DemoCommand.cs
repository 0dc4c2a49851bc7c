using System.CommandLine;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.Input;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit demo</c>: simulate the built-in scenario and inspect it, with no files needed.</summary>
public static class DemoCommand
{
    /// <summary>Marks a folder as created by the demo, so a rerun may replace its files.</summary>
    public const string MarkerFile = ".globalfit-demo";

    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var folder = new Option<string>("--out") { Description = "Folder for the demo's files", DefaultValueFactory = _ => "globalfit-demo" };
        var force = new Option<bool>("--force") { Description = "Use the folder even if it was not made by the demo" };
        var command = new Command("demo", "Run globalfit on a built-in invented scenario: simulate a month of data and inspect it") { folder, force };
        command.SetAction(parse => Run(context, parse.GetValue(folder)!, parse.GetValue(force)));
        return command;
    }

    private static int Run(CliContext context, string folder, bool force)
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
        context.Out.WriteLine();
        context.Out.WriteLine("demo: the global fit of this data arrives with the engine (fit, resume, catalogue); see README");
        return ExitCodes.Success;
    }
}
