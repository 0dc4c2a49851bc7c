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
}
