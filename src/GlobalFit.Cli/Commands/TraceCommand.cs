using System.CommandLine;
using System.Globalization;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Telemetry;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit trace RUN</c>: per iteration, which worker each stage waited for, by how much, and how much of
/// the iteration was orchestration rather than compute; read from <c>RUN/telemetry.jsonl</c>. Each worker's id comes
/// with what it covers (a band's frequency range, a source's id), and stages are numbered from 1 like iterations.</summary>
public static class TraceCommand
{
    /// <summary>How many of the most often critical workers the text summary lists (JSON lists all).</summary>
    public const int TextSummaryWorkers = 5;

    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "Run folder (holding telemetry.jsonl)" };
        var json = new Option<bool>("--json") { Description = "Print the analysis as JSON" };
        var last = new Option<int?>("--last") { Description = "Show only the last N iterations (the summary covers them too)" };
        var command = new Command("trace", "Show the critical path of each iteration: which worker finished last in each stage, by how much, and how long the others waited")
        {
            run, json, last,
        };
        command.SetAction(parse => Run(context, parse.GetValue(run)!, parse.GetValue(json), parse.GetValue(last)));
        return command;
    }

    private static int Run(CliContext context, string runFolder, bool json, int? last)
    {
        if (last is < 1) throw new InvalidInputException("--last", null, $"must be at least 1, got {last}");
        if (!Directory.Exists(runFolder)) throw new InvalidInputException(runFolder, null, "run folder does not exist");
        string path = new RunFolderLayout(Path.GetFullPath(runFolder)).TelemetryFile;
        if (!File.Exists(path))
            throw new InvalidInputException(path, null, "telemetry file does not exist: the run has not finished an iteration yet, or is not a run folder");
        var report = CriticalPathAnalysis.Read(path, last);
        if (json) context.Out.WriteLine(CliJson.Serialize(TraceJson.From(report)));
        else WriteText(context.Out, report);
        return ExitCodes.Success;
    }

    private static void WriteText(TextWriter o, CriticalPathReport report)
    {
        string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
        o.WriteLine($"telemetry     {report.TelemetryPath}");
        if (report.Iterations.Count == 0)
        {
            o.WriteLine("iterations    none finished yet");
            return;
        }
        foreach (var i in report.Iterations)
        {
            string share = i.OverheadFractionOfCompute is double f ? I($" ({100 * f:F1} % of {i.WorkerComputeMs:F1} ms worker compute)") : "";
            o.WriteLine(I($"iteration {i.Iteration}   {i.DurationMs:F1} ms, orchestration overhead {i.OverheadMs:F1} ms{share}"));
            if (i.Breakdown is { } b)
                o.WriteLine(I($"  kernel      {b.KernelMs:F1} ms of {b.ComputeMs:F1} ms compute in {b.Updates} measured update(s): efficiency {100 * b.Efficiency:F1} %"));
            foreach (var s in i.Stages)
            {
                if (s.CriticalWorkerId is null)
                {
                    o.WriteLine(I($"  stage {s.StageIndex + 1}   no worker updates recorded"));
                    continue;
                }
                string others = s.LeadMs is not double lead ? ", the only worker"
                    : s.WorkerCount == 2 ? I($", {lead:F1} ms after the other, which waited {s.TotalWaitMs:F1} ms")
                    : I($", {lead:F1} ms after the next; {s.WorkerCount - 1} others waited {s.TotalWaitMs:F1} ms in total ({s.MeanWaitMs:F1} ms each)");
                o.WriteLine(I($"  stage {s.StageIndex + 1}   last: {Named(s.CriticalWorkerId, s.CriticalWorkerLabel)} (compute {s.CriticalWorkerWallMs:F1} ms){others}"));
            }
        }
        var m = report.Summary;
        o.WriteLine(I($"summary       {m.IterationCount} iterations, mean {m.MeanIterationMs:F1} ms, mean overhead {m.MeanOverheadMs:F1} ms = {m.MeanOverheadPercentOfIteration:F1} % of the iteration")
            + (m.MeanOverheadPercentOfCompute is double c ? I($", {c:F1} % of worker compute") : ""));
        foreach (var w in m.MostOftenCritical.Take(TextSummaryWorkers))
            o.WriteLine(I($"  last in {w.Stages,4} stage(s)   {Named(w.WorkerId, w.Label)}"));
        if (m.Breakdown is { } total) WriteBreakdown(o, total);
    }

    // Where the measured updates' compute went, part by part, largest first; the kernel's share is the efficiency.
    private static void WriteBreakdown(TextWriter o, WorkerTimeBreakdown b)
    {
        string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
        o.WriteLine(I($"worker time   {b.Updates} measured update(s), {b.ComputeMs:F1} ms compute; kernel (template + likelihood) {b.KernelMs:F1} ms = efficiency {100 * b.Efficiency:F1} %"));
        foreach (var p in b.Phases.Where(p => p.Milliseconds > 0 || p.Count > 0).OrderByDescending(p => p.Milliseconds))
        {
            double share = b.ComputeMs > 0 ? 100 * p.Milliseconds / b.ComputeMs : 0;
            string each = p.Count > 0 ? I($", {p.Count} × {1000 * p.Milliseconds / p.Count:F2} µs") : "";
            o.WriteLine(I($"  {p.Name,-20} {p.Milliseconds,10:F1} ms {share,5:F1} %{each}"));
        }
        double state = b.ComputeMs > 0 ? 100 * b.StateMs / b.ComputeMs : 0;
        o.WriteLine(I($"  {"state_serialisation",-20} {b.StateMs,10:F1} ms {state,5:F1} %"));
    }

    // The opaque id with what the worker covers beside it: "galactic_binaries/0003 [2.9700-3.0086 mHz]".
    private static string Named(string id, string? label) => label is null || label == id ? id : $"{id} [{label}]";
}
