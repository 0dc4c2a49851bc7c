using System.Diagnostics;
using System.Diagnostics.Metrics;

namespace GlobalFit.Engine.Telemetry;

/// <summary>The names and instruments of the fit's telemetry: one span per iteration, a child per stage, a grandchild per
/// worker update, and histograms of iteration time, worker compute and worker wait (DEVELOPERS.md, "Data flow of one iteration").</summary>
/// <remarks>Span and attribute names are part of the <c>telemetry.jsonl</c> format that <c>globalfit trace</c> reads, so
/// they are constants here and nowhere else. Starting a span returns null when nobody listens (no
/// <see cref="TelemetrySession"/>), so callers use <c>?.</c>.</remarks>
public static class FitTelemetry
{
    /// <summary>Name of the activity source and of the meter.</summary>
    public const string SourceName = "GlobalFit.Engine";

    /// <summary>Span of one blocked-Gibbs iteration (a root span).</summary>
    public const string IterationSpan = "fit.iteration";

    /// <summary>Span of one stage, child of the iteration.</summary>
    public const string StageSpan = "fit.stage";

    /// <summary>Span of one worker update, child of its stage: from the request to the reply.</summary>
    public const string WorkerUpdateSpan = "fit.worker_update";

    /// <summary>The 1-based iteration (on all three spans).</summary>
    public const string IterationAttribute = "globalfit.iteration";

    /// <summary>The 0-based stage index in the schedule (stage and worker spans).</summary>
    public const string StageIndexAttribute = "globalfit.stage.index";

    /// <summary>The worker-group names of the stage (text list).</summary>
    public const string StageGroupsAttribute = "globalfit.stage.groups";

    /// <summary>The worker id, <c>class_id/label</c>.</summary>
    public const string WorkerIdAttribute = "globalfit.worker.id";

    /// <summary>The worker's source class.</summary>
    public const string WorkerClassAttribute = "globalfit.worker.class";

    /// <summary>A human label of what the worker covers, e.g. its band edges.</summary>
    public const string WorkerLabelAttribute = "globalfit.worker.label";

    /// <summary>Sources held after the update.</summary>
    public const string WorkerSourcesAttribute = "globalfit.worker.sources";

    /// <summary>Sampler steps taken in the update.</summary>
    public const string WorkerStepsAttribute = "globalfit.worker.steps";

    /// <summary>Acceptance rate of the update's proposals, in [0, 1].</summary>
    public const string WorkerAcceptanceAttribute = "globalfit.worker.acceptance";

    /// <summary>Compute time of the update in milliseconds (excluding queueing and messaging).</summary>
    public const string WorkerWallMsAttribute = "globalfit.worker.wall_ms";

    /// <summary>Prefix of the time-breakdown attributes of a worker update: <c>globalfit.worker.phase.NAME_ms</c> (time in the
    /// part) and <c>globalfit.worker.phase.NAME_count</c> (how often it ran), for each part the worker measures.</summary>
    public const string WorkerPhaseAttributePrefix = "globalfit.worker.phase.";

    /// <summary>Milliseconds of the update spent in the template + log-likelihood kernel (the sum of the kernel parts of the
    /// breakdown); over <see cref="WorkerWallMsAttribute"/> it is the worker's efficiency.</summary>
    public const string WorkerKernelMsAttribute = "globalfit.worker.kernel_ms";

    /// <summary>Milliseconds spent serialising the worker's state after the update (included in the compute time).</summary>
    public const string WorkerStateMsAttribute = "globalfit.worker.state_ms";

    /// <summary>Threads of the compute dispatcher (iteration span): a stage cannot take less than its total compute
    /// divided by this.</summary>
    public const string ThreadsAttribute = "globalfit.threads";

    /// <summary>Milliseconds from the request being sent to the worker starting on it.</summary>
    public const string WorkerQueueMsAttribute = "globalfit.worker.queue_ms";

    /// <summary>Histogram name: iteration duration, ms.</summary>
    public const string IterationDurationMetric = "globalfit.iteration.duration";

    /// <summary>Histogram name: worker compute per update, ms, tagged with <see cref="WorkerIdAttribute"/>.</summary>
    public const string WorkerComputeMetric = "globalfit.worker.compute";

    /// <summary>Histogram name: ms a worker's result waited for the slowest worker of its stage, tagged with
    /// <see cref="WorkerIdAttribute"/>.</summary>
    public const string WorkerWaitMetric = "globalfit.worker.wait";

    // Iterations take milliseconds (tests) to many minutes (a year of data), so buckets span 1 ms to 30 min roughly
    // evenly in log; the SDK's default buckets stop at 10 s.
    private static readonly double[] MillisecondBuckets =
        [1, 2, 5, 10, 20, 50, 100, 200, 500, 1_000, 2_000, 5_000, 10_000, 20_000, 60_000, 120_000, 300_000, 600_000, 1_800_000];

    /// <summary>The source of every fit span.</summary>
    public static ActivitySource Source { get; } = new(SourceName);

    /// <summary>The meter of every fit metric.</summary>
    public static Meter Meter { get; } = new(SourceName);

    /// <summary>Iteration duration, ms.</summary>
    public static Histogram<double> IterationDuration { get; } = Milliseconds(IterationDurationMetric, "Duration of one blocked-Gibbs iteration");

    /// <summary>Worker compute per update, ms (tag: worker id).</summary>
    public static Histogram<double> WorkerCompute { get; } = Milliseconds(WorkerComputeMetric, "Compute time of one worker update");

    /// <summary>Wait of a worker's result for the slowest worker of its stage, ms (tag: worker id).</summary>
    public static Histogram<double> WorkerWait { get; } = Milliseconds(WorkerWaitMetric, "Time a finished worker waited for the slowest worker of its stage");

    /// <summary>Starts the root span of an iteration.</summary>
    /// <param name="iteration">1-based iteration.</param>
    /// <returns>The span, or null when nobody listens.</returns>
    /// <param name="threads">Threads of the compute dispatcher.</param>
    public static Activity? StartIteration(long iteration, int threads) =>
        Source.StartActivity(IterationSpan, ActivityKind.Internal, parentContext: default, tags: [new(IterationAttribute, iteration), new(ThreadsAttribute, threads)]);

    /// <summary>Starts a stage span under <paramref name="iteration"/>'s span.</summary>
    /// <param name="parent">The iteration span's context.</param>
    /// <param name="iteration">1-based iteration.</param>
    /// <param name="stageIndex">0-based stage index.</param>
    /// <param name="groups">The worker-group names run in the stage.</param>
    /// <returns>The span, or null when nobody listens.</returns>
    public static Activity? StartStage(ActivityContext parent, long iteration, int stageIndex, IReadOnlyList<string> groups) =>
        groups is null ? throw new ArgumentNullException(nameof(groups)) : Source.StartActivity(StageSpan, ActivityKind.Internal, parent,
            [new(IterationAttribute, iteration), new(StageIndexAttribute, stageIndex), new(StageGroupsAttribute, groups.ToArray())]);

    /// <summary>Starts a worker-update span under its stage span; call it when the request is sent.</summary>
    /// <param name="parent">The stage span's context (rebuilt with <see cref="ActivityContext.TryParse(string, string, out ActivityContext)"/>
    /// across actor messages).</param>
    /// <param name="iteration">1-based iteration.</param>
    /// <param name="stageIndex">0-based stage index.</param>
    /// <param name="workerId">The worker.</param>
    /// <param name="classId">Its class.</param>
    /// <param name="label">What it covers, e.g. band edges.</param>
    /// <returns>The span, or null when nobody listens.</returns>
    public static Activity? StartWorkerUpdate(ActivityContext parent, long iteration, int stageIndex, string workerId, string classId, string label) =>
        Source.StartActivity(WorkerUpdateSpan, ActivityKind.Internal, parent,
        [
            new(IterationAttribute, iteration), new(StageIndexAttribute, stageIndex), new(WorkerIdAttribute, workerId),
            new(WorkerClassAttribute, classId), new(WorkerLabelAttribute, label),
        ]);

    /// <summary>Adds a finished update's figures to its span (if any) and records its compute time.</summary>
    /// <param name="span">The worker-update span, or null.</param>
    /// <param name="workerId">The worker.</param>
    /// <param name="sources">Sources held after the update.</param>
    /// <param name="steps">Sampler steps taken.</param>
    /// <param name="acceptance">Acceptance rate.</param>
    /// <param name="wallMs">Compute time, ms.</param>
    /// <param name="queueMs">Time from request to start, ms.</param>
    public static void RecordWorkerResult(Activity? span, string workerId, int sources, long steps, double acceptance, double wallMs, double queueMs)
    {
        span?.SetTag(WorkerSourcesAttribute, sources)
            .SetTag(WorkerStepsAttribute, steps)
            .SetTag(WorkerAcceptanceAttribute, acceptance)
            .SetTag(WorkerWallMsAttribute, wallMs)
            .SetTag(WorkerQueueMsAttribute, queueMs);
        WorkerCompute.Record(wallMs, new KeyValuePair<string, object?>(WorkerIdAttribute, workerId));
    }

    /// <summary>Adds an update's time breakdown to its span (if any): one <c>_ms</c> and one <c>_count</c> attribute per
    /// part under <see cref="WorkerPhaseAttributePrefix"/>, the kernel total and the state serialisation time.</summary>
    /// <param name="span">The worker-update span, or null.</param>
    /// <param name="phases">The parts (may be empty): snake_case name, milliseconds, count, and whether the part belongs to
    /// the kernel.</param>
    /// <param name="stateMs">Time spent serialising the state, ms.</param>
    public static void RecordWorkerPhases(Activity? span, IReadOnlyList<(string Name, double Milliseconds, long Count, bool IsKernel)> phases, double stateMs)
    {
        ArgumentNullException.ThrowIfNull(phases);
        if (span is null) return;
        span.SetTag(WorkerStateMsAttribute, stateMs);
        if (phases.Count == 0) return;
        double kernel = 0;
        foreach (var phase in phases)
        {
            span.SetTag(WorkerPhaseAttributePrefix + phase.Name + "_ms", phase.Milliseconds);
            span.SetTag(WorkerPhaseAttributePrefix + phase.Name + "_count", phase.Count);
            if (phase.IsKernel) kernel += phase.Milliseconds;
        }
        span.SetTag(WorkerKernelMsAttribute, kernel);
    }

    /// <summary>Records a worker failure as a span of its own (<c>fit.worker_failure</c>) carrying the exception, stack
    /// trace included, so that it reaches the telemetry file and any collector rather than the terminal.</summary>
    /// <param name="workerId">The worker.</param>
    /// <param name="error">What it threw.</param>
    public static void RecordWorkerFailure(string workerId, Exception error)
    {
        using var span = Source.StartActivity("fit.worker_failure");
        span?.SetTag(WorkerIdAttribute, workerId);
        span?.AddException(error);
    }

    private static Histogram<double> Milliseconds(string name, string description) =>
        Meter.CreateHistogram(name, "ms", description, tags: null, new InstrumentAdvice<double> { HistogramBucketBoundaries = MillisecondBuckets });
}
