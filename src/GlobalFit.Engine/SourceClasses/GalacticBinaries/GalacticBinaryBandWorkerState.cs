using GlobalFit.Inference.State;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Everything a <see cref="GalacticBinaryBandWorker"/> needs to continue bit for bit.</summary>
/// <param name="WindowIndex">The window, checked on restore.</param>
/// <param name="SnrScale">s fixed at the first update (0 before it).</param>
/// <param name="Updates">Updates run.</param>
/// <param name="Seed">The run seed the worker was created with.</param>
/// <param name="Sampler">The reversible-jump sampler state (chains, random streams, proposal adaptation), or null
/// before the first update.</param>
[MessagePackObject]
public sealed record GalacticBinaryBandWorkerState(
    [property: Key(0)] int WindowIndex,
    [property: Key(1)] double SnrScale,
    [property: Key(2)] long Updates,
    [property: Key(3)] ulong Seed,
    [property: Key(4)] ReversibleJumpState? Sampler);
