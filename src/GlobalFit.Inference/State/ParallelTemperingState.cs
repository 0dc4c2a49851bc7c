using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using MessagePack;

namespace GlobalFit.Inference.State;

/// <summary>The complete state of a <see cref="Tempering.ParallelTemperingSampler{TModel}"/>; resuming from it
/// continues the run bit for bit.</summary>
/// <remarks>Chain c holds rung c / ChainsPerTemperature and replica c % ChainsPerTemperature. Arrays indexed
/// by (chain, proposal) are chain-major. Serialise with <see cref="SamplerStateSerializer"/>.</remarks>
/// <param name="Step">Steps taken.</param>
/// <param name="Dimension">Parameter dimension d.</param>
/// <param name="ChainsPerTemperature">Replicas per rung.</param>
/// <param name="InverseTemperatures">β per rung.</param>
/// <param name="LadderRounds">Swap rounds recorded (the ladder adaptation clock).</param>
/// <param name="SwapsProposed">Swap attempts per neighbouring pair.</param>
/// <param name="SwapsAccepted">Accepted swaps per neighbouring pair.</param>
/// <param name="Positions">Chain positions, chain-major (chains × d).</param>
/// <param name="LogLikelihoods">ln L per chain.</param>
/// <param name="LogPriors">ln p per chain.</param>
/// <param name="ChainRandom">Random stream per chain.</param>
/// <param name="SwapRandom">Random stream of the swap moves.</param>
/// <param name="ProposalStates">Per chain, per proposal: the checkpoint of stateful proposals, null otherwise.</param>
/// <param name="ProposalsProposed">Per chain and proposal: attempts.</param>
/// <param name="ProposalsAccepted">Per chain and proposal: acceptances.</param>
/// <param name="EvidenceSums">Σ ln L per rung since the last evidence reset.</param>
/// <param name="EvidenceCounts">Number of terms in <paramref name="EvidenceSums"/> per rung.</param>
[MessagePackObject]
public sealed record ParallelTemperingState(
    [property: Key(0)] long Step,
    [property: Key(1)] int Dimension,
    [property: Key(2)] int ChainsPerTemperature,
    [property: Key(3)] double[] InverseTemperatures,
    [property: Key(4)] long LadderRounds,
    [property: Key(5)] long[] SwapsProposed,
    [property: Key(6)] long[] SwapsAccepted,
    [property: Key(7)] double[] Positions,
    [property: Key(8)] double[] LogLikelihoods,
    [property: Key(9)] double[] LogPriors,
    [property: Key(10)] RandomStream[] ChainRandom,
    [property: Key(11)] RandomStream SwapRandom,
    [property: Key(12)] ProposalState?[][] ProposalStates,
    [property: Key(13)] long[] ProposalsProposed,
    [property: Key(14)] long[] ProposalsAccepted,
    [property: Key(15)] double[] EvidenceSums,
    [property: Key(16)] long[] EvidenceCounts);
