using GlobalFit.Inference.State;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Everything an <see cref="InspiralWorker"/> needs to continue bit for bit.</summary>
/// <param name="RunSeed">The run seed the worker was created with.</param>
/// <param name="Updates">Updates run so far.</param>
/// <param name="Reference">The reference point y_ref of the sampling coordinates (unscaled), fixed at the first
/// update after the start search; null before it.</param>
/// <param name="Scales">The scales of the sampling coordinates; null before the first update.</param>
/// <param name="Current">The first cold chain's parameters (physical, in column order) at the end of the last update;
/// the start row before the first.</param>
/// <param name="Sampler">The parallel-tempering state; null before the first update.</param>
/// <param name="SearchStatistic">The semi-coherent statistic ρ²_sc of the start search's result, NaN before it or
/// without a search.</param>
/// <param name="BlindSignificance">The significance of the last blind search's candidate
/// (<see cref="InspiralBlindSearchResult.Significance"/>); NaN for a worker started from a row or before its first search.</param>
[MessagePackObject]
public sealed record InspiralWorkerState(
    [property: Key(0)] ulong RunSeed,
    [property: Key(1)] long Updates,
    [property: Key(2)] double[]? Reference,
    [property: Key(3)] double[]? Scales,
    [property: Key(4)] double[] Current,
    [property: Key(5)] ParallelTemperingState? Sampler,
    [property: Key(6)] double SearchStatistic,
    [property: Key(7)] double BlindSignificance = double.NaN);
