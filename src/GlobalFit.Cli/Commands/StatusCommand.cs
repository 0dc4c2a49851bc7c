using System.Collections.Immutable;
using System.CommandLine;
using System.Globalization;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit status RUN</c>: whether a fit is running, how far it got, its last checkpoint, what its
/// catalogue store holds and which workers were slowest.</summary>
public static class StatusCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "The run folder" };
        var json = new Option<bool>("--json") { Description = "Print JSON instead of text" };
        var command = new Command("status", "Show where a fit stands (running or stopped)") { run, json };
        command.SetAction(parse => Run(context, parse.GetValue(run)!, parse.GetValue(json)));
        return command;
    }

    private static int Run(CliContext context, string runFolder, bool json)
    {
        var layout = RunFolderLayout.OpenExisting(runFolder);
        var status = RunStatus.Read(layout) ?? throw new InvalidInputException(layout.StatusFile, null, "missing: the run never started");
        bool alive = RunLock.IsHeld(layout);
        string state = alive ? "running" : status.State == "running" ? "stopped (the process ended without finishing; resume it)" : status.State;
        // Per class: a run may hold thousands of band workers.
        var samples = new SampleStore(layout.Root).CountSamples()
            .GroupBy(w => w.Key.Split('/')[0], StringComparer.Ordinal)
            .ToImmutableSortedDictionary(g => g.Key, g => g.Sum(w => w.Value), StringComparer.Ordinal);
        if (json)
        {
            context.Out.WriteLine((status with
            {
                State = alive ? "running" : status.State == "running" ? "stopped" : status.State,
                Run = layout.Root,
                SamplesStored = samples,
            }).ToJson());
            return ExitCodes.Success;
        }
        var o = context.Out;
        o.WriteLine($"run        {layout.Root}");
        o.WriteLine($"state      {state}");
        o.WriteLine(string.Create(CultureInfo.InvariantCulture, $"iteration  {status.Iteration}/{status.TotalIterations} (last iteration {status.LastIterationSeconds:F2} s; updated {UtcText.Format(status.UpdatedUtc)})"));
        o.WriteLine($"checkpoint iteration {status.CheckpointIteration}");
        o.WriteLine($"sources    {string.Join(", ", status.SourcesPerClass.Select(c => $"{c.Key} {c.Value}"))}");
        o.WriteLine($"stored     {string.Join(", ", samples.Select(c => $"{c.Key} {c.Value} samples"))}");
        if (status.SlowestWorkers.Length > 0)
            o.WriteLine($"slowest    {string.Join(", ", status.SlowestWorkers.OrderByDescending(s => s.ComputeMs).Select(s => string.Create(CultureInfo.InvariantCulture, $"{s.WorkerId} {s.ComputeMs:F0} ms")))}");
        if (status.Message.Length > 0) o.WriteLine($"message    {status.Message}");
        return ExitCodes.Success;
    }
}
