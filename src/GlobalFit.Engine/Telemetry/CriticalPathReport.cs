namespace GlobalFit.Engine.Telemetry;

/// <summary>Who held up one stage: the worker whose update finished last, and how long the others waited for it.</summary>
/// <param name="StageIndex">0-based stage index.</param>
/// <param name="WorkerCount">Worker updates in the stage.</param>
/// <param name="CriticalWorkerId">The worker that finished last (null for a stage without worker spans).</param>
/// <param name="CriticalWorkerWallMs">Its compute time (<c>globalfit.worker.wall_ms</c>, or its span length if absent).</param>
/// <param name="LeadMs">How much later it finished than the second-to-last; null with one worker.</param>
/// <param name="TotalWaitMs">Σ over the other workers of (last finish − their finish).</param>
/// <param name="MeanWaitMs">That sum over the number of other workers; null with one worker.</param>
/// <param name="SlowestWallMs">The largest compute time in the stage.</param>
/// <param name="LeastMs">The least the stage could take: the larger of its slowest worker's compute and its total compute
/// spread evenly over the compute threads.</param>
/// <param name="CriticalWorkerLabel">What the last worker covers in words (<c>globalfit.worker.label</c>: a band's
/// frequency range, a source's id), null when the file does not say.</param>
public sealed record StageCriticalPath(int StageIndex, int WorkerCount, string? CriticalWorkerId, double CriticalWorkerWallMs,
    double? LeadMs, double TotalWaitMs, double? MeanWaitMs, double SlowestWallMs, double LeastMs, string? CriticalWorkerLabel = null);

/// <summary>The critical path of one iteration.</summary>
/// <param name="Iteration">1-based iteration.</param>
/// <param name="TraceId">Trace id of its span (W3C hex).</param>
/// <param name="StartUtc">When it started.</param>
/// <param name="DurationMs">Its duration.</param>
/// <param name="Stages">Its stages by index.</param>
/// <param name="WorkerComputeMs">Σ compute time of all its worker updates.</param>
/// <param name="OverheadMs">Orchestration overhead: duration − Σ over stages of the least time the stage could take
/// (<see cref="StageCriticalPath.LeastMs"/>): residual updates, messaging, catalogue appends, checkpoints and imperfect
/// scheduling — what a perfect scheduler of the same compute would save.</param>
/// <param name="OverheadFractionOfCompute">Overhead / total worker compute; null when no compute was recorded.</param>
/// <param name="Breakdown">Where the compute of the worker updates that measure their parts went (galactic-binary band
/// workers do); null when none did.</param>
public sealed record IterationCriticalPath(long Iteration, string TraceId, DateTimeOffset StartUtc, double DurationMs,
    IReadOnlyList<StageCriticalPath> Stages, double WorkerComputeMs, double OverheadMs, double? OverheadFractionOfCompute,
    WorkerTimeBreakdown? Breakdown = null);

/// <summary>How often a worker was the last of its stage.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="Stages">Stages (over all iterations analysed) in which it finished last.</param>
/// <param name="Label">What it covers in words, null when the file does not say.</param>
public sealed record CriticalWorkerCount(string WorkerId, int Stages, string? Label = null);

/// <summary>Figures over the iterations analysed.</summary>
/// <param name="IterationCount">Iterations analysed.</param>
/// <param name="MostOftenCritical">Workers by how often they finished last in their stage (most first, ties by id).</param>
/// <param name="MeanIterationMs">Mean iteration duration; null without iterations.</param>
/// <param name="MeanOverheadMs">Mean orchestration overhead; null without iterations.</param>
/// <param name="MeanOverheadPercentOfIteration">Mean of overhead / duration, in percent; null without iterations.</param>
/// <param name="MeanOverheadPercentOfCompute">Mean of overhead / total worker compute, in percent, over the iterations that
/// recorded compute; null if none did.</param>
/// <param name="Breakdown">The iterations' breakdowns summed; null when none had one.</param>
public sealed record CriticalPathSummary(int IterationCount, IReadOnlyList<CriticalWorkerCount> MostOftenCritical, double? MeanIterationMs,
    double? MeanOverheadMs, double? MeanOverheadPercentOfIteration, double? MeanOverheadPercentOfCompute, WorkerTimeBreakdown? Breakdown = null);

/// <summary>The critical-path analysis of a telemetry file.</summary>
/// <param name="TelemetryPath">The file read.</param>
/// <param name="Iterations">The iterations analysed, by start time.</param>
/// <param name="Summary">Figures over them.</param>
public sealed record CriticalPathReport(string TelemetryPath, IReadOnlyList<IterationCriticalPath> Iterations, CriticalPathSummary Summary);
