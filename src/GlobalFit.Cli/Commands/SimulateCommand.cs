using System.CommandLine;
using System.Globalization;
using GlobalFit.Cli.Console;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit simulate SCENARIO.toml --out DATA.h5</c>: simulate an observation from a scenario file.</summary>
public static class SimulateCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var scenario = new Argument<string>("scenario") { Description = "Scenario file (TOML); see configs/ for examples" };
        var output = new Option<string>("--out") { Description = "Observation file to write (HDF5)", Required = true };
        var force = new Option<bool>("--force") { Description = "Replace an existing output file" };
        var json = new Option<bool>("--json") { Description = "Print a JSON summary instead of text" };
        var seed = new Option<ulong?>("--seed") { Description = "Use this seed instead of the scenario's (recorded in the file's resolved scenario)" };
        var command = new Command("simulate", "Simulate TDI A/E/T data (noise and foreground) from a scenario file") { scenario, output, force, json, seed };
        command.SetAction(parse => Run(context, parse.GetValue(scenario)!, parse.GetValue(output)!, parse.GetValue(force), parse.GetValue(json), parse.GetValue(seed)));
        return command;
    }

    /// <summary>Simulates <paramref name="scenarioPath"/> into <paramref name="outputPath"/>.</summary>
    /// <param name="context">Console.</param>
    /// <param name="scenarioPath">The scenario file.</param>
    /// <param name="outputPath">The observation file to write.</param>
    /// <param name="force">Replace an existing output.</param>
    /// <param name="json">Print JSON.</param>
    /// <param name="seed">A seed replacing the scenario's, or null.</param>
    public static int Run(CliContext context, string scenarioPath, string outputPath, bool force, bool json, ulong? seed = null)
    {
        var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Load(scenarioPath));
        if (seed is { } s) scenario = scenario with { Seed = s };
        return Run(context, scenario, scenarioPath, outputPath, force, json);
    }

    /// <summary>Simulates an already parsed scenario.</summary>
    public static int Run(CliContext context, SimulationScenario scenario, string scenarioSource, string outputPath, bool force, bool json)
    {
        string target = OutputPaths.CheckWritable(outputPath, force, "--out");
        Observation observation;
        using (var progress = new ProgressReporter(context, "simulate", quiet: json))
        {
            var notes = new Dictionary<string, string> { ["scenario_source"] = scenarioSource };
            observation = ObservationSimulator.Simulate(scenario, ProgramInfo.Generator, notes, progress);
        }
        ObservationFile.Write(observation, target, overwrite: force);
        var data = observation.Data;
        if (json)
        {
            context.Out.WriteLine(CliJson.Serialize(new Dictionary<string, object>
            {
                ["file"] = target,
                ["scenario"] = scenario.Name,
                ["seed"] = scenario.Seed,
                ["points_per_channel"] = data.Count,
                ["cadence_s"] = data.DtSeconds,
                ["duration_s"] = data.Count * data.DtSeconds,
            }));
        }
        else
        {
            context.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"wrote {target}: scenario \"{scenario.Name}\", seed {scenario.Seed}, {data.Count} points per channel at {data.DtSeconds} s ({data.Count * data.DtSeconds / 86400:F2} days)"));
        }
        return ExitCodes.Success;
    }
}
