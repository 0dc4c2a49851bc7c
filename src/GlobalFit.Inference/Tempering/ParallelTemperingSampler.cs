using System.Collections.Immutable;
using GlobalFit.Inference.Diagnostics;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tempering;

/// <summary>
/// Parallel-tempering Metropolis–Hastings for a fixed-dimension model: each chain targets p(θ) L(θ)^β for
/// its rung's β, neighbouring rungs swap states, and the cold rung (β = 1) gives the posterior samples.
/// </summary>
/// <remarks>
/// <para>Swaps: Swendsen &amp; Wang (1986), Phys. Rev. Lett. 57, 2607; Geyer (1991); Earl &amp; Deem (2005),
/// Phys. Chem. Chem. Phys. 7, 3910. A swap between rungs i and i+1 (same replica) is accepted with
/// probability min(1, exp[(β_i − β_{i+1})(ln L_{i+1} − ln L_i)]); pairs are attempted from the hottest
/// down, every <see cref="TemperingSettings.SwapInterval"/> steps. Ladder adaptation: see
/// <see cref="TemperatureLadder"/>. Proposal instances (and their adaptation) stay with their rung; only
/// states move.</para>
/// <para>Each chain has its own random stream derived from (Seed, StreamId, chain index), the swaps another
/// from (Seed, StreamId, 2⁶⁴ − 1), so results do not depend on how chains are scheduled.</para>
/// <para>Steady-state steps allocate nothing. Not thread-safe: call from one thread at a time.</para>
/// </remarks>
/// <typeparam name="TModel">The model; a struct or sealed class gets a devirtualised loop.</typeparam>
public sealed class ParallelTemperingSampler<TModel> : IChainExchange
    where TModel : ITargetModel
{
    private const int MaximumInitialDraws = 10_000;

    private readonly TModel _model;
    private readonly ParameterSchema _schema;
    private readonly int _dimension;
    private readonly TemperedChains _chains;
    private readonly double[] _positions;
    private readonly double[] _candidate;
    private readonly double[] _swapBuffer;

    /// <summary>Creates a sampler with every chain started from a prior draw with finite likelihood.</summary>
    /// <param name="model">The model.</param>
    /// <param name="settings">The settings; validated here.</param>
    /// <exception cref="ArgumentException">Invalid settings (the parameter name is the offending field).</exception>
    /// <exception cref="InvalidOperationException">No prior draw with finite prior and likelihood was found.</exception>
    public ParallelTemperingSampler(TModel model, ParallelTemperingSettings settings)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        _model = model;
        _schema = model.Schema ?? throw new ArgumentException("Model schema must not be null.", nameof(model));
        _dimension = _schema.Dimension;
        var schema = _schema;
        _chains = new TemperedChains(settings.Tempering, settings.Proposals, settings.Seed, settings.StreamId,
            temperature => new ProposalContext(schema, model, temperature, default));
        _positions = new double[checked(_chains.ChainCount * _dimension)];
        _candidate = new double[_dimension];
        _swapBuffer = new double[_dimension];
        for (int c = 0; c < _chains.ChainCount; c++) InitialiseFromPrior(c);
    }

    /// <summary>Recreates a sampler from a saved state; the continuation is bit-identical to the original run.</summary>
    /// <param name="model">The same model as the original run.</param>
    /// <param name="settings">The same settings as the original run.</param>
    /// <param name="state">The saved state.</param>
    /// <returns>The resumed sampler.</returns>
    /// <exception cref="ArgumentException">The state does not fit the model or settings.</exception>
    public static ParallelTemperingSampler<TModel> Resume(TModel model, ParallelTemperingSettings settings, ParallelTemperingState state)
    {
        ArgumentNullException.ThrowIfNull(state);
        var sampler = new ParallelTemperingSampler<TModel>(model, settings);
        sampler.RestoreState(state);
        return sampler;
    }

    /// <summary>Parameter dimension d.</summary>
    public int Dimension => _dimension;

    /// <summary>Total number of chains (rungs × replicas).</summary>
    public int ChainCount => _chains.ChainCount;

    /// <summary>Number of cold replicas (= chains per temperature); chains 0 .. ColdChainCount − 1 are cold.</summary>
    public int ColdChainCount => _chains.Replicas;

    /// <summary>Steps taken so far.</summary>
    public long Step => _chains.Step;

    /// <summary>Current β per rung.</summary>
    public ReadOnlySpan<double> InverseTemperatures => _chains.Ladder.InverseTemperatures;

    /// <summary>Position of chain <paramref name="chain"/> (cold chains are 0 .. ColdChainCount − 1).</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>A view that stays valid until the next step.</returns>
    public ReadOnlySpan<double> Position(int chain) => _positions.AsSpan(checked(chain * _dimension), _dimension);

    /// <summary>ln L of chain <paramref name="chain"/>.</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>The log likelihood.</returns>
    public double LogLikelihood(int chain) => _chains.LogLikelihoods[chain];

    /// <summary>ln p of chain <paramref name="chain"/>.</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>The log prior.</returns>
    public double LogPrior(int chain) => _chains.LogPriors[chain];

    /// <summary>The random stream of chain <paramref name="chain"/> (for determinism checks).</summary>
    /// <param name="chain">Chain index.</param>
    /// <returns>A copy of the stream state.</returns>
    public RandomStream ChainRandom(int chain) => _chains.Random[chain];

    /// <summary>Moves chain <paramref name="chain"/> to <paramref name="position"/> (e.g. a warm start).</summary>
    /// <param name="chain">Chain index.</param>
    /// <param name="position">A point with finite prior and likelihood.</param>
    /// <exception cref="ArgumentException">The point is outside the support.</exception>
    public void SetPosition(int chain, ReadOnlySpan<double> position)
    {
        if (position.Length != _dimension)
        {
            throw new ArgumentException("Position has the wrong length.", nameof(position));
        }

        double logPrior = _model.LogPrior(position);
        double logLikelihood = double.IsFinite(logPrior) ? _model.LogLikelihood(position) : double.NegativeInfinity;
        if (!double.IsFinite(logPrior) || !double.IsFinite(logLikelihood))
        {
            throw new ArgumentException("Position is outside the support of the model.", nameof(position));
        }

        position.CopyTo(_positions.AsSpan(chain * _dimension, _dimension));
        _chains.LogPriors[chain] = logPrior;
        _chains.LogLikelihoods[chain] = logLikelihood;
    }

    /// <summary>Runs <paramref name="steps"/> steps (each: one proposal per chain, then a swap round when due).</summary>
    /// <param name="steps">Number of steps, ≥ 0.</param>
    public void Advance(int steps) => Advance(steps, default(NoSampleSink));

    /// <summary>Runs <paramref name="steps"/> steps and hands every cold-chain state to <paramref name="sink"/> after each.</summary>
    /// <typeparam name="TSink">Sink type; generic so a struct sink is not boxed.</typeparam>
    /// <param name="steps">Number of steps, ≥ 0.</param>
    /// <param name="sink">The sample sink.</param>
    public void Advance<TSink>(int steps, TSink sink)
        where TSink : ISampleSink
    {
        ArgumentOutOfRangeException.ThrowIfNegative(steps);
        for (int s = 0; s < steps; s++)
        {
            for (int c = 0; c < _chains.ChainCount; c++)
            {
                UpdateChain(c);
            }

            _chains.EndStep(this);
            for (int r = 0; r < _chains.Replicas; r++)
            {
                sink.OnSample(Step, r, Position(r), _chains.LogLikelihoods[r], _chains.LogPriors[r]);
            }
        }
    }

    /// <summary>Clears the ⟨ln L⟩ accumulators, e.g. after burn-in and after freezing the ladder.</summary>
    public void ResetEvidenceAccumulators() => _chains.Evidence.Reset();

    /// <summary>Thermodynamic-integration evidence from ⟨ln L⟩ per rung since the last reset.</summary>
    /// <returns>The estimate (NaN if a rung has no terms).</returns>
    public EvidenceEstimate EstimateEvidence() => _chains.EstimateEvidence();

    /// <summary>A snapshot of acceptance, swap and ladder statistics (allocates; call between advances).</summary>
    /// <returns>The statistics.</returns>
    public SamplerStatistics GetStatistics()
    {
        var proposals = ImmutableArray.CreateBuilder<ProposalAcceptance>();
        for (int rung = 0; rung < _chains.Ladder.Count; rung++)
        {
            _chains.AddProposalAcceptance(proposals, rung);
        }

        return _chains.Statistics(proposals.ToImmutable());
    }

    /// <summary>Copies the complete sampler state (allocates; call between advances).</summary>
    /// <returns>The state.</returns>
    public ParallelTemperingState CaptureState()
    {
        var c = _chains.Capture();
        return new ParallelTemperingState(
            c.Step, _dimension, _chains.Replicas, c.InverseTemperatures, c.LadderRounds, c.SwapsProposed, c.SwapsAccepted,
            (double[])_positions.Clone(), c.LogLikelihoods, c.LogPriors, c.ChainRandom, c.SwapRandom, c.ProposalStates,
            c.ProposalsProposed, c.ProposalsAccepted, c.EvidenceSums, c.EvidenceCounts);
    }

    private void RestoreState(ParallelTemperingState state)
    {
        var saved = new SavedChains(state.Step, state.InverseTemperatures, state.LadderRounds, state.SwapsProposed, state.SwapsAccepted,
            state.LogLikelihoods, state.LogPriors, state.ChainRandom, state.SwapRandom, state.ProposalStates, state.ProposalsProposed,
            state.ProposalsAccepted, state.EvidenceSums, state.EvidenceCounts);
        if (state.Dimension != _dimension || state.ChainsPerTemperature != _chains.Replicas
            || state.Positions.Length != _positions.Length || !_chains.Fits(saved))
        {
            throw new ArgumentException("Saved state does not match the model and settings.", nameof(state));
        }

        _chains.Restore(saved);
        state.Positions.CopyTo(_positions, 0);
    }

    private void InitialiseFromPrior(int chain)
    {
        Span<double> position = _positions.AsSpan(chain * _dimension, _dimension);
        for (int attempt = 0; attempt < MaximumInitialDraws; attempt++)
        {
            _model.DrawFromPrior(position, ref _chains.Random[chain]);
            double logPrior = _model.LogPrior(position);
            if (!double.IsFinite(logPrior))
            {
                continue;
            }

            double logLikelihood = _model.LogLikelihood(position);
            if (double.IsFinite(logLikelihood))
            {
                _chains.LogPriors[chain] = logPrior;
                _chains.LogLikelihoods[chain] = logLikelihood;
                return;
            }
        }

        throw new InvalidOperationException($"No prior draw with finite prior and likelihood in {MaximumInitialDraws} attempts.");
    }

    private void UpdateChain(int chain)
    {
        ref RandomStream random = ref _chains.Random[chain];
        ProposalMixture mixture = _chains.Mixtures[chain];
        Span<double> current = _positions.AsSpan(chain * _dimension, _dimension);
        Span<double> candidate = _candidate;
        int proposal = mixture.Choose(ref random);
        double logProposalRatio = mixture.Propose(proposal, current, candidate, ref random);
        if (_schema.TryApplyBoundaries(candidate))
        {
            double logPrior = _model.LogPrior(candidate);
            if (logPrior > double.NegativeInfinity)
            {
                double logLikelihood = _model.LogLikelihood(candidate);
                double beta = _chains.Temperatures[chain].InverseTemperature;
                double logAcceptance = beta * (logLikelihood - _chains.LogLikelihoods[chain]) + (logPrior - _chains.LogPriors[chain]) + logProposalRatio;
                // NaN (e.g. 0·∞ at β = 0 with ln L = −∞, or a NaN likelihood) compares false: rejected.
                if (logLikelihood > double.NegativeInfinity && MetropolisTest.Accepts(logAcceptance, ref random))
                {
                    candidate.CopyTo(current);
                    _chains.LogPriors[chain] = logPrior;
                    _chains.LogLikelihoods[chain] = logLikelihood;
                    mixture.RecordAcceptance(proposal);
                }
            }
        }

        mixture.Observe(current);
    }

    /// <inheritdoc/>
    void IChainExchange.Exchange(int first, int second)
    {
        Span<double> a = _positions.AsSpan(first * _dimension, _dimension);
        Span<double> b = _positions.AsSpan(second * _dimension, _dimension);
        a.CopyTo(_swapBuffer);
        b.CopyTo(a);
        _swapBuffer.AsSpan().CopyTo(b);
        var (logLikelihoods, logPriors) = (_chains.LogLikelihoods, _chains.LogPriors);
        (logLikelihoods[first], logLikelihoods[second]) = (logLikelihoods[second], logLikelihoods[first]);
        (logPriors[first], logPriors[second]) = (logPriors[second], logPriors[first]);
    }

    private readonly struct NoSampleSink : ISampleSink
    {
        public void OnSample(long step, int replica, ReadOnlySpan<double> position, double logLikelihood, double logPrior)
        {
        }
    }
}
