using System.Numerics;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Transdimensional;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The transdimensional model of one band window: a variable number of galactic binaries against the window's
/// residual (the data minus every source the other windows hold).</summary>
/// <remarks>
/// <para>ln L(θ_1..θ_k) = (d|h) − ½(h|h) with h = Σ_j h_j, the log-likelihood ratio against the empty model on the
/// window's bins (Gaussian-noise likelihood with the inner product of Cutler &amp; Flanagan 1994; the constant −½(d|d) is dropped, which leaves every
/// acceptance ratio unchanged). Expanded as <c>Σ_j [(d|h_j) − ½(h_j|h_j)] − Σ_{j&lt;l} (h_j|h_l)</c>, so a proposal
/// that moves one source renders one template: the template of every source vector seen recently is kept, keyed by
/// its exact coordinates, with its two inner products. Pair terms are summed only over the bins two templates share.
/// The cache changes no value (rendering is deterministic), so runs stay bit-reproducible.</para>
/// <para>Not thread-safe (it shares the worker's template generator).</para>
/// </remarks>
public sealed class GalacticBinaryBandModel : ITransdimensionalModel
{
    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly GalacticBinarySourcePrior _prior;
    private readonly GalacticBinaryBand _band;
    private readonly Dictionary<GalacticBinarySourceKey, CachedTemplate> _cache = [];
    private readonly Stack<CachedTemplate> _pool = new();
    private readonly int _cacheCapacity;
    private readonly CachedTemplate[] _current;

    /// <summary>Creates the model.</summary>
    /// <param name="generator">The worker's template generator.</param>
    /// <param name="prior">The source prior.</param>
    /// <param name="band">The residual over the window's padded bins (read, not copied; must not change during a run).</param>
    /// <param name="snrScale">s, optimal SNR per unit amplitude (see <see cref="GalacticBinarySourceVector"/>).</param>
    /// <param name="maxSources">Cap on sources per configuration.</param>
    /// <param name="cacheCapacity">Templates kept before the cache is emptied.</param>
    public GalacticBinaryBandModel(GalacticBinaryTemplateGenerator generator, GalacticBinarySourcePrior prior, GalacticBinaryBand band,
        double snrScale, int maxSources, int cacheCapacity)
    {
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        _prior = prior ?? throw new ArgumentNullException(nameof(prior));
        _band = band ?? throw new ArgumentNullException(nameof(band));
        if (!(snrScale > 0) || !double.IsFinite(snrScale))
            throw new ArgumentOutOfRangeException(nameof(snrScale), snrScale, "SNR scale must be positive and finite");
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(maxSources);
        SnrScale = snrScale;
        _cacheCapacity = Math.Max(cacheCapacity, 2 * maxSources);
        _current = new CachedTemplate[maxSources];
    }

    /// <summary>Where the model's time is accumulated (template, likelihood, assembly and pair terms).</summary>
    internal BandUpdateClock Clock { get; set; } = new();

    /// <inheritdoc />
    public ParameterSchema SourceSchema => _prior.Schema;

    /// <inheritdoc />
    public IPriorDensity SourcePrior => _prior;

    /// <summary>The residual the model is scored against.</summary>
    public GalacticBinaryBand Band => _band;

    /// <summary>s, optimal SNR per unit amplitude.</summary>
    public double SnrScale { get; }

    /// <summary>Uniform count prior on 0 … cap (the cap is the sampler's <see cref="ReversibleJumpSettings.MaxSources"/>).</summary>
    /// <param name="count">k.</param>
    /// <returns>−ln(cap + 1) inside, −∞ outside.</returns>
    public double LogCountPrior(int count) =>
        count >= 0 && count <= _current.Length ? -Math.Log(_current.Length + 1) : double.NegativeInfinity;

    /// <inheritdoc />
    public double LogLikelihood(ReadOnlySpan<double> sources, int count)
    {
        if (count > _current.Length) return double.NegativeInfinity;
        var clock = Clock;
        long started = BandUpdateClock.Now();
        long kernelBefore = clock.Ticks(BandUpdatePhase.Template) + clock.Ticks(BandUpdatePhase.Likelihood);
        if (_cache.Count + count > _cacheCapacity) EmptyCache();
        double sum = 0;
        for (int j = 0; j < count; j++)
        {
            var template = Template(sources.Slice(j * GalacticBinarySourceVector.Dimension, GalacticBinarySourceVector.Dimension));
            _current[j] = template;
            sum += template.DataOverlap - 0.5 * template.SquaredNorm;
        }
        long assembled = clock.Add(BandUpdatePhase.LikelihoodAssembly, started);
        clock.AddTicks(BandUpdatePhase.LikelihoodAssembly,
            kernelBefore - clock.Ticks(BandUpdatePhase.Template) - clock.Ticks(BandUpdatePhase.Likelihood));
        for (int j = 0; j < count; j++)
            for (int l = j + 1; l < count; l++)
                sum -= CrossTerm(_current[j], _current[l]);
        Array.Clear(_current, 0, count);
        clock.Add(BandUpdatePhase.PairTerms, assembled);
        return sum;
    }

    /// <summary>Adds the A, E (and T) templates of <paramref name="count"/> sources to spectra over the band's bins.</summary>
    /// <param name="sources">count × 8 sampled coordinates.</param>
    /// <param name="count">k.</param>
    /// <param name="a">Channel A over <see cref="GalacticBinaryBand.Window"/>.</param>
    /// <param name="e">Channel E.</param>
    /// <param name="t">Channel T, or empty.</param>
    public void AddTemplates(ReadOnlySpan<double> sources, int count, Span<Complex> a, Span<Complex> e, Span<Complex> t)
    {
        for (int j = 0; j < count; j++)
        {
            var parameters = GalacticBinarySourceVector.ToParameters(sources.Slice(j * GalacticBinarySourceVector.Dimension, GalacticBinarySourceVector.Dimension), SnrScale);
            _generator.AddResponse(parameters, _band.Window, a, e, t);
        }
    }

    /// <summary>The sky- and orientation-averaged optimal SNR of a unit-amplitude source at <paramref name="frequencyHz"/>,
    /// with the inverse PSDs of <paramref name="band"/>.</summary>
    /// <param name="generator">Template generator.</param>
    /// <param name="band">Band giving the inverse PSDs (its data are not used).</param>
    /// <param name="frequencyHz">f0, inside the band.</param>
    /// <returns>√⟨ρ²⟩ over 32 sky points (a Fibonacci lattice, equal area), 4 values of cos ι (mid-points of [−1, 1])
    /// and ψ ∈ {0, π/4} (ρ² is a quadratic form in (cos 2ψ, sin 2ψ), so two orthogonal values average it exactly).</returns>
    public static double AverageSnrPerUnitAmplitude(GalacticBinaryTemplateGenerator generator, GalacticBinaryBand band, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(band);
        const int skyPoints = 32;
        double goldenAngle = Math.PI * (3.0 - Math.Sqrt(5.0));
        double sum = 0;
        int count = 0;
        for (int i = 0; i < skyPoints; i++)
        {
            double beta = Math.Asin(1.0 - (2.0 * i + 1.0) / skyPoints);
            double lambda = (i * goldenAngle) % (2.0 * Math.PI);
            for (int c = 0; c < 4; c++)
            {
                double iota = Math.Acos(-1.0 + (2.0 * c + 1.0) / 4.0);
                for (int p = 0; p < 2; p++)
                {
                    var source = new GalacticBinaryParameters(frequencyHz, 0.0, 1.0, beta, lambda, iota, p * 0.25 * Math.PI, 0.0);
                    sum += SquaredNorm(generator.Render(source, band.IncludesT), band);
                    count++;
                }
            }
        }
        return Math.Sqrt(sum / count);
    }

    private CachedTemplate Template(ReadOnlySpan<double> values)
    {
        var key = new GalacticBinarySourceKey(values);
        if (_cache.TryGetValue(key, out var cached)) return cached;
        long started = BandUpdateClock.Now();
        // A cached template holds only its overlap with the band, so the band's width bounds it (a year-long template
        // can be 4096 bins; a band window is a few hundred).
        var template = _pool.Count > 0 ? _pool.Pop() : new CachedTemplate(Math.Min(_generator.MaximumEnvelopeLength, _band.Window.Count), _band.IncludesT);
        var view = _generator.Render(GalacticBinarySourceVector.ToParameters(values, SnrScale), _band.IncludesT);
        var overlap = _band.Window.Intersect(new BinWindow(view.FirstBin, view.Count));
        template.Offset = overlap.First - _band.Window.First;
        template.Count = overlap.Count;
        int from = overlap.First - view.FirstBin;
        view.A.Slice(from, overlap.Count).CopyTo(template.A);
        view.E.Slice(from, overlap.Count).CopyTo(template.E);
        if (_band.IncludesT) view.T.Slice(from, overlap.Count).CopyTo(template.T);
        long rendered = Clock.Add(BandUpdatePhase.Template, started);
        double dataOverlap = 0, norm = 0;
        Accumulate(template, _band.DataA, _band.InverseA, template.A, ref dataOverlap, ref norm);
        Accumulate(template, _band.DataE, _band.InverseE, template.E, ref dataOverlap, ref norm);
        if (_band.IncludesT) Accumulate(template, _band.DataT!, _band.InverseT!, template.T, ref dataOverlap, ref norm);
        template.DataOverlap = 4.0 * _band.DfHz * dataOverlap;
        template.SquaredNorm = 4.0 * _band.DfHz * norm;
        _cache.Add(key, template);
        Clock.Add(BandUpdatePhase.Likelihood, rendered);
        return template;
    }

    private static void Accumulate(CachedTemplate template, Complex[] data, double[] inverse, Complex[] h, ref double dataOverlap, ref double norm)
    {
        for (int k = 0; k < template.Count; k++)
        {
            double w = inverse[template.Offset + k];
            Complex d = data[template.Offset + k], x = h[k];
            dataOverlap += w * (d.Real * x.Real + d.Imaginary * x.Imaginary);
            norm += w * (x.Real * x.Real + x.Imaginary * x.Imaginary);
        }
    }

    private double CrossTerm(CachedTemplate first, CachedTemplate second)
    {
        int start = Math.Max(first.Offset, second.Offset);
        int end = Math.Min(first.Offset + first.Count, second.Offset + second.Count);
        if (end <= start) return 0.0;
        double sum = Cross(first, second, first.A, second.A, _band.InverseA, start, end)
            + Cross(first, second, first.E, second.E, _band.InverseE, start, end);
        if (_band.IncludesT) sum += Cross(first, second, first.T, second.T, _band.InverseT!, start, end);
        return 4.0 * _band.DfHz * sum;
    }

    private static double Cross(CachedTemplate first, CachedTemplate second, Complex[] x, Complex[] y, double[] inverse, int start, int end)
    {
        double sum = 0;
        for (int bin = start; bin < end; bin++)
        {
            Complex u = x[bin - first.Offset], v = y[bin - second.Offset];
            sum += inverse[bin] * (u.Real * v.Real + u.Imaginary * v.Imaginary);
        }
        return sum;
    }

    private static double SquaredNorm(GalacticBinaryTemplateView view, GalacticBinaryBand band)
    {
        var overlap = band.Window.Intersect(new BinWindow(view.FirstBin, view.Count));
        int offset = overlap.First - band.Window.First, from = overlap.First - view.FirstBin;
        double sum = InnerProduct.SquaredNorm(view.A.Slice(from, overlap.Count), band.InverseA.AsSpan(offset, overlap.Count), band.DfHz)
            + InnerProduct.SquaredNorm(view.E.Slice(from, overlap.Count), band.InverseE.AsSpan(offset, overlap.Count), band.DfHz);
        if (band.IncludesT)
            sum += InnerProduct.SquaredNorm(view.T.Slice(from, overlap.Count), band.InverseT.AsSpan(offset, overlap.Count), band.DfHz);
        return sum;
    }

    private void EmptyCache()
    {
        foreach (var template in _cache.Values) _pool.Push(template);
        _cache.Clear();
    }

    private sealed class CachedTemplate(int capacity, bool includeT)
    {
        public Complex[] A { get; } = new Complex[capacity];
        public Complex[] E { get; } = new Complex[capacity];
        public Complex[] T { get; } = includeT ? new Complex[capacity] : [];
        public int Offset { get; set; }
        public int Count { get; set; }
        public double DataOverlap { get; set; }
        public double SquaredNorm { get; set; }
    }
}
