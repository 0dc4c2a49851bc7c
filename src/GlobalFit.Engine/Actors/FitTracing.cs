using System.Diagnostics;
using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Engine.Actors;

/// <summary>How the actors use <see cref="FitTelemetry"/>: the stage span's context crosses actor messages as a W3C
/// traceparent string, and a stage's waits are recorded when its last worker has answered.</summary>
internal static class FitTracing
{
    public static Activity? StartStage(Activity? iteration, long iterationNumber, int stageIndex, IReadOnlyList<string> groups) =>
        FitTelemetry.StartStage(iteration?.Context ?? default, iterationNumber, stageIndex, groups);

    public static Activity? StartWorkerSpan(string? traceParent, long iteration, int stageIndex, string workerId, string classId, string label)
    {
        if (traceParent is null || !ActivityContext.TryParse(traceParent, null, out var parent)) return null;
        return FitTelemetry.StartWorkerUpdate(parent, iteration, stageIndex, workerId, classId, label);
    }

    // A worker's wait is how long its result sat idle until the slowest worker of its stage finished.
    public static void RecordStageWaits(IReadOnlyDictionary<string, double> computeMs)
    {
        if (computeMs.Count == 0) return;
        double slowest = computeMs.Values.Max();
        foreach (var (id, ms) in computeMs)
            FitTelemetry.WorkerWait.Record(slowest - ms, new KeyValuePair<string, object?>(FitTelemetry.WorkerIdAttribute, id));
    }
}
