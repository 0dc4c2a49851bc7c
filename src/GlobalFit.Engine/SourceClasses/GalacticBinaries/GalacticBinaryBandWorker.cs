using System.Collections.Immutable;
using System.Diagnostics;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Transdimensional;
using GlobalFit.Physics.GalacticBinaries;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The sampler of one band window: reversible-jump, parallel-tempered MCMC over a variable number of galactic
/// binaries whose f0 lies in the window, run in blocks of steps against a residual the caller supplies.</summary>
/// <remarks>
/// <para>Each <see cref="Update"/> is one Gibbs block of the global fit: given the residual over the padded window (the
/// data minus every source held by other windows and other source classes, with this worker's own sources left in),
/// it rebuilds the likelihood (<see cref="GalacticBinaryBandModel"/>), the birth density from the F-statistic of that
/// residual (<see cref="GalacticBinaryBirthDensity"/>) and the Fisher proposal, re-scores every chain's configuration
/// against the new residual, and continues the sampler from its saved state for the requested number of steps. Moves:
/// birth and death (probability <c>jump_probability</c>), split and merge of nearby sources (<see cref="GalacticBinarySplitMerge"/>,
/// probability <c>split_merge_probability</c>), otherwise one source moved by a Gaussian from that source's own Fisher matrix
/// (<see cref="LocalFisherGaussianProposal"/>, weight 0.3), Fisher-eigen jumps of the Inference library (0.1),
/// differential evolution (0.1), adaptive Gaussian (0.05), a Doppler-compensated sky jump with fresh amplitudes
/// (<see cref="DopplerSkyJumpProposal"/>, 0.5) or a fresh draw of the
/// birth density (<see cref="BirthDensityJumpProposal"/>, 0.1). The prior is
/// <see cref="GalacticBinarySourcePrior"/> with a uniform count prior on 0 … <c>max_sources_per_window</c>.</para>
/// <para>A new worker's chains start from the sources of <see cref="GreedyFStatisticSearch"/> on its first residual
/// rather than empty, which keeps loud sources from being fitted as a patchwork of partial sources.</para>
/// <para>The SNR scale of the amplitude prior is fixed at the first update, from that update's inverse PSDs, and kept in
/// the state. The whole state (sampler chains, random streams, proposal adaptation, counters) is one MessagePack blob;
/// a worker restored from it and given the same residual and step count produces the same result bit for bit (only
/// <see cref="GalacticBinaryBandStatistics.WallTime"/> differs). Every update, fresh or restored, goes through the same
/// save/resume path, so there is no second code path to diverge.</para>
/// <para>Knows nothing about actors or threads; not thread-safe. Borrows a template generator and F-statistic from a
/// <see cref="GalacticBinaryToolPool"/> for each call, so many workers can share a few.</para>
/// </remarks>
public sealed class GalacticBinaryBandWorker
{
    private const double MapUniformFraction = 0.1;

    private readonly GalacticBinaryBandSettings _settings;
    private readonly GalacticBinaryToolPool _tools;
    private readonly GalacticBinarySourcePrior _prior;
    private GalacticBinaryBandWorkerState _state;
    private GalacticBinarySourcePrior? _galaxyPrior;
    private double _galaxyPriorScale;

    /// <summary>Creates a worker with no sources yet.</summary>
    /// <param name="settings">The galactic-binary settings.</param>
    /// <param name="window">The plan entry it samples.</param>
    /// <param name="generator">A template generator for the data record, used by this worker only.</param>
    /// <param name="seed">The run seed; the window index separates the workers' random streams.</param>
    public GalacticBinaryBandWorker(GalacticBinaryBandSettings settings, GalacticBinaryBandWindow window, GalacticBinaryTemplateGenerator generator, ulong seed)
        : this(settings, window, new GalacticBinaryToolPool(generator), seed)
    {
    }

    /// <summary>Creates a worker with no sources yet that borrows its generator from <paramref name="tools"/>.</summary>
    /// <param name="settings">The galactic-binary settings.</param>
    /// <param name="window">The plan entry it samples.</param>
    /// <param name="tools">Generators for the data record, shared with other workers.</param>
    /// <param name="seed">The run seed; the window index separates the workers' random streams.</param>
    public GalacticBinaryBandWorker(GalacticBinaryBandSettings settings, GalacticBinaryBandWindow window, GalacticBinaryToolPool tools, ulong seed)
        : this(settings, window, tools, new GalacticBinaryBandWorkerState(window?.Index ?? 0, 0.0, 0, seed, null))
    {
    }

    private GalacticBinaryBandWorker(GalacticBinaryBandSettings settings, GalacticBinaryBandWindow window, GalacticBinaryToolPool tools, GalacticBinaryBandWorkerState state)
    {
        _settings = settings ?? throw new ArgumentNullException(nameof(settings));
        Window = window ?? throw new ArgumentNullException(nameof(window));
        _tools = tools ?? throw new ArgumentNullException(nameof(tools));
        if (Math.Abs(tools.FrequencyResolutionHz - window.DfHz) > 1e-9 * window.DfHz)
            throw new ArgumentException("the generator's bin spacing differs from the window's", nameof(tools));
        _prior = new GalacticBinarySourcePrior(window.SourceStartHz, window.SourceEndHz, settings.MinFrequencyDerivativeHzS,
            settings.MaxFrequencyDerivativeHzS, new SnrAmplitudePrior(settings.SnrPriorPeak, settings.SnrMax));
        _state = state;
    }

    /// <summary>Recreates a worker from <see cref="SaveState"/> bytes.</summary>
    /// <param name="settings">The settings of the original worker.</param>
    /// <param name="window">Its plan entry.</param>
    /// <param name="generator">A template generator for the same data record.</param>
    /// <param name="state">The saved bytes.</param>
    /// <returns>The worker, ready to continue.</returns>
    /// <exception cref="ArgumentException">The state belongs to another window.</exception>
    public static GalacticBinaryBandWorker Restore(GalacticBinaryBandSettings settings, GalacticBinaryBandWindow window, GalacticBinaryTemplateGenerator generator, ReadOnlyMemory<byte> state) =>
        Restore(settings, window, new GalacticBinaryToolPool(generator), state);

    /// <summary>Recreates a worker from <see cref="SaveState"/> bytes, borrowing its generator from <paramref name="tools"/>.</summary>
    /// <param name="settings">The settings of the original worker.</param>
    /// <param name="window">Its plan entry.</param>
    /// <param name="tools">Generators for the same data record.</param>
    /// <param name="state">The saved bytes.</param>
    /// <returns>The worker, ready to continue.</returns>
    /// <exception cref="ArgumentException">The state belongs to another window.</exception>
    public static GalacticBinaryBandWorker Restore(GalacticBinaryBandSettings settings, GalacticBinaryBandWindow window, GalacticBinaryToolPool tools, ReadOnlyMemory<byte> state)
    {
        ArgumentNullException.ThrowIfNull(window);
        var saved = MessagePackSerializer.Deserialize<GalacticBinaryBandWorkerState>(state, MessagePackSerializerOptions.Standard);
        if (saved.WindowIndex != window.Index)
            throw new ArgumentException($"state of window {saved.WindowIndex} given to window {window.Index}", nameof(state));
        return new GalacticBinaryBandWorker(settings, window, tools, saved);
    }

    /// <summary>The window this worker samples.</summary>
    public GalacticBinaryBandWindow Window { get; }

    /// <summary>Whether the worker reads channel T [<c>include_t</c>].</summary>
    public bool IncludesT => _settings.IncludeT;

    /// <summary>Updates run so far.</summary>
    public long Updates => _state.Updates;

    /// <summary>s, the SNR per unit amplitude of the amplitude prior; 0 before the first update.</summary>
    public double SnrScale => _state.SnrScale;

    /// <summary>The whole state as MessagePack bytes.</summary>
    public byte[] SaveState() => MessagePackSerializer.Serialize(_state, MessagePackSerializerOptions.Standard);

    /// <summary>Runs <paramref name="steps"/> sampler steps against <paramref name="residual"/>.</summary>
    /// <param name="residual">The data minus everything not held by this worker, over <see cref="GalacticBinaryBandWindow.Padded"/>,
    /// with T exactly when <c>include_t</c> is set. Read during the call only.</param>
    /// <param name="steps">Number of steps, ≥ 1.</param>
    /// <returns>The templates, cold samples and statistics of the update.</returns>
    /// <exception cref="ArgumentException">The residual covers other bins, has another spacing, or the wrong channels.</exception>
    public GalacticBinaryBandUpdate Update(GalacticBinaryBand residual, int steps)
    {
        ArgumentNullException.ThrowIfNull(residual);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(steps);
        if (residual.Window != Window.Padded)
            throw new ArgumentException($"residual covers bins {residual.Window}, the window needs {Window.Padded}", nameof(residual));
        if (residual.IncludesT != _settings.IncludeT)
            throw new ArgumentException($"residual {(residual.IncludesT ? "has" : "lacks")} channel T but include_t is {_settings.IncludeT}", nameof(residual));
        if (Math.Abs(residual.DfHz - Window.DfHz) > 1e-9 * Window.DfHz)
            throw new ArgumentException("residual bin spacing differs from the window's", nameof(residual));
        var clock = Stopwatch.StartNew();
        var phases = new BandUpdateClock();
        long mark = BandUpdateClock.Now(), nested = 0;
        // Closes the part that ran since the last lap; parts nested in it (a Fisher matrix while a proposal is built, a
        // likelihood while chains are re-scored) keep their own time.
        void Lap(BandUpdatePhase phase)
        {
            mark = phases.AddExclusive(phase, mark, nested);
            nested = phases.NestedTicks();
        }
        using var tools = _tools.Rent();
        var generator = tools.Generator;
        var statistic = tools.Statistic;
        double snrScale = _state.SnrScale > 0
            ? _state.SnrScale
            : GalacticBinaryBandModel.AverageSnrPerUnitAmplitude(generator, residual, 0.5 * (Window.CoreStartHz + Window.CoreEndHz));
        int chains = _settings.TemperatureCount * _settings.ChainsPerTemperature;
        var model = new GalacticBinaryBandModel(generator, Prior(snrScale), residual, snrScale, _settings.MaxSourcesPerWindow,
            4 * chains * _settings.MaxSourcesPerWindow + 256) { Clock = phases };
        Lap(BandUpdatePhase.ModelSetup);
        // Births and the starting search cover the core only: a source enters a drift margin only by moving there, and is
        // handed to the neighbour that owns it; were births allowed in the margins, two windows would fit the same signal.
        var grid = FStatisticGrid.ForWindow(Window.Core, Window.DfHz, _settings.FStatisticCellsPerBin,
            _settings.MinFrequencyDerivativeHzS, _settings.MaxFrequencyDerivativeHzS, 1,
            _settings.FStatisticLatitudeCells, _settings.FStatisticLongitudeCells);
        var map = new FStatisticCellDensity(FStatisticMap.Compute(statistic, residual, grid), MapUniformFraction);
        Lap(BandUpdatePhase.FStatisticMap);
        var birth = new GalacticBinaryBirthDensity(statistic, residual, map, snrScale) { Clock = phases };
        var fisher = new GalacticBinarySourceFisher(generator, residual, snrScale, _prior.Schema, 8 * chains * _settings.MaxSourcesPerWindow + 256) { Clock = phases };
        var samplerSettings = SamplerSettings(fisher, birth, DopplerSkyJumpProposal.Spec(0.5, birth,
            DopplerSkyJumpProposal.Geometry(generator.Orbits, generator.StartSeconds, generator.DurationSeconds), snrScale,
            Window.SourceStartHz, Window.SourceEndHz));
        Lap(BandUpdatePhase.ProposalSetup);
        var start = _state.Sampler;
        if (start is null)
        {
            var empty = new ReversibleJumpSampler<GalacticBinaryBandModel>(model, birth, samplerSettings).CaptureState();
            Lap(BandUpdatePhase.ModelSetup);
            start = Seeded(empty, GreedyFStatisticSearch.Run(statistic, residual, grid, _settings.MaxSourcesPerWindow), snrScale);
            Lap(BandUpdatePhase.GreedySearch);
        }
        var rescored = Rescored(start, model);
        Lap(BandUpdatePhase.Rescoring);
        var sampler = ReversibleJumpSampler<GalacticBinaryBandModel>.Resume(model, birth, samplerSettings, rescored);
        var collector = new SampleCollector(_settings.SampleInterval, snrScale, phases);
        Lap(BandUpdatePhase.ModelSetup);
        sampler.Advance(steps, collector);
        Lap(BandUpdatePhase.Proposals);
        var captured = sampler.CaptureState();
        _state = _state with { SnrScale = snrScale, Updates = _state.Updates + 1, Sampler = captured };
        Lap(BandUpdatePhase.StateCapture);
        var template = Template(generator);
        Lap(BandUpdatePhase.OutputTemplate);
        clock.Stop();
        var statistics = new GalacticBinaryBandStatistics(steps, sampler.Step, sampler.SourceCount(0), sampler.LogLikelihood(0),
            clock.Elapsed, sampler.GetStatistics()) { Phases = phases.Snapshot() };
        return new GalacticBinaryBandUpdate(Window.Index, template, collector.Samples.ToImmutable(), statistics);
    }

    // The galaxy sky needs the SNR scale, known from the first update on; it is rebuilt (deterministically) once per worker.
    private GalacticBinarySourcePrior Prior(double snrScale)
    {
        if (_settings.SkyPrior != GalacticBinaryBandSettings.GalaxySky) return _prior;
        if (_galaxyPrior is null || _galaxyPriorScale != snrScale)
        {
            var sky = new GalacticSkyDensity(GalacticPopulationSettings.Defaults, 0.5 * (Window.CoreStartHz + Window.CoreEndHz), snrScale,
                Math.Max(_settings.CatalogueMinSnr, 1.0));
            (_galaxyPrior, _galaxyPriorScale) = (_prior.WithSky(sky), snrScale);
        }
        return _galaxyPrior;
    }

    /// <summary>The sources of the first cold chain now.</summary>
    public ImmutableArray<GalacticBinaryParameters> CurrentSources()
    {
        if (_state.Sampler is null) return [];
        return ToParameters(_state.Sampler.Sources[0], _state.Sampler.SourceCounts[0], _state.SnrScale);
    }

    /// <summary>The summed templates of the first cold chain's sources now (all zero before the first update). Call it
    /// again after <see cref="TakeDriftedSources"/> or <see cref="Adopt"/>, which change the sources.</summary>
    public WindowSpectra CurrentTemplate()
    {
        using var tools = _tools.Rent();
        return Template(tools.Generator);
    }

    private WindowSpectra Template(GalacticBinaryTemplateGenerator generator)
    {
        var a = new Complex[Window.Padded.Count];
        var e = new Complex[Window.Padded.Count];
        var t = _settings.IncludeT ? new Complex[Window.Padded.Count] : null;
        foreach (var source in CurrentSources()) generator.AddResponse(source, Window.Padded, a, e, t);
        return new WindowSpectra(Window.Padded, a, e, t);
    }

    /// <summary>Removes from every chain the sources whose f0 has left the core (into a drift margin) and returns them,
    /// for <see cref="Adopt"/> on the neighbouring worker before either runs its next update.</summary>
    /// <remarks>Moving a source between windows is a relabelling between Gibbs blocks, not a Metropolis move; it keeps
    /// each source owned by exactly one window (the architecture's rule) at the cost of strict detailed balance at the
    /// seam, as in the band-by-band schemes this design follows.</remarks>
    public IReadOnlyList<DriftedSource> TakeDriftedSources()
    {
        var drifted = new List<DriftedSource>();
        var sampler = _state.Sampler;
        if (sampler is null) return drifted;
        const int d = GalacticBinarySourceVector.Dimension;
        for (int c = 0; c < sampler.SourceCounts.Length; c++)
        {
            double[] sources = sampler.Sources[c];
            int kept = 0;
            for (int j = 0; j < sampler.SourceCounts[c]; j++)
            {
                double f0 = sources[j * d];
                if (Window.OwnsFrequency(f0))
                {
                    if (kept != j) Array.Copy(sources, j * d, sources, kept * d, d);
                    kept++;
                }
                else
                {
                    int target = f0 < Window.CoreStartHz ? Window.Index - 1 : Window.Index + 1;
                    drifted.Add(new DriftedSource(c, target, GalacticBinarySourceVector.ToParameters(sources.AsSpan(j * d, d), _state.SnrScale)));
                }
            }
            sampler.SourceCounts[c] = kept;
        }
        return drifted;
    }

    /// <summary>Takes over sources handed on by a neighbour's <see cref="TakeDriftedSources"/>.</summary>
    /// <param name="sources">Sources whose <see cref="DriftedSource.TargetWindow"/> is this window.</param>
    /// <returns>How many were adopted. A source is dropped (the births will find it again if it is real) when this worker
    /// has not run an update yet, the chain is full, or the source lies outside this worker's prior.</returns>
    /// <exception cref="ArgumentException">A source is addressed to another window or chain index out of range.</exception>
    public int Adopt(IEnumerable<DriftedSource> sources)
    {
        ArgumentNullException.ThrowIfNull(sources);
        var sampler = _state.Sampler;
        int adopted = 0;
        Span<double> values = stackalloc double[GalacticBinarySourceVector.Dimension];
        foreach (var source in sources)
        {
            if (source.TargetWindow != Window.Index)
                throw new ArgumentException($"source for window {source.TargetWindow} given to window {Window.Index}", nameof(sources));
            if (sampler is null) continue;
            if (source.Chain < 0 || source.Chain >= sampler.SourceCounts.Length)
                throw new ArgumentException($"chain {source.Chain} does not exist", nameof(sources));
            int count = sampler.SourceCounts[source.Chain];
            if (count >= _settings.MaxSourcesPerWindow) continue;
            GalacticBinarySourceVector.FromParameters(source.Source, _state.SnrScale, values);
            if (!(_prior.LogPrior(values) > double.NegativeInfinity)) continue;
            values.CopyTo(sampler.Sources[source.Chain].AsSpan(count * GalacticBinarySourceVector.Dimension));
            sampler.SourceCounts[source.Chain] = count + 1;
            adopted++;
        }
        return adopted;
    }

    private ReversibleJumpSettings SamplerSettings(GalacticBinarySourceFisher fisher, GalacticBinaryBirthDensity birth, ProposalSpec skyJump) => new()
    {
        Tempering = new TemperingSettings
        {
            TemperatureCount = _settings.TemperatureCount,
            ChainsPerTemperature = _settings.ChainsPerTemperature,
            MaxTemperature = _settings.MaxTemperature,
        },
        WithinProposals =
        [
            LocalFisherGaussianProposal.Spec(0.3, fisher),
            ProposalSpec.FisherEigen(0.1, fisher, _settings.FisherRefreshSteps),
            ProposalSpec.DifferentialEvolution(0.1),
            ProposalSpec.AdaptiveGaussian(0.05),
            skyJump,
            BirthDensityJumpProposal.Spec(0.1, birth),
        ],
        MaxSources = _settings.MaxSourcesPerWindow,
        JumpProbability = _settings.JumpProbability,
        SplitMergeProbability = _settings.SplitMergeProbability,
        SplitMerge = new GalacticBinarySplitMerge(_settings.SplitMergeBins * Window.DfHz,
            _settings.MaxFrequencyDerivativeHzS - _settings.MinFrequencyDerivativeHzS),
        Seed = _state.Seed,
        StreamId = (ulong)Window.Index,
    };

    // Every chain of a new worker starts from the sources of the greedy search that lie in the prior.
    private ReversibleJumpState Seeded(ReversibleJumpState empty, List<GalacticBinaryParameters> found, double snrScale)
    {
        const int d = GalacticBinarySourceVector.Dimension;
        Span<double> values = stackalloc double[d];
        for (int c = 0; c < empty.SourceCounts.Length; c++)
        {
            int count = 0;
            foreach (var source in found)
            {
                GalacticBinarySourceVector.FromParameters(source, snrScale, values);
                if (!(_prior.LogPrior(values) > double.NegativeInfinity)) continue;
                values.CopyTo(empty.Sources[c].AsSpan(count * d, d));
                count++;
            }
            empty.SourceCounts[c] = count;
        }
        return empty;
    }

    // The residual changed since the state was saved (other windows moved), so every chain's ln L and ln prior are
    // recomputed before the sampler continues; sources handed over by TakeDriftedSources/Adopt are scored here too.
    private static ReversibleJumpState Rescored(ReversibleJumpState state, GalacticBinaryBandModel model)
    {
        int chains = state.SourceCounts.Length;
        var logLikelihoods = new double[chains];
        var logPriors = new double[chains];
        const int d = GalacticBinarySourceVector.Dimension;
        for (int c = 0; c < chains; c++)
        {
            int count = state.SourceCounts[c];
            var sources = state.Sources[c].AsSpan(0, count * d);
            double logPrior = model.LogCountPrior(count);
            for (int j = 0; j < count; j++) logPrior += model.SourcePrior.LogPrior(sources.Slice(j * d, d));
            logPriors[c] = logPrior;
            logLikelihoods[c] = model.LogLikelihood(sources, count);
        }
        return state with { LogLikelihoods = logLikelihoods, LogPriors = logPriors };
    }

    private static ImmutableArray<GalacticBinaryParameters> ToParameters(ReadOnlySpan<double> sources, int count, double snrScale)
    {
        var result = ImmutableArray.CreateBuilder<GalacticBinaryParameters>(count);
        for (int j = 0; j < count; j++)
            result.Add(GalacticBinarySourceVector.ToParameters(sources.Slice(j * GalacticBinarySourceVector.Dimension, GalacticBinarySourceVector.Dimension), snrScale));
        return result.MoveToImmutable();
    }

    private sealed class SampleCollector(int interval, double snrScale, BandUpdateClock clock) : ITransdimensionalSampleSink
    {
        public ImmutableArray<GalacticBinarySample>.Builder Samples { get; } = ImmutableArray.CreateBuilder<GalacticBinarySample>();

        public void OnSample(long step, int replica, int sourceCount, ReadOnlySpan<double> sources, double logLikelihood, double logPrior)
        {
            if (replica != 0 || step % interval != 0) return;
            long started = BandUpdateClock.Now();
            Samples.Add(new GalacticBinarySample(step, ToParameters(sources, sourceCount, snrScale), logLikelihood));
            clock.Add(BandUpdatePhase.SampleCollection, started);
        }
    }
}
