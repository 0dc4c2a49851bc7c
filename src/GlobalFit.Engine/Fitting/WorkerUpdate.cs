namespace GlobalFit.Engine.Fitting;

/// <summary>The reply of one worker update: its new template, the samples it drew and what it did.</summary>
/// <param name="Template">The worker's current template over its window after the update; null for a worker that
/// holds none (<see cref="WorkerRole.Noise"/>).</param>
/// <param name="Samples">Its cold-chain samples of the update (the iteration number is filled in by the engine).</param>
/// <param name="Statistics">Counters and timing.</param>
/// <param name="Psd">The new inverse noise PSDs over every one-sided bin, from a <see cref="WorkerRole.Noise"/> worker;
/// null otherwise.</param>
public sealed record WorkerUpdate(WindowSpectra? Template, SampleBlock Samples, WorkerStatistics Statistics, InversePsd? Psd = null);
