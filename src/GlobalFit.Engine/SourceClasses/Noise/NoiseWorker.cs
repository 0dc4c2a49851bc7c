using System.Diagnostics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Tempering;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise worker of the global fit: samples the instrument noise levels of each channel group and the
/// confusion-foreground amplitude against the full residual, and serves the resulting PSD to the engine.</summary>
/// <remarks>
/// <para>Model: A and E share one acceleration and one optical-metrology ASD; T (when <c>include_t</c>) has its own
/// pair; the foreground amplitude scales the published foreground in A and E (its T part is below 1e-8 of A's, see
/// <see cref="AetNoiseModel"/>, and is left out). Likelihood: Whittle over the bins of [f_min, f_max]
/// (<see cref="WhittleLikelihood"/>), one vectorised pass per group per evaluation. Prior: uniform (see
/// <see cref="NoiseFitSettings"/>).</para>
/// <para>Sample columns: <c>acceleration_asd_ae_m_s2_rthz</c>, <c>oms_asd_ae_m_rthz</c>[, <c>acceleration_asd_t_m_s2_rthz</c>, <c>oms_asd_t_m_rthz</c>] as ASDs (m s⁻² Hz^-1/2 and
/// m Hz^-1/2), [<c>foreground_amplitude_relative</c>] as a multiplier of the published foreground; one "source" per sample.</para>
/// <para>Each update finds the maximum-likelihood levels of its residual and the Fisher matrix there
/// (<see cref="NoiseModeFinder"/>), then continues the parallel-tempering sampler from its saved state with a
/// mixture of a Student-t independence move centred there (weight 0.6), a random walk shaped by it (0.3) and
/// differential evolution (0.1). Chains start at the configured levels. Every update, fresh or restored, goes
/// through the same save/resume path, so a restored worker given the same residual and steps continues bit for bit
/// (only the wall time differs). Chain c draws from RandomStream.ForPath(run seed, <see cref="StreamId"/>, c).</para>
/// <para>With <c>fit_levels = false</c> the levels stay at the configured values; updates only score them.</para>
/// <para>Not thread-safe. Holds about 9 doubles per fitted bin (≈ 70 MB for a year at 5 s up to 30 mHz).</para>
/// </remarks>
public sealed class NoiseWorker : IFitWorker, IPsdSource
{
    private const string WorkerId = NoiseClass.Id;
    private const string ClassId = NoiseClass.Id;

    /// <summary>The worker's stream id below the run seed ("NOISE" in ASCII), distinct from the small integers other
    /// workers use.</summary>
    public const ulong StreamId = 0x4E4F495345;

    private readonly NoiseFitSettings _settings;
    private readonly FitDataShape _shape;
    private readonly NoiseParameterLayout _layout;
    private readonly NoiseLevelModel _model;
    private NoiseWorkerState _state;
    private NoiseLevels _levels = null!;
    private AetNoiseModel _aeModel = null!;
    private InstrumentNoiseModel _tModel = null!;

    /// <summary>Creates a worker at the configured starting levels.</summary>
    /// <param name="settings">The <c>[noise]</c> settings.</param>
    /// <param name="shape">The data record.</param>
    /// <param name="runSeed">The run seed.</param>
    /// <exception cref="ArgumentException">The settings do not fit the record (see <see cref="NoiseFitSettings.Validate"/>).</exception>
    public NoiseWorker(NoiseFitSettings settings, FitDataShape shape, ulong runSeed)
        : this(settings, shape, new NoiseWorkerState(new NoiseParameterLayout(settings ?? throw new ArgumentNullException(nameof(settings))).Names, 0, runSeed, null))
    {
    }

    private NoiseWorker(NoiseFitSettings settings, FitDataShape shape, NoiseWorkerState state)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(shape);
        settings.Validate(shape);
        _settings = settings;
        _shape = shape;
        _layout = new NoiseParameterLayout(settings);
        if (!state.ParameterNames.AsSpan().SequenceEqual(_layout.Names))
            throw new ArgumentException($"state holds levels {string.Join(", ", state.ParameterNames)} but the settings fit {string.Join(", ", _layout.Names)}", nameof(state));
        Bins = settings.FittedBins(shape);
        var start = new InstrumentNoiseSettings(settings.AccelerationAsd, settings.OmsAsd);
        double[] startVector = _layout.StartVector();
        Span<double> coefficients = stackalloc double[3];
        _layout.AeCoefficients(startVector, coefficients);
        var ae = NoiseChannelGroup.Create(AetChannel.A, 2, Bins, shape.DfHz, start, settings.Foreground ? settings.ForegroundFitYears : null,
            coefficients[..(settings.Foreground ? 3 : 2)]);
        NoiseChannelGroup? t = null;
        if (settings.IncludeT)
        {
            _layout.TCoefficients(startVector, coefficients);
            t = NoiseChannelGroup.Create(AetChannel.T, 1, Bins, shape.DfHz, start, null, coefficients[..2]);
        }
        _model = new NoiseLevelModel(_layout, ae, t);
        _state = state;
        SetLevels(ColdPosition());
    }

    /// <summary>Recreates a worker from <see cref="SaveState"/> bytes.</summary>
    /// <param name="settings">The settings of the original worker.</param>
    /// <param name="shape">The same data record.</param>
    /// <param name="state">The saved bytes.</param>
    /// <returns>The worker, ready to continue.</returns>
    /// <exception cref="ArgumentException">The state was saved with settings that fit other levels.</exception>
    public static NoiseWorker Restore(NoiseFitSettings settings, FitDataShape shape, ReadOnlyMemory<byte> state)
    {
        var saved = MessagePackSerializer.Deserialize<NoiseWorkerState>(state, MessagePackSerializerOptions.Standard);
        return new NoiseWorker(settings, shape, saved);
    }

    /// <summary>The worker id: the class id, since a run has one noise worker.</summary>
    public string Id => WorkerId;

    /// <summary>The bins of [f_min, f_max] the worker reads (without DC and the Nyquist bin).</summary>
    public BinWindow Bins { get; }

    /// <summary>Whether the residual must carry channel T.</summary>
    public bool IncludesT => _settings.IncludeT;

    /// <summary>The sampled columns, in sample order.</summary>
    public IReadOnlyList<string> ParameterNames => _layout.Names;

    /// <summary>The cold chain's current levels.</summary>
    public NoiseLevels Levels => _levels;

    /// <summary>Updates run so far.</summary>
    public long Updates => _state.Updates;

    /// <summary>The whole state as MessagePack bytes.</summary>
    public byte[] SaveState() => MessagePackSerializer.Serialize(_state, MessagePackSerializerOptions.Standard);

    /// <summary>Runs <paramref name="steps"/> sampler steps against <paramref name="residual"/> (or, with
    /// <c>fit_levels = false</c>, scores the fixed levels).</summary>
    /// <param name="residual">The full residual over <see cref="Bins"/>, with T exactly when <c>include_t</c>.</param>
    /// <param name="steps">Steps, ≥ 1.</param>
    /// <returns>The samples, statistics and the new cold-chain levels.</returns>
    /// <exception cref="ArgumentException">The residual covers other bins or has the wrong channels.</exception>
    public NoiseUpdate Fit(WindowSpectra residual, int steps)
    {
        ArgumentNullException.ThrowIfNull(residual);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(steps);
        if (residual.Bins != Bins)
            throw new ArgumentException($"residual covers bins {residual.Bins}, the noise worker needs {Bins}", nameof(residual));
        if ((residual.T is not null) != _settings.IncludeT)
            throw new ArgumentException($"residual {(residual.T is null ? "lacks" : "has")} channel T but include_t is {_settings.IncludeT}", nameof(residual));
        if (residual.A.Length != Bins.Count || residual.E.Length != Bins.Count || (residual.T is not null && residual.T.Length != Bins.Count))
            throw new ArgumentException($"residual channels must hold {Bins.Count} bins", nameof(residual));
        var clock = Stopwatch.StartNew();
        _model.Ae.SetResidual(residual.A, residual.E);
        _model.T?.SetResidual(residual.T, default);
        return _settings.FitLevels ? Sample(steps, clock) : ScoreFixed(clock);
    }

    /// <summary>The engine's update: <see cref="Fit"/>, then the inverse PSDs of the new levels over every one-sided bin
    /// of the record, which weight every worker's residual from the next stage on.</summary>
    /// <param name="residual">Data minus every template over <see cref="Bins"/>.</param>
    /// <param name="steps">Steps, ≥ 1.</param>
    public WorkerUpdate Update(WorkerResidual residual, int steps)
    {
        ArgumentNullException.ThrowIfNull(residual);
        var update = Fit(residual.Spectra, steps);
        return new WorkerUpdate(null, update.Samples, update.Statistics, InversePsd.From(this, _shape.BinCount));
    }

    /// <summary>None: the noise worker holds no template.</summary>
    public WindowSpectra? CurrentTemplate() => null;

    /// <summary>None: the noise worker never hands anything on.</summary>
    public IReadOnlyList<Handover> TakeHandovers() => [];

    /// <summary>Refuses: nothing is ever handed to the noise worker.</summary>
    /// <exception cref="InvalidOperationException">Always, when <paramref name="handovers"/> is not empty.</exception>
    public void Accept(IReadOnlyList<Handover> handovers)
    {
        ArgumentNullException.ThrowIfNull(handovers);
        if (handovers.Count > 0) throw new InvalidOperationException("the noise worker adopts no sources");
    }

    /// <summary>Writes the current cold-chain PSD of <paramref name="channel"/> at any bins, from the model formula
    /// (<see cref="AetNoiseModel"/> for A and E, the instrument part for T); +∞ at f = 0.</summary>
    /// <param name="channel">A, E or T.</param>
    /// <param name="bins">The bins (f_k = k Δf of the record).</param>
    /// <param name="psd">Output, <paramref name="bins"/>.Count values (1/Hz).</param>
    public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
    {
        if (psd.Length != bins.Count) throw new ArgumentException($"psd must hold {bins.Count} values, has {psd.Length}", nameof(psd));
        double df = _shape.DfHz;
        if (channel == AetChannel.T)
        {
            for (int i = 0; i < psd.Length; i++) psd[i] = _tModel.Psd(AetChannel.T, (bins.First + i) * df);
            return;
        }
        for (int i = 0; i < psd.Length; i++) psd[i] = _aeModel.Psd(channel, (bins.First + i) * df);
    }

    private NoiseUpdate Sample(int steps, Stopwatch clock)
    {
        var start = ColdPosition();
        var approximation = NoiseModeFinder.Find(_model, _layout, _settings, start);
        var samplerSettings = SamplerSettings(approximation);
        var saved = _state.Sampler ?? Fresh(samplerSettings, start);
        var sampler = ParallelTemperingSampler<NoiseLevelModel>.Resume(_model, samplerSettings, Rescored(saved));
        var collector = new SampleCollector(_layout, _settings.SampleInterval);
        sampler.Advance(steps, collector);
        _state = _state with { Updates = _state.Updates + 1, Sampler = sampler.CaptureState() };
        SetLevels(sampler.Position(0));
        clock.Stop();
        var statistics = new WorkerStatistics(steps, sampler.Step, 0, sampler.LogLikelihood(0), sampler.GetStatistics().ColdAcceptanceRate, clock.Elapsed);
        return new NoiseUpdate(collector.ToBlock(), statistics, _levels);
    }

    private NoiseUpdate ScoreFixed(Stopwatch clock)
    {
        double[] levels = _layout.StartVector();
        double logLikelihood = _model.LogLikelihood(levels);
        var values = new double[levels.Length];
        _layout.ToReported(levels, values);
        _state = _state with { Updates = _state.Updates + 1 };
        clock.Stop();
        var block = new SampleBlock(WorkerId, ClassId, 0, _layout.Names, [1], values, [logLikelihood]);
        return new NoiseUpdate(block, new WorkerStatistics(0, 0, 0, logLikelihood, 0.0, clock.Elapsed), _levels);
    }

    private ParallelTemperingSettings SamplerSettings(LaplaceApproximation approximation) => new()
    {
        Tempering = new TemperingSettings { TemperatureCount = _settings.TemperatureCount, MaxTemperature = _settings.MaxTemperature },
        Proposals =
        [
            new ProposalSpec(LaplaceIndependenceProposal.Name, 0.6, context => new LaplaceIndependenceProposal(approximation, context.Temperature)),
            new ProposalSpec(LaplaceWalkProposal.Name, 0.3, context => new LaplaceWalkProposal(approximation, context.Temperature)),
            ProposalSpec.DifferentialEvolution(0.1),
        ],
        Seed = _state.RunSeed,
        StreamId = StreamId,
    };

    // A new sampler draws its chains from the prior; every chain is moved to the configured starting levels instead.
    private ParallelTemperingState Fresh(ParallelTemperingSettings samplerSettings, ReadOnlySpan<double> start)
    {
        var sampler = new ParallelTemperingSampler<NoiseLevelModel>(_model, samplerSettings);
        for (int c = 0; c < sampler.ChainCount; c++) sampler.SetPosition(c, start);
        return sampler.CaptureState();
    }

    // The residual changed since the state was saved (the sources moved), so every chain's ln L is recomputed first.
    private ParallelTemperingState Rescored(ParallelTemperingState state)
    {
        int d = _layout.Dimension;
        int chains = state.LogLikelihoods.Length;
        var logLikelihoods = new double[chains];
        for (int c = 0; c < chains; c++) logLikelihoods[c] = _model.LogLikelihood(state.Positions.AsSpan(c * d, d));
        return state with { LogLikelihoods = logLikelihoods };
    }

    private double[] ColdPosition() =>
        _state.Sampler is { } sampler ? sampler.Positions.AsSpan(0, _layout.Dimension).ToArray() : _layout.StartVector();

    private void SetLevels(ReadOnlySpan<double> theta)
    {
        _levels = _layout.ToLevels(theta);
        _aeModel = new AetNoiseModel(new InstrumentNoiseSettings(_levels.AccelerationAsdAe, _levels.OmsAsdAe),
            _settings.Foreground ? new GalacticConfusionSettings(_settings.ForegroundFitYears, _levels.ForegroundAmplitude) : null);
        _tModel = new InstrumentNoiseModel(new InstrumentNoiseSettings(_levels.AccelerationAsdT, _levels.OmsAsdT));
    }

    // Keeps the first cold replica's state every interval-th step of the worker's life, in reported units.
    private sealed class SampleCollector(NoiseParameterLayout layout, int interval) : ISampleSink
    {
        private readonly List<double> _values = [];
        private readonly List<double> _logLikelihoods = [];
        private readonly double[] _reported = new double[layout.Dimension];

        public void OnSample(long step, int replica, ReadOnlySpan<double> position, double logLikelihood, double logPrior)
        {
            if (replica != 0 || step % interval != 0) return;
            layout.ToReported(position, _reported);
            _values.AddRange(_reported);
            _logLikelihoods.Add(logLikelihood);
        }

        public SampleBlock ToBlock()
        {
            var counts = new int[_logLikelihoods.Count];
            Array.Fill(counts, 1);
            return new SampleBlock(WorkerId, ClassId, 0, layout.Names, counts, [.. _values], [.. _logLikelihoods]);
        }
    }
}
