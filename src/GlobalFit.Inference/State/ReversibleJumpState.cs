using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using MessagePack;

namespace GlobalFit.Inference.State;

/// <summary>The complete state of a <see cref="Transdimensional.ReversibleJumpSampler{TModel}"/>; resuming from it
/// continues the run bit for bit.</summary>
/// <param name="Step">Steps taken.</param>
/// <param name="SourceDimension">Parameters per source d.</param>
/// <param name="MaxSources">Cap on sources.</param>
/// <param name="ChainsPerTemperature">Replicas per rung.</param>
/// <param name="InverseTemperatures">β per rung.</param>
/// <param name="LadderRounds">Swap rounds recorded.</param>
/// <param name="SwapsProposed">Swap attempts per neighbouring pair.</param>
/// <param name="SwapsAccepted">Accepted swaps per neighbouring pair.</param>
/// <param name="SourceCounts">k per chain.</param>
/// <param name="Sources">Per chain: MaxSources × d buffer whose first k·d values are the sources.</param>
/// <param name="LogLikelihoods">ln L per chain.</param>
/// <param name="LogPriors">ln prior per chain.</param>
/// <param name="ChainRandom">Random stream per chain.</param>
/// <param name="SwapRandom">Random stream of the swap moves.</param>
/// <param name="ProposalStates">Per chain, per within-model proposal: checkpoint of stateful proposals, null otherwise.</param>
/// <param name="ProposalsProposed">Per chain and proposal: attempts.</param>
/// <param name="ProposalsAccepted">Per chain and proposal: acceptances.</param>
/// <param name="JumpCounters">Per chain: births proposed, births accepted, deaths proposed, deaths accepted, splits proposed,
/// splits accepted, merges proposed, merges accepted (states written before split/merge existed hold the first four only,
/// and still resume).</param>
/// <param name="EvidenceSums">Σ ln L per rung since the last evidence reset.</param>
/// <param name="EvidenceCounts">Number of terms per rung.</param>
[MessagePackObject]
public sealed record ReversibleJumpState(
    [property: Key(0)] long Step,
    [property: Key(1)] int SourceDimension,
    [property: Key(2)] int MaxSources,
    [property: Key(3)] int ChainsPerTemperature,
    [property: Key(4)] double[] InverseTemperatures,
    [property: Key(5)] long LadderRounds,
    [property: Key(6)] long[] SwapsProposed,
    [property: Key(7)] long[] SwapsAccepted,
    [property: Key(8)] int[] SourceCounts,
    [property: Key(9)] double[][] Sources,
    [property: Key(10)] double[] LogLikelihoods,
    [property: Key(11)] double[] LogPriors,
    [property: Key(12)] RandomStream[] ChainRandom,
    [property: Key(13)] RandomStream SwapRandom,
    [property: Key(14)] ProposalState?[][] ProposalStates,
    [property: Key(15)] long[] ProposalsProposed,
    [property: Key(16)] long[] ProposalsAccepted,
    [property: Key(17)] long[] JumpCounters,
    [property: Key(18)] double[] EvidenceSums,
    [property: Key(19)] long[] EvidenceCounts);
