using System.Diagnostics;

namespace GlobalFit.Engine.Actors;

/// <summary>The spans and metrics the actors emit (names and attributes in <c>Telemetry/FitTelemetry</c>).</summary>
internal static class FitTracing
{
    public static Activity? StartIteration(long iteration)
    {
        var span = Telemetry.FitTelemetry.Source.StartActivity(Telemetry.FitTelemetry.IterationSpan, ActivityKind.Internal, parentContext: default);
        span?.SetTag(Telemetry.FitTelemetry.IterationAttribute, iteration);
        return span;
    }

    public static Activity? StartStage(Activity? iteration, long iterationNumber, int stageIndex, IEnumerable<string> groups)
    {
        var span = Telemetry.FitTelemetry.Source.StartActivity(Telemetry.FitTelemetry.StageSpan, ActivityKind.Internal, iteration?.Context ?? default);
        span?.SetTag(Telemetry.FitTelemetry.IterationAttribute, iterationNumber);
        span?.SetTag(Telemetry.FitTelemetry.StageIndexAttribute, stageIndex);
        span?.SetTag(Telemetry.FitTelemetry.StageGroupsAttribute, string.Join(",", groups));
        return span;
    }

    public static Activity? StartWorkerSpan(string? traceParent)
    {
        if (traceParent is null || !ActivityContext.TryParse(traceParent, null, out var parent)) return null;
        return Telemetry.FitTelemetry.Source.StartActivity(Telemetry.FitTelemetry.WorkerUpdateSpan, ActivityKind.Internal, parent);
    }

    public static void RecordWorkerUpdate(Activity? span, long iteration, int stageIndex, string workerId, string classId, string label,
        int sources, int steps, double acceptance, double computeMs, double queueMs)
    {
        Telemetry.FitTelemetry.WorkerCompute.Record(computeMs, new KeyValuePair<string, object?>(Telemetry.FitTelemetry.WorkerIdAttribute, workerId));
        if (span is null) return;
        span.SetTag(Telemetry.FitTelemetry.IterationAttribute, iteration);
        span.SetTag(Telemetry.FitTelemetry.StageIndexAttribute, stageIndex);
        span.SetTag(Telemetry.FitTelemetry.WorkerIdAttribute, workerId);
        span.SetTag(Telemetry.FitTelemetry.WorkerClassAttribute, classId);
        span.SetTag(Telemetry.FitTelemetry.WorkerLabelAttribute, label);
        span.SetTag(Telemetry.FitTelemetry.WorkerSourcesAttribute, sources);
        span.SetTag(Telemetry.FitTelemetry.WorkerStepsAttribute, steps);
        span.SetTag(Telemetry.FitTelemetry.WorkerAcceptanceAttribute, Math.Round(acceptance, 4));
        span.SetTag(Telemetry.FitTelemetry.WorkerWallMsAttribute, Math.Round(computeMs, 3));
        span.SetTag(Telemetry.FitTelemetry.WorkerQueueMsAttribute, Math.Round(queueMs, 3));
    }

    // A worker's wait is how long its result sat idle until the slowest worker of its stage finished.
    public static void RecordStageWaits(IReadOnlyDictionary<string, double> computeMs)
    {
        if (computeMs.Count == 0) return;
        double slowest = computeMs.Values.Max();
        foreach (var (id, ms) in computeMs)
            Telemetry.FitTelemetry.WorkerWait.Record(slowest - ms, new KeyValuePair<string, object?>(Telemetry.FitTelemetry.WorkerIdAttribute, id));
    }

    public static void RecordIteration(double wallMs) => Telemetry.FitTelemetry.IterationDuration.Record(wallMs);
}
