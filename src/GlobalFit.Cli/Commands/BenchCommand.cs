using System.CommandLine;
using System.Globalization;
using GlobalFit.Cli.Bench;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit bench</c>: quick throughput figures of the hot kernels on this machine.</summary>
public static class BenchCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var json = new Option<bool>("--json") { Description = "Print one JSON object of named figures" };
        var command = new Command("bench", "Measure the speed of the main kernels on this machine (about a minute)") { json };
        command.SetAction(parse => Run(context, parse.GetValue(json)));
        return command;
    }

    private static int Run(CliContext context, bool json)
    {
        var figures = new List<BenchFigure>();
        foreach (var suite in QuickBenchSuites.All)
        {
            if (!json) context.Error.WriteLine($"bench: {suite.Name}");
            figures.AddRange(suite.Run());
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
