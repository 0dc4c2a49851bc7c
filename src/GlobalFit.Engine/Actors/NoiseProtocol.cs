using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.NoiseFitting;

namespace GlobalFit.Engine.Actors;

/// <summary>Sets the noise actor's worker: restored from <paramref name="State"/>, or fresh when it is null.</summary>
/// <param name="State">The committed state, or null.</param>
public sealed record LoadNoise(byte[]? State);

/// <summary>Asks the noise worker to refit the PSD on the full residual.</summary>
/// <param name="Iteration">Global-fit iteration.</param>
/// <param name="StageIndex">Stage within the iteration.</param>
/// <param name="Residual">Data minus every template over the noise worker's band.</param>
/// <param name="Steps">Sampler steps.</param>
/// <param name="SentTimestamp">Stopwatch timestamp of the request.</param>
/// <param name="TraceParent">W3C traceparent of the stage span, or null.</param>
public sealed record UpdateNoise(long Iteration, int StageIndex, NoiseResidual Residual, int Steps, long SentTimestamp, string? TraceParent);

/// <summary>The noise worker's reply.</summary>
/// <param name="Samples">Its samples of the update.</param>
/// <param name="Statistics">Counters and timing.</param>
/// <param name="Psd">The new inverse PSDs over all bins.</param>
/// <param name="State">Its state after the update.</param>
/// <param name="FinishedTimestamp">Stopwatch timestamp when it finished.</param>
public sealed record NoiseUpdated(SampleBlock Samples, WorkerStatistics Statistics, InversePsd Psd, byte[] State, long FinishedTimestamp);
