using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>The compute half of one worker of the global fit: a sampler over its own sources, run in blocks of steps
/// against the residual the engine serves it. Knows nothing about actors, threads or files.</summary>
/// <remarks>
/// <para>Contract the engine relies on for reproducibility: an update's result depends only on the worker's state,
/// the residual and the step count, and <see cref="SaveState"/> followed by
/// <see cref="IFitSourceClassPlan.RestoreWorker"/> gives a worker that continues bit for bit. Not thread-safe; the
/// engine never calls one worker from two threads.</para>
/// </remarks>
public interface IFitWorker
{
    /// <summary>Stable id, unique in the run (<c>class_id/label</c>); names its files and telemetry.</summary>
    string Id { get; }

    /// <summary>Bins the worker reads and whose template it writes.</summary>
    BinWindow Bins { get; }

    /// <summary>Whether the worker uses channel T.</summary>
    bool IncludesT { get; }

    /// <summary>Runs <paramref name="steps"/> sampler steps against <paramref name="residual"/>.</summary>
    /// <param name="residual">The residual over <see cref="Bins"/>.</param>
    /// <param name="steps">Steps, ≥ 1.</param>
    /// <returns>The new template, the samples and the statistics.</returns>
    WorkerUpdate Update(WorkerResidual residual, int steps);

    /// <summary>The template of the sources held now (zero before the first update); null for a worker that holds
    /// no template (<see cref="WorkerRole.Noise"/>).</summary>
    WindowSpectra? CurrentTemplate();

    /// <summary>The whole state, for checkpoints and restarts.</summary>
    byte[] SaveState();

    /// <summary>Removes and returns the sources that now belong to another worker of the class.</summary>
    IReadOnlyList<Handover> TakeHandovers();

    /// <summary>Takes over sources another worker handed on.</summary>
    /// <param name="handovers">Handovers addressed to this worker.</param>
    void Accept(IReadOnlyList<Handover> handovers);
}
