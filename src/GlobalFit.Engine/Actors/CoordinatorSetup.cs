using Akka.Actor;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Engine.Actors;

/// <summary>What the fit coordinator starts from: the plan, where the run stands, and the actors it talks to.</summary>
/// <param name="Plan">The run plan.</param>
/// <param name="ConfigDigest">Digest of the resolved configuration, written into checkpoints.</param>
/// <param name="CompletedIterations">Iterations already completed (0 for a fresh run).</param>
/// <param name="CheckpointIteration">Iteration of the newest checkpoint on disk (0 for none).</param>
/// <param name="WorkerStates">Committed state per worker id (null: never ran).</param>
/// <param name="Templates">Current template per worker id.</param>
/// <param name="NoiseState">Committed noise-worker state, or null.</param>
/// <param name="Residual">The residual-data actor.</param>
/// <param name="Store">The catalogue-store actor.</param>
/// <param name="Checkpointer">The checkpointer actor.</param>
/// <param name="Progress">Receives progress.</param>
/// <param name="CreateWorker">Creates a worker fresh (null) or from state, by worker id.</param>
/// <param name="NoiseProps">Props of the noise actor.</param>
/// <param name="NoiseBins">The noise worker's band.</param>
/// <param name="NoiseSteps">Noise sampler steps per update.</param>
public sealed record CoordinatorSetup(
    RunPlan Plan,
    string ConfigDigest,
    long CompletedIterations,
    long CheckpointIteration,
    IReadOnlyDictionary<string, byte[]?> WorkerStates,
    IReadOnlyDictionary<string, WindowSpectra> Templates,
    byte[]? NoiseState,
    IActorRef Residual,
    IActorRef Store,
    IActorRef Checkpointer,
    IFitProgress Progress,
    Func<string, byte[]?, IFitWorker> CreateWorker,
    Props NoiseProps,
    Physics.Series.BinWindow NoiseBins,
    int NoiseSteps);
