using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>How a fit ended.</summary>
/// <param name="Kind">Completed, interrupted or failed.</param>
/// <param name="IterationsCompleted">Iterations completed in total (including those before a resume).</param>
/// <param name="CheckpointIteration">Iteration of the newest checkpoint on disk (0 when none).</param>
/// <param name="Message">For a failure, which worker failed and how; otherwise empty.</param>
public sealed record FitOutcome(FitOutcomeKind Kind, long IterationsCompleted, long CheckpointIteration, string Message)
{
    /// <summary>For a completed run, the catalogue it wrote; otherwise empty.</summary>
    public ImmutableArray<CatalogueRecord> Catalogue { get; init; } = [];
}

/// <summary>How a fit ended.</summary>
public enum FitOutcomeKind
{
    /// <summary>All iterations ran.</summary>
    Completed,

    /// <summary>Stopped on request; resumable.</summary>
    Interrupted,

    /// <summary>A worker failed repeatedly; resumable from the last checkpoint once the cause is fixed.</summary>
    Failed,

    /// <summary>A checkpoint or the samples of an iteration could not be written (disk full, permission lost, I/O
    /// error); the last good checkpoint is kept and the run is resumable once the cause is fixed.</summary>
    WriteFailed,
}

/// <summary>The words <c>status</c> and <c>status.json</c> use for how a fit ended.</summary>
public static class FitOutcomeNames
{
    /// <summary>The state name of <paramref name="kind"/>: <c>completed</c>, <c>interrupted</c>, <c>failed</c> or
    /// <c>stopped (error)</c>.</summary>
    public static string StateName(this FitOutcomeKind kind) => kind switch
    {
        FitOutcomeKind.Completed => "completed",
        FitOutcomeKind.Interrupted => "interrupted",
        FitOutcomeKind.Failed => "failed",
        FitOutcomeKind.WriteFailed => "stopped (error)",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown outcome"),
    };
}
