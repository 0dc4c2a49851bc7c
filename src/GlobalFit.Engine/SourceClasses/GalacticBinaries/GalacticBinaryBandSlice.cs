using System.Collections.Immutable;
using System.Diagnostics;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A short galactic-binary fit of a few neighbouring band windows on invented frequency-domain data, run the way
/// the engine runs it (even windows, then odd ones, each against the data minus the other windows' templates, drifted
/// sources handed on after each iteration, state serialised after each update) but without actors, to measure what a
/// window-update costs: <c>globalfit bench</c>'s year-long slice and the band-update benchmarks.</summary>
/// <remarks>
/// <para>Invented data: stationary Gaussian noise of the default instrument model (no foreground) drawn directly on the
/// windows' bins (each of the real and imaginary parts has variance S/(4Δf), so that ⟨(n|h)²⟩ = (h|h)), plus binaries
/// spread uniformly over the bins with optimal SNRs ρ = ρ_min u^(−1/α), α = 1.5 and ρ_min = 1 (about 3 % above SNR 10),
/// random sky, orientation and phase, and ḟ uniform in [0, ½ ḟ_max]. The density of sources is the caller's (the
/// issue's year at 3–3.5 mHz holds about 320 per 256-bin window).</para>
/// <para>Not thread-safe; <see cref="Run"/> itself runs a stage's windows on up to <c>threads</c> threads, as the
/// compute dispatcher does.</para>
/// </remarks>
public sealed class GalacticBinaryBandSlice
{
    private readonly GalacticBinaryToolPool _tools;
    private readonly GalacticBinaryBandWorker[] _workers;
    private readonly WindowSpectra[] _templates;
    private readonly Complex[] _a;
    private readonly Complex[] _e;
    private readonly double[] _inverseA;
    private readonly double[] _inverseE;
    private readonly BinWindow _bins;
    private readonly double _dfHz;

    /// <summary>Builds the data and one fresh worker per window.</summary>
    /// <param name="settings">Band settings; <see cref="GalacticBinaryBandSettings.MinFrequencyHz"/> is where the slice
    /// starts, and the range is replaced by <paramref name="windows"/> whole windows from there.</param>
    /// <param name="durationDays">Length of the invented record, days.</param>
    /// <param name="cadenceSeconds">Its sampling interval, s.</param>
    /// <param name="windows">Number of windows, ≥ 2.</param>
    /// <param name="sourcesPerWindow">Invented binaries per window core, ≥ 0.</param>
    /// <param name="seed">Seed of the data and of the fit.</param>
    /// <exception cref="ArgumentOutOfRangeException">A count or length is out of range.</exception>
    public GalacticBinaryBandSlice(GalacticBinaryBandSettings settings, double durationDays, double cadenceSeconds, int windows, int sourcesPerWindow, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentOutOfRangeException.ThrowIfLessThan(windows, 2);
        ArgumentOutOfRangeException.ThrowIfNegative(sourcesPerWindow);
        if (!(durationDays > 0)) throw new ArgumentOutOfRangeException(nameof(durationDays), durationDays, "must be positive");
        var generator = new GalacticBinaryTemplateGenerator(durationDays * 86400.0, cadenceSeconds);
        _dfHz = generator.FrequencyResolutionHz;
        double start = Math.Floor(settings.MinFrequencyHz / _dfHz) * _dfHz;
        Settings = settings with { MinFrequencyHz = start, MaxFrequencyHz = start + (windows * settings.WindowBins - 0.5) * _dfHz };
        Plan = GalacticBinaryBandPlan.Create(Settings, generator);
        _bins = new BinWindow(Plan.Windows[0].Padded.First, Plan.Windows[^1].Padded.End - Plan.Windows[0].Padded.First);
        _a = new Complex[_bins.Count];
        _e = new Complex[_bins.Count];
        _inverseA = new double[_bins.Count];
        _inverseE = new double[_bins.Count];
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var random = RandomStream.ForPath(seed, 0x5_11CE, 1);
        for (int k = 0; k < _bins.Count; k++)
        {
            double f = (_bins.First + k) * _dfHz, sa = noise.PsdA(f), se = noise.PsdE(f);
            _inverseA[k] = 1.0 / sa;
            _inverseE[k] = 1.0 / se;
            double sigmaA = Math.Sqrt(sa / (4.0 * _dfHz)), sigmaE = Math.Sqrt(se / (4.0 * _dfHz));
            _a[k] = new Complex(sigmaA * random.NextGaussian(), sigmaA * random.NextGaussian());
            _e[k] = new Complex(sigmaE * random.NextGaussian(), sigmaE * random.NextGaussian());
        }
        var sources = ImmutableArray.CreateBuilder<GalacticBinaryParameters>();
        double first = Plan.Windows[0].CoreStartHz, last = Plan.Windows[^1].CoreEndHz;
        for (int i = 0; i < sourcesPerWindow * windows; i++)
        {
            var shape = new GalacticBinaryParameters(random.NextUniform(first, last), random.NextUniform(0, 0.5 * settings.MaxFrequencyDerivativeHzS), 1.0,
                Math.Asin(random.NextUniform(-1, 1)), random.NextUniform(0, 2 * Math.PI), Math.Acos(random.NextUniform(-1, 1)),
                random.NextUniform(0, Math.PI), random.NextUniform(0, 2 * Math.PI));
            double snr = Math.Min(Math.Pow(1.0 - random.NextDouble(), -1.0 / 1.5), 200.0);
            var source = shape with { Amplitude = snr / UnitSnr(generator, shape) };
            generator.AddResponse(source, _bins, _a, _e, Span<Complex>.Empty);
            sources.Add(source);
        }
        Sources = sources.ToImmutable();
        _tools = new GalacticBinaryToolPool(generator);
        _workers = [.. Plan.Windows.Select(w => new GalacticBinaryBandWorker(Settings, w, _tools, seed))];
        _templates = [.. _workers.Select(w => w.CurrentTemplate())];
    }

    /// <summary>The settings the workers run with (the slice's range filled in).</summary>
    public GalacticBinaryBandSettings Settings { get; }

    /// <summary>The slice's windows.</summary>
    public GalacticBinaryBandPlan Plan { get; }

    /// <summary>The invented binaries.</summary>
    public ImmutableArray<GalacticBinaryParameters> Sources { get; }

    /// <summary>Runs <paramref name="iterations"/> iterations of <paramref name="steps"/> steps per window update.</summary>
    /// <param name="iterations">Iterations, ≥ 1.</param>
    /// <param name="steps">Steps per update, ≥ 1.</param>
    /// <param name="threads">Threads a stage's windows are spread over, ≥ 1.</param>
    /// <returns>What the iterations cost.</returns>
    public GalacticBinaryBandSliceCost Run(int iterations, int steps, int threads)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(iterations);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(steps);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(threads);
        var phases = new List<WorkerPhaseTime>[_workers.Length];
        var computeMs = new double[_workers.Length];
        var stateMs = new double[_workers.Length];
        for (int w = 0; w < _workers.Length; w++) phases[w] = [];
        var options = new ParallelOptions { MaxDegreeOfParallelism = threads };
        long wallStarted = Stopwatch.GetTimestamp();
        for (int iteration = 0; iteration < iterations; iteration++)
        {
            for (int stage = 0; stage < 2; stage++)
            {
                var windows = Plan.Stage(stage).ToList();
                var residuals = windows.Select(Residual).ToList();
                Parallel.For(0, windows.Count, options, i =>
                {
                    int index = windows[i].Index;
                    long started = Stopwatch.GetTimestamp();
                    var update = _workers[index].Update(residuals[i], steps);
                    long saving = Stopwatch.GetTimestamp();
                    _workers[index].SaveState();
                    long finished = Stopwatch.GetTimestamp();
                    _templates[index] = update.Template;
                    computeMs[index] += Stopwatch.GetElapsedTime(started, finished).TotalMilliseconds;
                    stateMs[index] += Stopwatch.GetElapsedTime(saving, finished).TotalMilliseconds;
                    phases[index].AddRange(update.Statistics.Phases);
                });
            }
            var drifted = _workers.SelectMany(w => w.TakeDriftedSources()).ToList();
            foreach (var group in drifted.GroupBy(d => d.TargetWindow)) _workers[group.Key].Adopt(group);
            for (int i = 0; i < _workers.Length; i++) _templates[i] = _workers[i].CurrentTemplate();
        }
        double wallSeconds = Stopwatch.GetElapsedTime(wallStarted).TotalSeconds;
        var totals = phases.SelectMany(p => p).GroupBy(p => p.Name)
            .Select(g => new WorkerPhaseTime(g.Key, g.Sum(p => p.Milliseconds), g.Sum(p => p.Count), g.First().IsKernel)).ToImmutableArray();
        return new GalacticBinaryBandSliceCost(iterations, _workers.Length, threads, wallSeconds, computeMs.Sum(), stateMs.Sum(), totals,
            _workers.Sum(w => w.CurrentSources().Length));
    }

    /// <summary>A copy of window <paramref name="index"/>'s worker as it stands (restored from its saved state), for timing
    /// one update again and again from the same start.</summary>
    /// <param name="index">Window index.</param>
    /// <returns>The copy.</returns>
    public GalacticBinaryBandWorker CopyOfWorker(int index) =>
        GalacticBinaryBandWorker.Restore(Settings, Plan.Windows[index], _tools, _workers[index].SaveState());

    /// <summary>Window <paramref name="index"/>'s residual now: the data minus the other windows' current templates.</summary>
    /// <param name="index">Window index.</param>
    /// <returns>A fresh copy.</returns>
    public GalacticBinaryBand ResidualOf(int index) => Residual(Plan.Windows[index]);

    /// <summary>SHA-256 of every worker's saved state in window order, hex: equal digests mean bit-identical fits.</summary>
    /// <returns>64 hex digits.</returns>
    public string StateDigest()
    {
        using var hash = System.Security.Cryptography.IncrementalHash.CreateHash(System.Security.Cryptography.HashAlgorithmName.SHA256);
        foreach (var worker in _workers) hash.AppendData(worker.SaveState());
        return Convert.ToHexString(hash.GetHashAndReset());
    }

    private GalacticBinaryBand Residual(GalacticBinaryBandWindow window)
    {
        int offset = window.Padded.First - _bins.First;
        var a = _a.AsSpan(offset, window.Padded.Count).ToArray();
        var e = _e.AsSpan(offset, window.Padded.Count).ToArray();
        foreach (var other in _templates)
        {
            if (other.Bins == window.Padded) continue;
            var shared = other.Bins.Intersect(window.Padded);
            for (int bin = shared.First; bin < shared.End; bin++)
            {
                a[bin - window.Padded.First] -= other.A[bin - other.Bins.First];
                e[bin - window.Padded.First] -= other.E[bin - other.Bins.First];
            }
        }
        return new GalacticBinaryBand(window.Padded, _dfHz, a, e,
            _inverseA.AsSpan(offset, window.Padded.Count).ToArray(), _inverseE.AsSpan(offset, window.Padded.Count).ToArray());
    }

    private double UnitSnr(GalacticBinaryTemplateGenerator generator, GalacticBinaryParameters source)
    {
        var view = generator.Render(source, includeT: false);
        var overlap = _bins.Intersect(new BinWindow(view.FirstBin, view.Count));
        int offset = overlap.First - _bins.First, from = overlap.First - view.FirstBin;
        double snr2 = InnerProduct.SquaredNorm(view.A.Slice(from, overlap.Count), _inverseA.AsSpan(offset, overlap.Count), _dfHz)
            + InnerProduct.SquaredNorm(view.E.Slice(from, overlap.Count), _inverseE.AsSpan(offset, overlap.Count), _dfHz);
        return Math.Sqrt(snr2);
    }
}

/// <summary>What <see cref="GalacticBinaryBandSlice.Run"/> cost.</summary>
/// <param name="Iterations">Iterations run.</param>
/// <param name="Windows">Windows of the slice.</param>
/// <param name="Threads">Threads a stage was spread over.</param>
/// <param name="WallSeconds">Wall-clock time of all iterations.</param>
/// <param name="ComputeMs">Σ compute of the window updates (state serialisation included).</param>
/// <param name="StateMs">Σ time serialising state.</param>
/// <param name="Phases">The updates' time breakdown, summed.</param>
/// <param name="SourcesHeld">Sources held by the first cold chains at the end.</param>
public sealed record GalacticBinaryBandSliceCost(int Iterations, int Windows, int Threads, double WallSeconds, double ComputeMs, double StateMs,
    ImmutableArray<WorkerPhaseTime> Phases, int SourcesHeld)
{
    /// <summary>Kernel time (template + likelihood) over compute time.</summary>
    public double Efficiency => ComputeMs > 0 ? Phases.Where(p => p.IsKernel).Sum(p => p.Milliseconds) / ComputeMs : 0;

    /// <summary>Compute of one window-update, core-seconds.</summary>
    public double CoreSecondsPerWindowUpdate => ComputeMs / 1000.0 / (Iterations * Windows);

    /// <summary>Wall time per window-update on <see cref="Threads"/> threads times the threads: what one window-update
    /// costs a machine of that many cores, waits and imbalance included, core-seconds.</summary>
    public double MachineCoreSecondsPerWindowUpdate => WallSeconds * Threads / (Iterations * Windows);
}
