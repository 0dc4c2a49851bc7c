using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The reply of one <see cref="NoiseWorker.Fit"/>.</summary>
/// <param name="Samples">Cold-chain samples of the update, one source per sample whose columns are the fitted levels
/// (class id <c>noise</c>; the iteration is left 0 for the engine to fill in).</param>
/// <param name="Statistics">Counters and timing (source count 0).</param>
/// <param name="Levels">The cold chain's levels at the end of the update: the PSD <see cref="NoiseWorker.FillPsd"/> now reports.</param>
public sealed record NoiseUpdate(SampleBlock Samples, WorkerStatistics Statistics, NoiseLevels Levels);
