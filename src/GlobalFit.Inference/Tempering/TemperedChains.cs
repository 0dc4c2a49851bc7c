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

/// <summary>The tempering core shared by the fixed-dimension and the reversible-jump samplers: the ladder, each chain's
/// temperature, proposal mixture, random stream, ln L and ln prior, the swap stream, the evidence accumulators and the
/// bookkeeping at the end of every step. The samplers own only their state layout (positions or source lists) and
/// their moves.</summary>
/// <remarks>
/// <para>Chains are numbered rung-major: chain c sits on rung c / replicas. Chain c draws from
/// RandomStream.ForPath(seed, stream id, c) and its mixture from streams below the same path; the swaps draw from
/// (seed, stream id, 2⁶⁴ − 1), so results do not depend on how chains are scheduled.</para>
/// <para>Swaps: a swap between rungs i and i+1 (same replica) is accepted with probability
/// min(1, exp[(β_i − β_{i+1})(ln L_{i+1} − ln L_i)]) (Swendsen &amp; Wang 1986; Earl &amp; Deem 2005); pairs are
/// attempted from the hottest down every <see cref="TemperingSettings.SwapInterval"/> steps. Allocation-free per
/// step. Not thread-safe.</para>
/// </remarks>
internal sealed class TemperedChains
{
    private const ulong SwapStreamId = ulong.MaxValue;
    private readonly TemperingSettings _tempering;
    private readonly ImmutableArray<ProposalSpec> _proposals;
    private readonly int[] _acceptedPerPair;
    private RandomStream _swapRandom;

    /// <summary>Creates the chains' shared parts; each chain's mixture is built on the context <paramref name="contextOf"/>
    /// gives for its temperature.</summary>
    public TemperedChains(TemperingSettings tempering, ImmutableArray<ProposalSpec> proposals, ulong seed, ulong streamId,
        Func<ChainTemperature, ProposalContext> contextOf)
    {
        _tempering = tempering;
        _proposals = proposals;
        Replicas = tempering.ChainsPerTemperature;
        ChainCount = checked(tempering.TemperatureCount * Replicas);
        Ladder = new TemperatureLadder(tempering);
        LogLikelihoods = new double[ChainCount];
        LogPriors = new double[ChainCount];
        Random = new RandomStream[ChainCount];
        _acceptedPerPair = new int[Math.Max(Ladder.Count - 1, 0)];
        Evidence = new EvidenceAccumulator(Ladder.Count);
        Temperatures = new ChainTemperature[ChainCount];
        Mixtures = new ProposalMixture[ChainCount];
        _swapRandom = RandomStream.ForPath(seed, streamId, SwapStreamId);
        for (int c = 0; c < ChainCount; c++)
        {
            int rung = c / Replicas;
            Random[c] = RandomStream.ForPath(seed, streamId, (ulong)c);
            Temperatures[c] = new ChainTemperature(rung, Ladder.InverseTemperatures[rung]);
            Mixtures[c] = new ProposalMixture(proposals, contextOf(Temperatures[c]), seed, streamId, (ulong)c);
        }
    }

    /// <summary>Replicas per rung; chains 0 … Replicas − 1 are cold.</summary>
    public int Replicas { get; }

    /// <summary>Rungs × replicas.</summary>
    public int ChainCount { get; }

    /// <summary>The temperature ladder.</summary>
    public TemperatureLadder Ladder { get; }

    /// <summary>Each chain's β, shared with its proposals.</summary>
    public ChainTemperature[] Temperatures { get; }

    /// <summary>Each chain's proposal mixture.</summary>
    public ProposalMixture[] Mixtures { get; }

    /// <summary>Each chain's random stream (its moves and acceptance tests).</summary>
    public RandomStream[] Random { get; }

    /// <summary>ln L per chain.</summary>
    public double[] LogLikelihoods { get; }

    /// <summary>ln prior per chain.</summary>
    public double[] LogPriors { get; }

    /// <summary>⟨ln L⟩ per rung for thermodynamic integration.</summary>
    public EvidenceAccumulator Evidence { get; }

    /// <summary>Steps taken so far.</summary>
    public long Step { get; private set; }

    /// <summary>Ends a step in which every chain moved: counts it, runs a swap round when due (exchanging states through
    /// <paramref name="chains"/>), and adds every chain's ln L to its rung's evidence sum.</summary>
    public void EndStep<TExchange>(TExchange chains)
        where TExchange : IChainExchange
    {
        Step++;
        if (Ladder.Count > 1 && Step % _tempering.SwapInterval == 0) SwapRound(chains);
        for (int c = 0; c < ChainCount; c++) Evidence.Add(c / Replicas, LogLikelihoods[c]);
    }

    /// <summary>Thermodynamic-integration evidence from ⟨ln L⟩ per rung since the last reset.</summary>
    public EvidenceEstimate EstimateEvidence() => ThermodynamicIntegration.LogEvidence(Ladder.InverseTemperatures, Evidence.Means());

    /// <summary>Acceptance of each mixture proposal on <paramref name="rung"/>, summed over its replicas.</summary>
    public void AddProposalAcceptance(ImmutableArray<ProposalAcceptance>.Builder into, int rung)
    {
        for (int j = 0; j < _proposals.Length; j++)
        {
            long proposed = 0, accepted = 0;
            for (int r = 0; r < Replicas; r++)
            {
                proposed += Mixtures[rung * Replicas + r].Proposed[j];
                accepted += Mixtures[rung * Replicas + r].Accepted[j];
            }

            into.Add(new ProposalAcceptance(_proposals[j].Name, rung, proposed, accepted));
        }
    }

    /// <summary>The statistics snapshot with the given per-proposal acceptance.</summary>
    public SamplerStatistics Statistics(ImmutableArray<ProposalAcceptance> proposals) =>
        new(Step, [.. Ladder.InverseTemperatures], proposals, Ladder.SwapAcceptanceRates(), [.. Evidence.Means()]);

    /// <summary>The shared parts of a saved state.</summary>
    public SavedChains Capture()
    {
        int count = _proposals.Length;
        var states = new ProposalState?[ChainCount][];
        long[] proposed = new long[ChainCount * count];
        long[] accepted = new long[ChainCount * count];
        for (int c = 0; c < ChainCount; c++)
        {
            states[c] = Mixtures[c].CaptureStates();
            Mixtures[c].Proposed.CopyTo(proposed, c * count);
            Mixtures[c].Accepted.CopyTo(accepted, c * count);
        }

        return new SavedChains(Step, Ladder.InverseTemperatures.ToArray(), Ladder.Rounds, (long[])Ladder.SwapsProposed.Clone(),
            (long[])Ladder.SwapsAccepted.Clone(), (double[])LogLikelihoods.Clone(), (double[])LogPriors.Clone(), (RandomStream[])Random.Clone(),
            _swapRandom, states, proposed, accepted, (double[])Evidence.Sums.Clone(), (long[])Evidence.Counts.Clone());
    }

    /// <summary>Whether <paramref name="saved"/> has this sampler's chain and proposal counts.</summary>
    public bool Fits(SavedChains saved) =>
        saved.ChainRandom.Length == ChainCount && saved.ProposalStates.Length == ChainCount
        && saved.ProposalsProposed.Length == ChainCount * _proposals.Length && saved.LogLikelihoods.Length == ChainCount;

    /// <summary>Restores the shared parts (check <see cref="Fits"/> first).</summary>
    public void Restore(SavedChains saved)
    {
        Step = saved.Step;
        Ladder.Restore(saved.InverseTemperatures, saved.LadderRounds, saved.SwapsProposed, saved.SwapsAccepted);
        saved.LogLikelihoods.CopyTo(LogLikelihoods, 0);
        saved.LogPriors.CopyTo(LogPriors, 0);
        saved.ChainRandom.CopyTo(Random, 0);
        _swapRandom = saved.SwapRandom;
        int count = _proposals.Length;
        for (int c = 0; c < ChainCount; c++)
        {
            Mixtures[c].RestoreStates(saved.ProposalStates[c], saved.ProposalsProposed.AsSpan(c * count, count), saved.ProposalsAccepted.AsSpan(c * count, count));
            Temperatures[c].InverseTemperature = Ladder.InverseTemperatures[c / Replicas];
        }

        Evidence.Restore(saved.EvidenceSums, saved.EvidenceCounts);
    }

    private void SwapRound<TExchange>(TExchange chains)
        where TExchange : IChainExchange
    {
        ReadOnlySpan<double> betas = Ladder.InverseTemperatures;
        Array.Clear(_acceptedPerPair);
        for (int rung = Ladder.Count - 2; rung >= 0; rung--)
        {
            double deltaBeta = betas[rung] - betas[rung + 1];
            for (int r = 0; r < Replicas; r++)
            {
                int cold = rung * Replicas + r;
                int hot = cold + Replicas;
                if (MetropolisTest.Accepts(deltaBeta * (LogLikelihoods[hot] - LogLikelihoods[cold]), ref _swapRandom))
                {
                    chains.Exchange(cold, hot);
                    _acceptedPerPair[rung]++;
                }
            }
        }

        Ladder.RecordRound(_acceptedPerPair, Replicas);
        for (int c = 0; c < Temperatures.Length; c++) Temperatures[c].InverseTemperature = Ladder.InverseTemperatures[c / Replicas];
    }
}

/// <summary>The parts of a tempered sampler's state that <see cref="TemperedChains"/> owns.</summary>
internal sealed record SavedChains(long Step, double[] InverseTemperatures, long LadderRounds, long[] SwapsProposed, long[] SwapsAccepted,
    double[] LogLikelihoods, double[] LogPriors, RandomStream[] ChainRandom, RandomStream SwapRandom, ProposalState?[][] ProposalStates,
    long[] ProposalsProposed, long[] ProposalsAccepted, double[] EvidenceSums, long[] EvidenceCounts);
