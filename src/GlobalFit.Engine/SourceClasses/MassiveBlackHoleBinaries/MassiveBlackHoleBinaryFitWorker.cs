using System.Diagnostics;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Tempering;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>One massive black-hole binary of the global fit: finds it in its residual, then samples its eleven parameters by
/// parallel tempering on the heterodyned likelihood, and serves its template over the worker's window.</summary>
/// <remarks>
/// <para>First update: <see cref="MassiveBlackHoleBinarySearch.Run"/> seeds chirp mass, mass ratio, spins, t_c and distance from
/// the residual, <see cref="MassiveBlackHoleBinarySearch.RefineExtrinsic"/> sets sky, orientation, phase and distance (3000
/// draws); the result becomes the heterodyne reference and every chain starts there. Until <c>search_updates</c> updates have
/// run, each update searches its new residual again and restarts every chain at the new seed when that beats the first cold
/// chain on the full likelihood by more than <c>recentre_threshold</c> (a burn-in device: the first residual still holds
/// what the other classes had not yet fitted). Every update: the data summaries of the heterodyned likelihood are
/// rebuilt from the new residual (<see cref="MassiveBlackHoleBinaryHeterodynedLikelihood"/> around the saved reference),
/// every chain's ln L is recomputed against them, and the sampler continues from its saved state for the update's steps.
/// At the end, when the best cold sample of the update beats the reference by more than <c>recentre_threshold</c> in ln Λ,
/// and the full likelihood confirms the gain, that sample becomes the reference of the next update: the chain has drifted
/// and the reference follows it.</para>
/// <para>Proposals: Fisher-matrix jumps (weight 0.4; the matrix at the reference, recomputed when a chain's proposal
/// refreshes, every 1000 of its steps), differential evolution (0.3), the adaptive Gaussian (0.2) and the sky reflection
/// through the constellation's plane (0.1). Chain c of worker i draws from (run seed, <see cref="StreamBase"/> + i, c).</para>
/// <para>The template served is the first cold chain's binary, rendered on every bin of the window with the frequencies
/// emitted before the data start set to zero, as the simulator injects it. Samples: every <c>sample_interval</c>-th step
/// of the first cold chain, one source per sample, in the columns of <see cref="MassiveBlackHoleBinaryParameters.ColumnNames"/>.
/// An update depends only on the saved state, the residual and the step count, so a restored worker continues bit for bit
/// and the thread count does not matter. Not thread-safe.</para>
/// </remarks>
public sealed class MassiveBlackHoleBinaryFitWorker : IFitWorker
{
    /// <summary>Stream id of worker 0 below the run seed ("MBHB" in ASCII, shifted): distinct from the small integers of the
    /// galactic-binary windows and from the noise worker's.</summary>
    public const ulong StreamBase = 0x4D4248420000;

    private const int FisherRefreshInterval = 1000;

    /// <summary>Draws of sky and orientation after the search (three heterodyned likelihoods each).</summary>
    private const int ExtrinsicDraws = 3000;

    /// <summary>Chain index of the refinement's stream, beyond any chain of the sampler.</summary>
    private const ulong RefineStream = 0xFFFF_0000;
    private static readonly string[] ParameterNames = [.. MassiveBlackHoleBinaryParameters.ColumnNames];

    private readonly MassiveBlackHoleBinaryFitSettings _settings;
    private readonly FitDataShape _shape;
    private readonly IConstellationOrbits _orbits;
    private readonly int _index;
    private readonly MassiveBlackHoleBinaryTemplateGenerator _generator;
    private MassiveBlackHoleBinaryWorkerState _state;
    private WindowSpectra? _template;

    /// <summary>Creates a worker (or restores one from <paramref name="state"/>).</summary>
    /// <param name="id">Worker id.</param>
    /// <param name="index">Worker index within the class (its random stream).</param>
    /// <param name="settings">The class's settings.</param>
    /// <param name="shape">The data record.</param>
    /// <param name="orbits">The constellation.</param>
    /// <param name="state">The saved state, or a fresh one.</param>
    public MassiveBlackHoleBinaryFitWorker(string id, int index, MassiveBlackHoleBinaryFitSettings settings, FitDataShape shape,
        IConstellationOrbits orbits, MassiveBlackHoleBinaryWorkerState state)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(orbits);
        ArgumentNullException.ThrowIfNull(state);
        Id = id;
        _index = index;
        _settings = settings;
        _shape = shape;
        _orbits = orbits;
        _state = state;
        Bins = settings.Window(shape);
        _generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, Bins.Count, shape.StartS);
    }

    /// <summary>Restores a worker from <see cref="SaveState"/> bytes.</summary>
    public static MassiveBlackHoleBinaryFitWorker Restore(string id, int index, MassiveBlackHoleBinaryFitSettings settings, FitDataShape shape,
        IConstellationOrbits orbits, ReadOnlyMemory<byte> state) =>
        new(id, index, settings, shape, orbits, MessagePackSerializer.Deserialize<MassiveBlackHoleBinaryWorkerState>(state, MessagePackSerializerOptions.Standard));

    /// <inheritdoc />
    public string Id { get; }

    /// <inheritdoc />
    public BinWindow Bins { get; }

    /// <inheritdoc />
    public bool IncludesT => _settings.IncludeT;

    /// <summary>The saved state (for tests and diagnostics).</summary>
    public MassiveBlackHoleBinaryWorkerState State => _state;

    /// <summary>The first cold chain's binary, or null before the first update.</summary>
    public MassiveBlackHoleBinaryParameters? Current =>
        _state.Sampler is { } s ? MassiveBlackHoleBinaryParameters.FromSpan(s.Positions.AsSpan(0, 11)) : null;

    /// <inheritdoc />
    public WorkerUpdate Update(WorkerResidual residual, int steps)
    {
        ArgumentNullException.ThrowIfNull(residual);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(steps);
        if (residual.Bins != Bins)
            throw new ArgumentException($"residual covers bins {residual.Bins}, worker {Id} needs {Bins}", nameof(residual));
        if ((residual.Spectra.T is not null) != IncludesT || (residual.InverseT is not null) != IncludesT)
            throw new ArgumentException($"residual {(residual.Spectra.T is null ? "lacks" : "has")} channel T but include_t is {IncludesT}", nameof(residual));
        var clock = Stopwatch.StartNew();
        var data = ToData(residual);
        var prior = _settings.Prior();
        var state = _state;
        bool restart = false;
        if (state.Reference is null)
        {
            var (seed, statistic) = Seed(data, prior, state.RunSeed, state.Updates);
            state = state with { Reference = seed.ToArray(), SearchStatistic = statistic };
        }
        else if (state.Sampler is { } before && state.Updates < _settings.SearchUpdates)
        {
            // Early updates search again: the first search saw a residual that the other classes had not yet cleaned (in
            // the first iteration the galactic-binary windows fit this binary's chirp too), and its seed may have led the
            // chains into a secondary mode along the mass–spin degeneracy. A new seed better on the full likelihood by more
            // than the re-centring threshold restarts every chain there.
            var (seed, statistic) = Seed(data, prior, state.RunSeed, state.Updates);
            var full = new MassiveBlackHoleBinaryLikelihood(_generator, data);
            double gain = full.LogLikelihoodRatio(seed) - full.LogLikelihoodRatio(MassiveBlackHoleBinaryParameters.FromSpan(before.Positions.AsSpan(0, 11)));
            if (gain > _settings.RecentreThreshold)
            {
                state = state with { Reference = seed.ToArray(), SearchStatistic = statistic, Restarts = state.Restarts + 1 };
                restart = true;
            }
        }
        var reference = MassiveBlackHoleBinaryParameters.FromSpan(state.Reference);
        var likelihood = new MassiveBlackHoleBinaryHeterodynedLikelihood(_generator, data, reference, _settings.PhaseStepRad);
        var target = new MassiveBlackHoleBinaryTarget(prior, likelihood);
        var fisher = new LazyFisher(() => new ReferenceFisher(_generator, data, reference));
        var samplerSettings = SamplerSettings(_settings, state.RunSeed, StreamBase + (ulong)_index, fisher, _orbits);
        var saved = state.Sampler is { } previous ? Rescored(target, previous) : Fresh(target, samplerSettings, state.Reference);
        var sampler = ParallelTemperingSampler<MassiveBlackHoleBinaryTarget>.Resume(target, samplerSettings, saved);
        if (restart)
            for (int c = 0; c < sampler.ChainCount; c++) sampler.SetPosition(c, state.Reference);
        var collector = new SampleCollector(_settings.SampleInterval, sampler.Step);
        sampler.Advance(steps, collector);

        int recentres = state.Recentres;
        double[] nextReference = state.Reference;
        if (collector.BestLogLikelihood - target.LogLikelihood(state.Reference) > _settings.RecentreThreshold)
        {
            // Far from the reference the heterodyned value can be wrong, so the full likelihood confirms the gain first.
            var full = new MassiveBlackHoleBinaryLikelihood(_generator, data);
            double gain = full.LogLikelihoodRatio(MassiveBlackHoleBinaryParameters.FromSpan(collector.Best)) - full.LogLikelihoodRatio(reference);
            if (gain > _settings.RecentreThreshold)
            {
                nextReference = collector.Best;
                recentres++;
            }
        }
        _state = state with { Updates = state.Updates + 1, Reference = nextReference, Recentres = recentres, Sampler = sampler.CaptureState() };
        _template = Render(MassiveBlackHoleBinaryParameters.FromSpan(sampler.Position(0)));
        clock.Stop();
        var statistics = new WorkerStatistics(steps, sampler.Step, 1, sampler.LogLikelihood(0), sampler.GetStatistics().ColdAcceptanceRate, clock.Elapsed);
        return new WorkerUpdate(_template, collector.ToBlock(Id), statistics);
    }

    /// <inheritdoc />
    public WindowSpectra? CurrentTemplate() => _template ??= Current is { } p ? Render(p) : WindowSpectra.Zero(Bins, IncludesT);

    /// <inheritdoc />
    public byte[] SaveState() => MessagePackSerializer.Serialize(_state, MessagePackSerializerOptions.Standard);

    /// <summary>None: a binary stays with its worker.</summary>
    public IReadOnlyList<Handover> TakeHandovers() => [];

    /// <summary>Refuses any handover: binaries are never handed between workers.</summary>
    /// <exception cref="InvalidOperationException"><paramref name="handovers"/> is not empty.</exception>
    public void Accept(IReadOnlyList<Handover> handovers)
    {
        ArgumentNullException.ThrowIfNull(handovers);
        if (handovers.Count > 0) throw new InvalidOperationException($"worker {Id} adopts no sources");
    }

    // The search's seed with sky, orientation, phase and distance set on the heterodyned likelihood around it.
    private (MassiveBlackHoleBinaryParameters Seed, double Statistic) Seed(MassiveBlackHoleBinaryData data, MassiveBlackHoleBinaryPrior prior, ulong runSeed, long update)
    {
        var found = MassiveBlackHoleBinarySearch.Run(_orbits, data, prior, _shape.DurationS, _settings.SearchChirpMassStep, _shape.StartS);
        var seed = found.Statistic > double.NegativeInfinity ? found.Seed : prior.FromUnitCube([0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5]);
        var likelihood = new MassiveBlackHoleBinaryHeterodynedLikelihood(_generator, data, seed, _settings.PhaseStepRad);
        var random = RandomStream.ForPath(runSeed, StreamBase + (ulong)_index, RefineStream + (ulong)update);
        return (MassiveBlackHoleBinarySearch.RefineExtrinsic(likelihood, seed, prior, ExtrinsicDraws, ref random).Best, found.Statistic);
    }

    private MassiveBlackHoleBinaryData ToData(WorkerResidual residual)
    {
        int n = Bins.Count;
        var spectra = residual.Spectra;
        return new MassiveBlackHoleBinaryData(Bins, residual.DfHz,
            [spectra.A, spectra.E, spectra.T ?? new Complex[n]],
            [residual.InverseA, residual.InverseE, residual.InverseT ?? new double[n]]);
    }

    private WindowSpectra Render(in MassiveBlackHoleBinaryParameters source)
    {
        var template = WindowSpectra.Zero(Bins, IncludesT);
        _generator.RenderBins(source, Bins, _shape.DfHz, template.A, template.E, template.T ?? Span<Complex>.Empty);
        return template;
    }

    /// <summary>The sampler settings of a worker (also used by the coverage tests, so they test what the fit runs).</summary>
    internal static ParallelTemperingSettings SamplerSettings(MassiveBlackHoleBinaryFitSettings settings, ulong runSeed, ulong streamId,
        Inference.Targets.IFisherInformation fisher, IConstellationOrbits orbits) => new()
    {
        Tempering = new TemperingSettings { TemperatureCount = settings.Temperatures, MaxTemperature = settings.MaxTemperature },
        Proposals =
        [
            ProposalSpec.FisherEigen(0.4, fisher, FisherRefreshInterval),
            ProposalSpec.DifferentialEvolution(0.3),
            ProposalSpec.AdaptiveGaussian(0.2),
            new ProposalSpec(SkyReflectionProposal.Name, 0.1, _ => new SkyReflectionProposal(orbits)),
        ],
        Seed = runSeed,
        StreamId = streamId,
    };

    // A new sampler draws its chains from the prior; every chain is moved to the seed instead.
    private static ParallelTemperingState Fresh(MassiveBlackHoleBinaryTarget target, ParallelTemperingSettings settings, double[] seed)
    {
        var sampler = new ParallelTemperingSampler<MassiveBlackHoleBinaryTarget>(target, settings);
        for (int c = 0; c < sampler.ChainCount; c++) sampler.SetPosition(c, seed);
        return sampler.CaptureState();
    }

    // The residual (and perhaps the reference) changed since the state was saved, so every chain's ln L is recomputed.
    private static ParallelTemperingState Rescored(MassiveBlackHoleBinaryTarget target, ParallelTemperingState state)
    {
        int chains = state.LogLikelihoods.Length;
        var logLikelihoods = new double[chains];
        for (int c = 0; c < chains; c++) logLikelihoods[c] = target.LogLikelihood(state.Positions.AsSpan(c * 11, 11));
        return state with { LogLikelihoods = logLikelihoods };
    }

    // The Fisher matrix is built on the first refresh of any chain's Fisher proposal in an update, not before: most
    // updates need none (22 templates over the whole window).
    private sealed class LazyFisher(Func<ReferenceFisher> build) : Inference.Targets.IFisherInformation
    {
        private ReferenceFisher? _fisher;

        public int Dimension => 11;

        public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix) => (_fisher ??= build()).FisherMatrix(theta, matrix);
    }

    // Keeps the first cold chain every interval-th step of the worker's life, and the best cold sample of the update.
    private sealed class SampleCollector(int interval, long startStep) : ISampleSink
    {
        private readonly List<double> _values = [];
        private readonly List<double> _logLikelihoods = [];

        public double BestLogLikelihood { get; private set; } = double.NegativeInfinity;

        public double[] Best { get; } = new double[11];

        public void OnSample(long step, int replica, ReadOnlySpan<double> position, double logLikelihood, double logPrior)
        {
            if (replica != 0) return;
            if (logLikelihood > BestLogLikelihood)
            {
                BestLogLikelihood = logLikelihood;
                position.CopyTo(Best);
            }
            if (step % interval != 0 || step <= startStep) return;
            for (int i = 0; i < position.Length; i++) _values.Add(position[i]);
            _logLikelihoods.Add(logLikelihood);
        }

        public SampleBlock ToBlock(string workerId)
        {
            var counts = new int[_logLikelihoods.Count];
            Array.Fill(counts, 1);
            return new SampleBlock(workerId, MassiveBlackHoleBinaryClass.Id, 0, ParameterNames, counts, [.. _values], [.. _logLikelihoods]);
        }
    }
}
