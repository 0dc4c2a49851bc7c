using MessagePack;

namespace GlobalFit.Inference.Proposals;

/// <summary>A proposal's checkpoint as plain arrays of reals and integers, so any proposal (including
/// class-supplied ones) can be stored in the sampler state without extra formatter registrations.</summary>
/// <param name="Reals">The real-valued part of the state (layout private to the proposal).</param>
/// <param name="Integers">The integer part of the state (layout private to the proposal).</param>
[MessagePackObject]
public sealed record ProposalState(
    [property: Key(0)] double[] Reals,
    [property: Key(1)] long[] Integers);
