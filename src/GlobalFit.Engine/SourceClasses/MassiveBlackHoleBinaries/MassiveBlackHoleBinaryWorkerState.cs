using GlobalFit.Inference.State;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Everything a <see cref="MassiveBlackHoleBinaryFitWorker"/> needs to continue bit for bit.</summary>
/// <param name="RunSeed">The run seed the worker was created with.</param>
/// <param name="Updates">Updates run.</param>
/// <param name="Reference">The heterodyne reference (eleven parameters in column order), null before the search.</param>
/// <param name="SearchStatistic">The search's maximised ln Λ at the seed (NaN before the search).</param>
/// <param name="Recentres">Times the reference was moved after the search.</param>
/// <param name="Sampler">The parallel-tempering state, null before the first update.</param>
/// <param name="Restarts">Times a repeated search restarted the chains.</param>
[MessagePackObject]
public sealed record MassiveBlackHoleBinaryWorkerState(
    [property: Key(0)] ulong RunSeed,
    [property: Key(1)] long Updates,
    [property: Key(2)] double[]? Reference,
    [property: Key(3)] double SearchStatistic,
    [property: Key(4)] int Recentres,
    [property: Key(5)] ParallelTemperingState? Sampler,
    [property: Key(6)] int Restarts = 0);
