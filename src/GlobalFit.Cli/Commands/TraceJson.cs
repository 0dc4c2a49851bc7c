using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Cli.Commands;

/// <summary>The JSON shape of <c>globalfit trace --json</c> (snake_case keys, units in the names; null where a figure
/// does not exist, e.g. the lead of a stage with one worker). Stages are numbered from 1, as iterations are.</summary>
internal static class TraceJson
{
    public static Dictionary<string, object?> From(CriticalPathReport report) => new()
    {
        ["telemetry_file"] = report.TelemetryPath,
        ["iterations"] = report.Iterations.Select(i => new Dictionary<string, object?>
        {
            ["iteration"] = i.Iteration,
            ["trace_id"] = i.TraceId,
            ["start_utc"] = i.StartUtc,
            ["duration_ms"] = i.DurationMs,
            ["worker_compute_ms"] = i.WorkerComputeMs,
            ["overhead_ms"] = i.OverheadMs,
            ["overhead_fraction_of_compute"] = i.OverheadFractionOfCompute,
            ["worker_time"] = Breakdown(i.Breakdown),
            ["stages"] = i.Stages.Select(s => new Dictionary<string, object?>
            {
                ["stage"] = s.StageIndex + 1,
                ["workers"] = s.WorkerCount,
                ["last_worker"] = s.CriticalWorkerId,
                ["last_worker_label"] = s.CriticalWorkerLabel,
                ["last_worker_wall_ms"] = s.CriticalWorkerWallMs,
                ["lead_ms"] = s.LeadMs,
                ["others_total_wait_ms"] = s.TotalWaitMs,
                ["others_mean_wait_ms"] = s.MeanWaitMs,
                ["slowest_wall_ms"] = s.SlowestWallMs,
            }).ToArray(),
        }).ToArray(),
        ["summary"] = new Dictionary<string, object?>
        {
            ["iterations"] = report.Summary.IterationCount,
            ["mean_iteration_ms"] = report.Summary.MeanIterationMs,
            ["mean_overhead_ms"] = report.Summary.MeanOverheadMs,
            ["mean_overhead_percent_of_iteration"] = report.Summary.MeanOverheadPercentOfIteration,
            ["mean_overhead_percent_of_compute"] = report.Summary.MeanOverheadPercentOfCompute,
            ["worker_time"] = Breakdown(report.Summary.Breakdown),
            ["most_often_last"] = report.Summary.MostOftenCritical.Select(c => new Dictionary<string, object?>
            {
                ["worker"] = c.WorkerId,
                ["label"] = c.Label,
                ["stages"] = c.Stages,
            }).ToArray(),
        },
    };

    // Null when no worker update measured its parts.
    private static Dictionary<string, object?>? Breakdown(WorkerTimeBreakdown? b) => b is null ? null : new()
    {
        ["updates"] = b.Updates,
        ["compute_ms"] = b.ComputeMs,
        ["kernel_ms"] = b.KernelMs,
        ["state_serialisation_ms"] = b.StateMs,
        ["efficiency"] = b.Efficiency,
        ["phases"] = b.Phases.Select(p => new Dictionary<string, object?>
        {
            ["phase"] = p.Name,
            ["ms"] = p.Milliseconds,
            ["count"] = p.Count,
        }).ToArray(),
    };
}
