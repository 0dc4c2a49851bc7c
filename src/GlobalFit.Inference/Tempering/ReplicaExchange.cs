using System.Collections.Immutable;
using GlobalFit.Inference.Diagnostics;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Tempering;

/// <summary>Swaps the whole states of two chains; implemented by each tempered sampler for its own state layout.</summary>
internal interface IChainExchange
{
    /// <summary>Exchanges the states (positions or source lists, log likelihoods, log priors) of two chains.</summary>
    void Exchange(int first, int second);
}

/// <summary>The neighbour-swap round shared by the fixed-dimension and the reversible-jump tempered samplers.</summary>
/// <remarks>A swap between rungs i and i+1 (same replica) is accepted with probability
/// min(1, exp[(β_i − β_{i+1})(ln L_{i+1} − ln L_i)]) (Swendsen &amp; Wang 1986; Earl &amp; Deem 2005); pairs are
/// attempted from the hottest down, all from the one swap stream, so the outcome does not depend on how chains
/// are scheduled. Allocation-free.</remarks>
internal static class ReplicaExchange
{
    /// <summary>Runs one swap round, records it in the ladder (which may adapt), and updates each chain's β.</summary>
    public static void Round<TExchange>(
        TemperatureLadder ladder, ReadOnlySpan<double> logLikelihoods, int replicas, ref RandomStream swapRandom,
        int[] acceptedPerPair, ChainTemperature[] temperatures, TExchange chains)
        where TExchange : IChainExchange
    {
        ReadOnlySpan<double> betas = ladder.InverseTemperatures;
        Array.Clear(acceptedPerPair);
        for (int rung = ladder.Count - 2; rung >= 0; rung--)
        {
            double deltaBeta = betas[rung] - betas[rung + 1];
            for (int r = 0; r < replicas; r++)
            {
                int cold = rung * replicas + r;
                int hot = cold + replicas;
                if (MetropolisTest.Accepts(deltaBeta * (logLikelihoods[hot] - logLikelihoods[cold]), ref swapRandom))
                {
                    chains.Exchange(cold, hot);
                    acceptedPerPair[rung]++;
                }
            }
        }

        ladder.RecordRound(acceptedPerPair, replicas);
        for (int c = 0; c < temperatures.Length; c++)
        {
            temperatures[c].InverseTemperature = ladder.InverseTemperatures[c / replicas];
        }
    }

    /// <summary>Acceptance of each mixture proposal per rung, summed over the rung's replicas.</summary>
    public static void AddProposalAcceptance(
        ImmutableArray<ProposalAcceptance>.Builder into, int rung, int replicas,
        ProposalMixture[] mixtures, ImmutableArray<ProposalSpec> proposals)
    {
        for (int j = 0; j < proposals.Length; j++)
        {
            long proposed = 0, accepted = 0;
            for (int r = 0; r < replicas; r++)
            {
                proposed += mixtures[rung * replicas + r].Proposed[j];
                accepted += mixtures[rung * replicas + r].Accepted[j];
            }

            into.Add(new ProposalAcceptance(proposals[j].Name, rung, proposed, accepted));
        }
    }
}
