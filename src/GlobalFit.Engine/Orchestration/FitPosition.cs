using System.Collections.Immutable;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>Where a run stands at an iteration boundary: what a checkpoint holds and a resume starts from.</summary>
/// <param name="Iteration">Iterations completed.</param>
/// <param name="CheckpointIteration">Iteration of the newest checkpoint on disk (0 for none).</param>
/// <param name="WorkerStates">Committed state per worker id (null: never ran).</param>
/// <param name="Templates">Current template per source worker id (noise workers hold none).</param>
public sealed record FitPosition(long Iteration, long CheckpointIteration, ImmutableSortedDictionary<string, byte[]?> WorkerStates,
    ImmutableSortedDictionary<string, WindowSpectra> Templates)
{
    /// <summary>Before the first iteration: no worker has state and every template is zero.</summary>
    /// <param name="workers">Every worker of the run.</param>
    public static FitPosition Fresh(IEnumerable<WorkerDescriptor> workers)
    {
        ArgumentNullException.ThrowIfNull(workers);
        var list = workers.ToList();
        return new FitPosition(0, 0,
            list.ToImmutableSortedDictionary(w => w.Id, _ => (byte[]?)null, StringComparer.Ordinal),
            list.Where(w => w.Role == WorkerRole.Sources).ToImmutableSortedDictionary(w => w.Id, w => WindowSpectra.Zero(w.Bins, w.IncludesT), StringComparer.Ordinal));
    }

    /// <summary>Where the run stands according to <paramref name="checkpoint"/>.</summary>
    public static FitPosition From(RunCheckpoint checkpoint)
    {
        ArgumentNullException.ThrowIfNull(checkpoint);
        return new(checkpoint.Iteration, checkpoint.Iteration,
            checkpoint.Workers.ToImmutableSortedDictionary(w => w.WorkerId, w => w.State, StringComparer.Ordinal),
            checkpoint.Templates.ToImmutableSortedDictionary(t => t.WorkerId, t => t.ToSpectra(), StringComparer.Ordinal));
    }
}
