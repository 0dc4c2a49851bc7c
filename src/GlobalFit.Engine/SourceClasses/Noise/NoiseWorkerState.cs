using GlobalFit.Inference.State;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>Everything a <see cref="NoiseWorker"/> needs to continue bit for bit.</summary>
/// <param name="ParameterNames">The sampled columns, checked on restore against the settings.</param>
/// <param name="Updates">Updates run.</param>
/// <param name="RunSeed">The run seed the worker was created with.</param>
/// <param name="Sampler">The parallel-tempering state, or null before the first fitting update (and always when
/// <c>fit_levels</c> is false).</param>
[MessagePackObject]
public sealed record NoiseWorkerState(
    [property: Key(0)] string[] ParameterNames,
    [property: Key(1)] long Updates,
    [property: Key(2)] ulong RunSeed,
    [property: Key(3)] ParallelTemperingState? Sampler);
