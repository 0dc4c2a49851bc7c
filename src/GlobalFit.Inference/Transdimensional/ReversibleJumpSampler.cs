using System.Collections.Immutable;
using GlobalFit.Inference.Diagnostics;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>
/// Reversible-jump MCMC over a variable number of same-kind sources, with parallel tempering: each chain
/// holds a whole variable-size configuration and swaps exchange whole configurations.
/// </summary>
/// <remarks>
/// <para>Green (1995), "Reversible jump Markov chain Monte Carlo computation and Bayesian model
/// determination", Biometrika 82(4), 711. The target on labelled configurations is
/// π_β(k, θ_1..θ_k) ∝ p(k) Π p(θ_j) L(θ_1..θ_k)^β, which is symmetric in the labels.</para>
/// <para>Moves per step and chain: with probability <see cref="ReversibleJumpSettings.JumpProbability"/> a
/// birth or death, otherwise a within-model move of one uniformly chosen source by the proposal mixture.
/// Given k, a birth is chosen with probability b_k (1 at k = 0, 0 at the cap, ½ otherwise) and a death with
/// d_k = 1 − b_k. A birth draws u ~ b(·) from the <see cref="IBirthDensity"/>, appends it and swaps it with
/// a uniformly chosen slot among the k+1; a death picks one of the k slots uniformly, swaps it to the end
/// and drops it, which is the exact inverse. The slot-choice probabilities 1/(k+1) cancel, the dimension
/// matching is the identity (u becomes θ_new) so the Jacobian is 1, and the acceptance probabilities are
/// birth: min{1, π_β(k+1, θ′)/π_β(k, θ) · d_{k+1} / (b_k b(u))} and
/// death: min{1, π_β(k−1, θ′)/π_β(k, θ) · b_{k−1} b(θ_removed) / d_k}
/// (Green 1995, eq. 7 with the dimension-matching of §3.3).</para>
/// <para>Split/merge (optional, probability <see cref="ReversibleJumpSettings.SplitMergeProbability"/>, map
/// <see cref="ISourceSplitMerge"/> from the source class): given k, a split is chosen with probability s_k (0 at k = 0
/// and at the cap, 1 at k = 1, ½ otherwise) and a merge with m_k = 1 − s_k for k ≥ 2. A split picks one of the k
/// slots, draws u ~ g(· | θ), writes θ₁ into the slot and θ₂ at the end, then swaps the end with a uniformly chosen
/// slot among the k+1. A merge picks a slot among the k+1 and swaps it to the end (undoing that swap), picks the
/// partner slot among the remaining k, merges the pair into the partner's slot and drops the end: the exact inverse,
/// so the slot choices 1/k · 1/(k+1) cancel and the acceptance probabilities are
/// split: min{1, π_β(k+1, θ′)/π_β(k, θ) · m_{k+1} |J| / (s_k g(u | θ))} and
/// merge: min{1, π_β(k−1, θ′)/π_β(k, θ) · s_{k−1} g(u | θ) / (m_k |J|)}, with |J| = |∂(θ₁, θ₂)/∂(θ, u)| at the
/// split point (Green 1995, eq. 7 and §3.3; split/merge as in Richardson &amp; Green 1997, JRSS B 59, 731, §3.2).
/// Births from a data-driven density (e.g. an F-statistic map) find well-separated sources; split/merge repairs one
/// signal fitted as two nearby sources, which a death alone cannot undo because the survivor is then mis-fitted.</para>
/// <para>Steady-state steps allocate nothing. Not thread-safe.</para>
/// </remarks>
/// <typeparam name="TModel">The model; a struct or sealed class gets a devirtualised loop.</typeparam>
public sealed class ReversibleJumpSampler<TModel> : IChainExchange
    where TModel : ITransdimensionalModel
{
    private const int BirthsProposed = 0;
    private const int BirthsAccepted = 1;
    private const int DeathsProposed = 2;
    private const int DeathsAccepted = 3;
    private const int SplitsProposed = 4;
    private const int SplitsAccepted = 5;
    private const int MergesProposed = 6;
    private const int MergesAccepted = 7;
    private const int JumpCounterCount = 8;

    // States saved before split/merge existed hold only the birth and death counters of each chain.
    private const int BirthDeathCounterCount = 4;

    private readonly TModel _model;
    private readonly IBirthDensity _birth;
    private readonly ReversibleJumpSettings _settings;
    private readonly ParameterSchema _schema;
    private readonly IPriorDensity _sourcePrior;
    private readonly int _dimension;
    private readonly int _maxSources;
    private readonly int _replicas;
    private readonly int _chainCount;
    private readonly TemperedChains _chains;
    private readonly double[][] _sources;
    private readonly int[] _counts;
    private readonly double[] _logLikelihoods;
    private readonly double[] _logPriors;
    private readonly long[] _jumpCounters;
    private readonly double[] _removedSource;
    private readonly double[] _mergedSource;
    private readonly double[] _auxiliary;
    private readonly ISourceSplitMerge? _splitMerge;
    private double[] _candidate;

    /// <summary>Creates a sampler; every chain starts with <see cref="ReversibleJumpSettings.InitialSourceCount"/> prior draws.</summary>
    /// <param name="model">The model.</param>
    /// <param name="birth">The birth density.</param>
    /// <param name="settings">The settings; validated here.</param>
    /// <exception cref="ArgumentException">Invalid settings (the parameter name is the offending field).</exception>
    /// <exception cref="InvalidOperationException">The initial configuration has zero posterior density.</exception>
    public ReversibleJumpSampler(TModel model, IBirthDensity birth, ReversibleJumpSettings settings)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(birth);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        _model = model;
        _birth = birth;
        _settings = settings;
        _schema = model.SourceSchema ?? throw new ArgumentException("Model source schema must not be null.", nameof(model));
        _sourcePrior = model.SourcePrior ?? throw new ArgumentException("Model source prior must not be null.", nameof(model));
        _dimension = _schema.Dimension;
        _maxSources = settings.MaxSources;
        var (schema, sourcePrior) = (_schema, _sourcePrior);
        _chains = new TemperedChains(settings.Tempering, settings.WithinProposals, settings.Seed, settings.StreamId,
            temperature => new ProposalContext(schema, sourcePrior, temperature, default));
        _replicas = _chains.Replicas;
        _chainCount = _chains.ChainCount;
        _logLikelihoods = _chains.LogLikelihoods;
        _logPriors = _chains.LogPriors;
        int capacity = checked(Math.Max(_maxSources, 1) * _dimension);
        _sources = new double[_chainCount][];
        _candidate = new double[capacity];
        _removedSource = new double[_dimension];
        _mergedSource = new double[_dimension];
        _auxiliary = new double[_dimension];
        _splitMerge = settings.SplitMergeProbability > 0.0 ? settings.SplitMerge : null;
        _counts = new int[_chainCount];
        _jumpCounters = new long[_chainCount * JumpCounterCount];
        for (int c = 0; c < _chainCount; c++)
        {
            _sources[c] = new double[capacity];
            Initialise(c, settings.InitialSourceCount);
        }
    }

    /// <summary>Recreates a sampler from a saved state; the continuation is bit-identical to the original run.</summary>
    /// <param name="model">The same model as the original run.</param>
    /// <param name="birth">The same birth density as the original run.</param>
    /// <param name="settings">The same settings as the original run.</param>
    /// <param name="state">The saved state.</param>
    /// <returns>The resumed sampler.</returns>
    public static ReversibleJumpSampler<TModel> Resume(TModel model, IBirthDensity birth, ReversibleJumpSettings settings, ReversibleJumpState state)
    {
        ArgumentNullException.ThrowIfNull(state);
        var sampler = new ReversibleJumpSampler<TModel>(model, birth, settings);
        sampler.RestoreState(state);
        return sampler;
    }

    /// <summary>Parameters per source d.</summary>
    public int SourceDimension => _dimension;

    /// <summary>Total number of chains (rungs × replicas).</summary>
    public int ChainCount => _chainCount;

    /// <summary>Number of cold replicas; chains 0 .. ColdChainCount − 1 are cold.</summary>
    public int ColdChainCount => _replicas;

    /// <summary>Steps taken so far.</summary>
    public long Step => _chains.Step;

    /// <summary>Current β per rung.</summary>
    public ReadOnlySpan<double> InverseTemperatures => _chains.Ladder.InverseTemperatures;

    /// <summary>Number of sources k held by chain <paramref name="chain"/>.</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>k.</returns>
    public int SourceCount(int chain) => _counts[chain];

    /// <summary>The k × d source values of chain <paramref name="chain"/>, source-major.</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>A view valid until the next step.</returns>
    public ReadOnlySpan<double> Sources(int chain) => _sources[chain].AsSpan(0, _counts[chain] * _dimension);

    /// <summary>ln L of chain <paramref name="chain"/>.</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>The log likelihood.</returns>
    public double LogLikelihood(int chain) => _logLikelihoods[chain];

    /// <summary>The random stream of chain <paramref name="chain"/> (for determinism checks).</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>A copy of the stream state.</returns>
    public RandomStream ChainRandom(int chain) => _chains.Random[chain];

    /// <summary>Runs <paramref name="steps"/> steps.</summary>
    /// <param name="steps">Number of steps, ≥ 0.</param>
    public void Advance(int steps) => Advance(steps, default(NoSampleSink));

    /// <summary>Runs <paramref name="steps"/> steps and hands every cold configuration to <paramref name="sink"/> after each.</summary>
    /// <typeparam name="TSink">Sink type; generic so a struct sink is not boxed.</typeparam>
    /// <param name="steps">Number of steps, ≥ 0.</param>
    /// <param name="sink">The sample sink.</param>
    public void Advance<TSink>(int steps, TSink sink)
        where TSink : ITransdimensionalSampleSink
    {
        ArgumentOutOfRangeException.ThrowIfNegative(steps);
        for (int s = 0; s < steps; s++)
        {
            for (int c = 0; c < _chainCount; c++)
            {
                UpdateChain(c);
            }

            _chains.EndStep(this);
            for (int r = 0; r < _replicas; r++)
            {
                sink.OnSample(Step, r, _counts[r], Sources(r), _logLikelihoods[r], _logPriors[r]);
            }
        }
    }

    /// <summary>Clears the ⟨ln L⟩ accumulators.</summary>
    public void ResetEvidenceAccumulators() => _chains.Evidence.Reset();

    /// <summary>Thermodynamic-integration evidence (marginalised over k) since the last reset.</summary>
    /// <returns>The estimate.</returns>
    public EvidenceEstimate EstimateEvidence() => _chains.EstimateEvidence();

    /// <summary>A snapshot of acceptance (within-model, birth, death), swap and ladder statistics.</summary>
    /// <returns>The statistics.</returns>
    public SamplerStatistics GetStatistics()
    {
        var proposals = ImmutableArray.CreateBuilder<ProposalAcceptance>();
        for (int rung = 0; rung < _chains.Ladder.Count; rung++)
        {
            _chains.AddProposalAcceptance(proposals, rung);

            long births = 0, birthsAccepted = 0, deaths = 0, deathsAccepted = 0;
            for (int r = 0; r < _replicas; r++)
            {
                int offset = (rung * _replicas + r) * JumpCounterCount;
                births += _jumpCounters[offset + BirthsProposed];
                birthsAccepted += _jumpCounters[offset + BirthsAccepted];
                deaths += _jumpCounters[offset + DeathsProposed];
                deathsAccepted += _jumpCounters[offset + DeathsAccepted];
            }

            proposals.Add(new ProposalAcceptance("birth", rung, births, birthsAccepted));
            proposals.Add(new ProposalAcceptance("death", rung, deaths, deathsAccepted));
            if (_splitMerge is not null)
            {
                AddSplitMergeAcceptance(proposals, rung);
            }
        }

        return _chains.Statistics(proposals.ToImmutable());
    }

    private void AddSplitMergeAcceptance(ImmutableArray<ProposalAcceptance>.Builder proposals, int rung)
    {
        long splits = 0, splitsAccepted = 0, merges = 0, mergesAccepted = 0;
        for (int r = 0; r < _replicas; r++)
        {
            int offset = (rung * _replicas + r) * JumpCounterCount;
            splits += _jumpCounters[offset + SplitsProposed];
            splitsAccepted += _jumpCounters[offset + SplitsAccepted];
            merges += _jumpCounters[offset + MergesProposed];
            mergesAccepted += _jumpCounters[offset + MergesAccepted];
        }

        proposals.Add(new ProposalAcceptance("split", rung, splits, splitsAccepted));
        proposals.Add(new ProposalAcceptance("merge", rung, merges, mergesAccepted));
    }

    /// <summary>Copies the complete sampler state (allocates; call between advances).</summary>
    /// <returns>The state.</returns>
    public ReversibleJumpState CaptureState()
    {
        var c = _chains.Capture();
        double[][] sources = [.. _sources.Select(chain => (double[])chain.Clone())];
        return new ReversibleJumpState(
            c.Step, _dimension, _maxSources, _replicas, c.InverseTemperatures, c.LadderRounds, c.SwapsProposed, c.SwapsAccepted,
            (int[])_counts.Clone(), sources, c.LogLikelihoods, c.LogPriors, c.ChainRandom, c.SwapRandom, c.ProposalStates,
            c.ProposalsProposed, c.ProposalsAccepted, (long[])_jumpCounters.Clone(), c.EvidenceSums, c.EvidenceCounts);
    }

    private void RestoreState(ReversibleJumpState state)
    {
        var saved = new SavedChains(state.Step, state.InverseTemperatures, state.LadderRounds, state.SwapsProposed, state.SwapsAccepted,
            state.LogLikelihoods, state.LogPriors, state.ChainRandom, state.SwapRandom, state.ProposalStates, state.ProposalsProposed,
            state.ProposalsAccepted, state.EvidenceSums, state.EvidenceCounts);
        if (state.SourceDimension != _dimension || state.MaxSources != _maxSources || state.ChainsPerTemperature != _replicas
            || state.SourceCounts.Length != _chainCount || state.Sources.Length != _chainCount || !_chains.Fits(saved)
            || (state.JumpCounters.Length != _jumpCounters.Length && state.JumpCounters.Length != _chainCount * BirthDeathCounterCount))
        {
            throw new ArgumentException("Saved state does not match the model and settings.", nameof(state));
        }

        for (int c = 0; c < _chainCount; c++)
        {
            if (state.Sources[c].Length != _sources[c].Length)
            {
                throw new ArgumentException("Saved source buffer has the wrong length.", nameof(state));
            }
        }

        _chains.Restore(saved);
        for (int c = 0; c < _chainCount; c++) state.Sources[c].CopyTo(_sources[c], 0);
        state.SourceCounts.CopyTo(_counts, 0);
        RestoreJumpCounters(state.JumpCounters);
    }

    private void RestoreJumpCounters(long[] saved)
    {
        if (saved.Length == _jumpCounters.Length)
        {
            saved.CopyTo(_jumpCounters, 0);
            return;
        }

        Array.Clear(_jumpCounters);
        for (int c = 0; c < _chainCount; c++)
        {
            saved.AsSpan(c * BirthDeathCounterCount, BirthDeathCounterCount).CopyTo(_jumpCounters.AsSpan(c * JumpCounterCount));
        }
    }

    private void Initialise(int chain, int count)
    {
        for (int j = 0; j < count; j++)
        {
            _sourcePrior.DrawFromPrior(_sources[chain].AsSpan(j * _dimension, _dimension), ref _chains.Random[chain]);
        }

        _counts[chain] = count;
        _logPriors[chain] = LogPrior(_sources[chain], count);
        _logLikelihoods[chain] = double.IsFinite(_logPriors[chain])
            ? _model.LogLikelihood(_sources[chain].AsSpan(0, count * _dimension), count)
            : double.NegativeInfinity;
        if (!double.IsFinite(_logLikelihoods[chain]))
        {
            throw new InvalidOperationException("The initial configuration has zero prior or likelihood.");
        }
    }

    private double LogPrior(double[] sources, int count)
    {
        double logPrior = _model.LogCountPrior(count);
        for (int j = 0; j < count && logPrior > double.NegativeInfinity; j++)
        {
            logPrior += _sourcePrior.LogPrior(sources.AsSpan(j * _dimension, _dimension));
        }

        return logPrior;
    }

    private double BirthProbability(int count) => count == 0 ? 1.0 : count >= _maxSources ? 0.0 : 0.5;

    private double SplitProbability(int count) => count < 1 || count >= _maxSources ? 0.0 : count == 1 ? 1.0 : 0.5;

    private double MergeProbability(int count) => count < 2 ? 0.0 : 1.0 - SplitProbability(count);

    private void UpdateChain(int chain)
    {
        ref RandomStream random = ref _chains.Random[chain];
        if (_maxSources > 0)
        {
            // One uniform chooses the move kind; with no split/merge this is the same draw and the same branches as
            // before split/merge existed, so fixed-seed runs without it are unchanged.
            double move = random.NextDouble();
            if (move < _settings.JumpProbability)
            {
                if (random.NextDouble() < BirthProbability(_counts[chain]))
                {
                    Birth(chain, ref random);
                }
                else
                {
                    Death(chain, ref random);
                }

                return;
            }

            if (_splitMerge is not null && move < _settings.JumpProbability + _settings.SplitMergeProbability)
            {
                SplitOrMerge(chain, _splitMerge, ref random);
                return;
            }
        }

        if (_counts[chain] > 0)
        {
            WithinModel(chain, ref random);
        }
    }

    private void SplitOrMerge(int chain, ISourceSplitMerge map, ref RandomStream random)
    {
        int count = _counts[chain];
        double split = SplitProbability(count);
        if (split == 0.0 && MergeProbability(count) == 0.0)
        {
            return;
        }

        if (random.NextDouble() < split)
        {
            Split(chain, map, ref random);
        }
        else
        {
            Merge(chain, map, ref random);
        }
    }

    private void Split(int chain, ISourceSplitMerge map, ref RandomStream random)
    {
        int count = _counts[chain];
        _jumpCounters[chain * JumpCounterCount + SplitsProposed]++;
        _sources[chain].AsSpan(0, count * _dimension).CopyTo(_candidate);
        int slot = random.NextInt(count);
        ReadOnlySpan<double> source = _sources[chain].AsSpan(slot * _dimension, _dimension);
        double logAuxiliaryDensity = map.DrawAuxiliary(source, _auxiliary, ref random);
        if (!(logAuxiliaryDensity > double.NegativeInfinity))
        {
            return;
        }

        Span<double> first = _candidate.AsSpan(slot * _dimension, _dimension);
        Span<double> second = _candidate.AsSpan(count * _dimension, _dimension);
        if (!map.TrySplit(source, _auxiliary, first, second, out double logJacobian)
            || !double.IsFinite(logJacobian) || !_schema.Contains(first) || !_schema.Contains(second))
        {
            return;
        }

        SwapSources(_candidate, random.NextInt(count + 1), count);
        double logJumpRatio = Math.Log(MergeProbability(count + 1)) - Math.Log(SplitProbability(count)) - logAuxiliaryDensity + logJacobian;
        if (TryAccept(chain, count + 1, logJumpRatio, ref random))
        {
            _jumpCounters[chain * JumpCounterCount + SplitsAccepted]++;
        }
    }

    private void Merge(int chain, ISourceSplitMerge map, ref RandomStream random)
    {
        int count = _counts[chain];
        _jumpCounters[chain * JumpCounterCount + MergesProposed]++;
        _sources[chain].AsSpan(0, count * _dimension).CopyTo(_candidate);
        SwapSources(_candidate, random.NextInt(count), count - 1);
        int slot = random.NextInt(count - 1);
        Span<double> first = _candidate.AsSpan(slot * _dimension, _dimension);
        ReadOnlySpan<double> second = _candidate.AsSpan((count - 1) * _dimension, _dimension);
        if (!map.TryMerge(first, second, _mergedSource, _auxiliary, out double logJacobian) || !double.IsFinite(logJacobian)
            || !_schema.Contains(_mergedSource))
        {
            return;
        }

        double logAuxiliaryDensity = map.LogAuxiliaryDensity(_mergedSource, _auxiliary);
        if (!(logAuxiliaryDensity > double.NegativeInfinity))
        {
            return;
        }

        _mergedSource.CopyTo(first);
        double logJumpRatio = Math.Log(SplitProbability(count - 1)) - Math.Log(MergeProbability(count)) + logAuxiliaryDensity - logJacobian;
        if (TryAccept(chain, count - 1, logJumpRatio, ref random))
        {
            _jumpCounters[chain * JumpCounterCount + MergesAccepted]++;
        }
    }

    private void Birth(int chain, ref RandomStream random)
    {
        int count = _counts[chain];
        int length = count * _dimension;
        _jumpCounters[chain * JumpCounterCount + BirthsProposed]++;
        _sources[chain].AsSpan(0, length).CopyTo(_candidate);
        Span<double> newborn = _candidate.AsSpan(length, _dimension);
        double logBirthDensity = _birth.Draw(newborn, ref random);
        if (!_schema.Contains(newborn) || !(logBirthDensity > double.NegativeInfinity))
        {
            return;
        }

        int slot = random.NextInt(count + 1);
        SwapSources(_candidate, slot, count);
        double logJumpRatio = Math.Log(1.0 - BirthProbability(count + 1)) - Math.Log(BirthProbability(count)) - logBirthDensity;
        if (TryAccept(chain, count + 1, logJumpRatio, ref random))
        {
            _jumpCounters[chain * JumpCounterCount + BirthsAccepted]++;
        }
    }

    private void Death(int chain, ref RandomStream random)
    {
        int count = _counts[chain];
        _jumpCounters[chain * JumpCounterCount + DeathsProposed]++;
        _sources[chain].AsSpan(0, count * _dimension).CopyTo(_candidate);
        int slot = random.NextInt(count);
        SwapSources(_candidate, slot, count - 1);
        _candidate.AsSpan((count - 1) * _dimension, _dimension).CopyTo(_removedSource);
        double logJumpRatio = Math.Log(BirthProbability(count - 1)) + _birth.LogDensity(_removedSource) - Math.Log(1.0 - BirthProbability(count));
        if (TryAccept(chain, count - 1, logJumpRatio, ref random))
        {
            _jumpCounters[chain * JumpCounterCount + DeathsAccepted]++;
        }
    }

    private void WithinModel(int chain, ref RandomStream random)
    {
        int count = _counts[chain];
        ProposalMixture mixture = _chains.Mixtures[chain];
        double[] sources = _sources[chain];
        int slot = random.NextInt(count);
        sources.AsSpan(0, count * _dimension).CopyTo(_candidate);
        ReadOnlySpan<double> current = sources.AsSpan(slot * _dimension, _dimension);
        Span<double> moved = _candidate.AsSpan(slot * _dimension, _dimension);
        int proposal = mixture.Choose(ref random);
        double logProposalRatio = mixture.Propose(proposal, current, moved, ref random);
        if (_schema.TryApplyBoundaries(moved) && TryAccept(chain, count, logProposalRatio, ref random))
        {
            mixture.RecordAcceptance(proposal);
        }

        mixture.Observe(_sources[chain].AsSpan(slot * _dimension, _dimension));
    }

    /// <summary>Scores the configuration in <see cref="_candidate"/> and, if accepted, makes it the chain's state.</summary>
    private bool TryAccept(int chain, int candidateCount, double logProposalRatio, ref RandomStream random)
    {
        double logPrior = LogPrior(_candidate, candidateCount);
        if (!(logPrior > double.NegativeInfinity))
        {
            return false;
        }

        double logLikelihood = _model.LogLikelihood(_candidate.AsSpan(0, candidateCount * _dimension), candidateCount);
        if (!(logLikelihood > double.NegativeInfinity))
        {
            return false;
        }

        double beta = _chains.Temperatures[chain].InverseTemperature;
        double logAcceptance = beta * (logLikelihood - _logLikelihoods[chain]) + (logPrior - _logPriors[chain]) + logProposalRatio;
        if (!MetropolisTest.Accepts(logAcceptance, ref random))
        {
            return false;
        }

        // The candidate buffer becomes the chain's buffer; the old one is recycled as the next candidate.
        (_sources[chain], _candidate) = (_candidate, _sources[chain]);
        _counts[chain] = candidateCount;
        _logPriors[chain] = logPrior;
        _logLikelihoods[chain] = logLikelihood;
        return true;
    }

    private void SwapSources(double[] buffer, int first, int second)
    {
        if (first == second)
        {
            return;
        }

        Span<double> a = buffer.AsSpan(first * _dimension, _dimension);
        Span<double> b = buffer.AsSpan(second * _dimension, _dimension);
        for (int i = 0; i < _dimension; i++)
        {
            (a[i], b[i]) = (b[i], a[i]);
        }
    }

    /// <inheritdoc/>
    void IChainExchange.Exchange(int first, int second)
    {
        (_sources[first], _sources[second]) = (_sources[second], _sources[first]);
        (_counts[first], _counts[second]) = (_counts[second], _counts[first]);
        (_logLikelihoods[first], _logLikelihoods[second]) = (_logLikelihoods[second], _logLikelihoods[first]);
        (_logPriors[first], _logPriors[second]) = (_logPriors[second], _logPriors[first]);
    }

    private readonly struct NoSampleSink : ITransdimensionalSampleSink
    {
        public void OnSample(long step, int replica, int sourceCount, ReadOnlySpan<double> sources, double logLikelihood, double logPrior)
        {
        }
    }
}
