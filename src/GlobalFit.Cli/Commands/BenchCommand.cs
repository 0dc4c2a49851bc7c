using System.CommandLine;
using System.Globalization;
using GlobalFit.Cli.Bench;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit bench</c>: quick throughput figures of the hot kernels on this machine.</summary>
public static class BenchCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var json = new Option<bool>("--json") { Description = "Print one JSON object of named figures" };
        var projection = new Option<bool>("--projection")
        {
            Description = "Also run a year-long slice of four galactic-binary windows (a few minutes) and project a 0.3-15 mHz year fit",
        };
        var iterations = new Option<int>("--projection-iterations") { Description = "Iterations of the projected fit", DefaultValueFactory = _ => 5000 };
        var cores = new Option<int>("--projection-cores") { Description = "Cores of the projected machine", DefaultValueFactory = _ => 32 };
        var command = new Command("bench", "Measure the speed of the main kernels on this machine (about a minute)") { json, projection, iterations, cores };
        command.SetAction(parse => Run(context, parse.GetValue(json), parse.GetValue(projection), parse.GetValue(iterations), parse.GetValue(cores)));
        return command;
    }

    private static int Run(CliContext context, bool json, bool projection, int iterations, int cores)
    {
        if (iterations < 1) throw new InvalidInputException("--projection-iterations", null, $"must be at least 1, got {iterations}");
        if (cores < 1) throw new InvalidInputException("--projection-cores", null, $"must be at least 1, got {cores}");
        var figures = new List<BenchFigure>();
        foreach (var suite in QuickBenchSuites.All)
        {
            if (!json) context.Error.WriteLine($"bench: {suite.Name}");
            figures.AddRange(suite.Run());
        }
        if (projection)
        {
            if (!json) context.Error.WriteLine("bench: year-long galactic-binary slice and projection");
            figures.AddRange(GalacticBinaryYearProjection.Run(iterations, cores, Math.Max(1, Environment.ProcessorCount)));
        }
        if (json)
        {
            var values = new Dictionary<string, object>
            {
                ["machine"] = new Dictionary<string, object>
                {
                    ["processors"] = Environment.ProcessorCount,
                    ["runtime"] = System.Runtime.InteropServices.RuntimeInformation.FrameworkDescription,
                },
            };
            foreach (var f in figures) values[f.Name] = f.Value;
            context.Out.WriteLine(CliJson.Serialize(values));
        }
        else
        {
            foreach (var f in figures)
                context.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{f.Name,-40} {NumberText.Significant(f.Value, 5),14}   {f.Description}"));
        }
        return ExitCodes.Success;
    }
}
