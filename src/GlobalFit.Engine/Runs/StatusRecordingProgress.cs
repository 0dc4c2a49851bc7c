using System.Collections.Immutable;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Runs;

/// <summary>Passes progress on and keeps <c>RUN/status.json</c> up to date.</summary>
internal sealed class StatusRecordingProgress(IFitProgress inner, RunFolderLayout layout, long checkpointIteration) : IFitProgress
{
    private IterationReport? _last;
    private long _checkpointIteration = checkpointIteration;

    public void IterationCompleted(IterationReport report)
    {
        _last = report;
        if (report.Checkpointed) _checkpointIteration = report.Iteration;
        WriteState("running", report.Iteration, report.TotalIterations, "");
        inner.IterationCompleted(report);
    }

    public void Warning(string message) => inner.Warning(message);

    public void Note(string message) => inner.Note(message);

    public void WriteState(string state, long iteration, long total, string message, long? checkpointIteration = null)
    {
        if (checkpointIteration is { } c) _checkpointIteration = c;
        new RunStatus
        {
            State = state,
            Run = layout.Root,
            ProcessId = Environment.ProcessId,
            Iteration = iteration,
            TotalIterations = total,
            CheckpointIteration = _checkpointIteration,
            UpdatedUtc = DateTimeOffset.UtcNow,
            LastIterationSeconds = _last?.WallTime.TotalSeconds ?? 0,
            SourcesPerClass = _last?.SourcesPerClass ?? ImmutableSortedDictionary<string, int>.Empty,
            SlowestWorkers = _last is null ? [] : [.. _last.SlowestWorkers.Select(s => new SlowWorker(s.WorkerId, Math.Round(s.ComputeMs, 1)))
                .OrderByDescending(s => s.ComputeMs).ThenBy(s => s.WorkerId, StringComparer.Ordinal)],
            Message = message,
        }.Write(layout);
    }
}
