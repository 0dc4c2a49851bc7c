using System.Numerics;
using GlobalFit.Inference.Targets;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The Fisher matrix of one galactic binary in the sampled coordinates, by central differences of its
/// templates over the window: <c>F_ij = (∂_i h | ∂_j h)</c>.</summary>
/// <remarks>The standard high-SNR approximation of the inverse posterior covariance (Cutler &amp; Flanagan 1994, PRD 49,
/// 2658, cited from memory; Cornish &amp; Crowder 2005, PRD 72, 043005, for this use as a proposal). 16 templates per
/// matrix. Steps: 10⁻³ bins in f0, 5 % of the prior width in ḟ (the phase π ḟ t² is linear in ḟ, so a large step costs no accuracy,
/// while a small one drowns the tiny derivative of a short record in the template's round-off), 10⁻⁴ relative in ρ̂ and 10⁻⁴ in the dimensionless and
/// angular coordinates. 1/width² of each prior range is added to the diagonal: parameters the data do not constrain
/// (ḟ over a short record) then get steps of the prior's size instead of the near-infinite steps of a singular matrix.
/// <para>Implementation notes (speed, no change of value): a matrix is cached per exact coordinate vector, because the
/// local-Fisher proposal asks for F at the current source and at the candidate, and a rejected candidate leaves the
/// current source to be asked for again (the cache is emptied when it holds <c>capacity</c> matrices); and the 16
/// templates and the 36 inner products cover only the union of the shifted templates' bins, not the whole padded window
/// (the bins outside hold zeros, which add exact zeros to the sums; the union starts at an even offset so that the
/// inner product's two accumulators receive the same terms).</para>
/// <para>Not thread-safe (it shares the worker's generator and owns scratch spectra).</para></remarks>
public sealed class GalacticBinarySourceFisher : IFisherInformation
{
    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly GalacticBinaryBand _band;
    private readonly double _snrScale;
    private readonly double _derivativeStep;
    private readonly Complex[][] _derivatives;
    private readonly double[] _shifted = new double[GalacticBinarySourceVector.Dimension];
    private readonly double[] _priorPrecision = new double[GalacticBinarySourceVector.Dimension];
    private readonly Dictionary<GalacticBinarySourceKey, double[]> _cache = [];
    private readonly Stack<double[]> _pool = new();
    private readonly int _cacheCapacity;
    private BinWindow _written;

    /// <summary>Creates the Fisher information of sources in <paramref name="band"/>.</summary>
    /// <param name="generator">The worker's generator.</param>
    /// <param name="band">The residual (for its window and inverse PSDs).</param>
    /// <param name="snrScale">s of the window.</param>
    /// <param name="schema">The prior's schema; 1/width² of each parameter is added to the diagonal.</param>
    /// <param name="cacheCapacity">Matrices kept before the cache is emptied (0: no cache).</param>
    public GalacticBinarySourceFisher(GalacticBinaryTemplateGenerator generator, GalacticBinaryBand band, double snrScale, Inference.Parameters.ParameterSchema schema,
        int cacheCapacity = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(cacheCapacity);
        _cacheCapacity = cacheCapacity;
        ArgumentNullException.ThrowIfNull(schema);
        for (int i = 0; i < _priorPrecision.Length; i++) _priorPrecision[i] = 1.0 / (schema.Parameters[i].Width * schema.Parameters[i].Width);
        double derivativeRangeHzS = schema.Parameters[GalacticBinarySourceVector.FrequencyDerivative].Width;
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        _band = band ?? throw new ArgumentNullException(nameof(band));
        _snrScale = snrScale;
        _derivativeStep = 0.05 * derivativeRangeHzS;
        int channels = band.IncludesT ? 3 : 2;
        _derivatives = new Complex[GalacticBinarySourceVector.Dimension * channels][];
        for (int i = 0; i < _derivatives.Length; i++) _derivatives[i] = new Complex[band.Window.Count];
    }

    /// <inheritdoc />
    public int Dimension => GalacticBinarySourceVector.Dimension;

    /// <summary>Where the Fisher matrices are timed.</summary>
    internal BandUpdateClock Clock { get; set; } = new();

    /// <inheritdoc />
    public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix)
    {
        long started = BandUpdateClock.Now();
        if (_cacheCapacity == 0)
        {
            Compute(theta, matrix);
        }
        else
        {
            var key = new GalacticBinarySourceKey(theta);
            if (!_cache.TryGetValue(key, out var cached))
            {
                if (_cache.Count >= _cacheCapacity)
                {
                    foreach (var value in _cache.Values) _pool.Push(value);
                    _cache.Clear();
                }
                cached = _pool.Count > 0 ? _pool.Pop() : new double[Dimension * Dimension];
                Compute(theta, cached);
                _cache.Add(key, cached);
            }
            cached.CopyTo(matrix);
        }
        Clock.Add(BandUpdatePhase.Fisher, started);
    }

    private void Compute(ReadOnlySpan<double> theta, Span<double> matrix)
    {
        int d = Dimension, channels = _band.IncludesT ? 3 : 2;
        // Bins written by the previous call are cleared; this call writes only inside `used`.
        var used = UsedBins(theta);
        int clearFrom = Math.Min(_written.First, used.First), clearTo = Math.Max(_written.End, used.End);
        if (_written.Count == 0) (clearFrom, clearTo) = (used.First, used.End);
        foreach (var buffer in _derivatives) buffer.AsSpan(clearFrom, clearTo - clearFrom).Clear();
        _written = used;
        for (int i = 0; i < d; i++)
        {
            double step = Step(i, theta);
            Span<Complex> a = _derivatives[i * channels], e = _derivatives[i * channels + 1];
            Span<Complex> t = channels == 3 ? _derivatives[i * channels + 2] : Span<Complex>.Empty;
            Render(theta, i, step, a, e, t);
            Scale(a.Slice(used.First, used.Count), -1.0);
            Scale(e.Slice(used.First, used.Count), -1.0);
            if (channels == 3) Scale(t.Slice(used.First, used.Count), -1.0);
            Render(theta, i, -step, a, e, t);
            // Now a = h(θ − δ) − h(θ + δ); the sign flips back in the division.
            double factor = -1.0 / (2.0 * step);
            Scale(a.Slice(used.First, used.Count), factor);
            Scale(e.Slice(used.First, used.Count), factor);
            if (channels == 3) Scale(t.Slice(used.First, used.Count), factor);
        }
        var inverseA = _band.InverseA.AsSpan(used.First, used.Count);
        var inverseE = _band.InverseE.AsSpan(used.First, used.Count);
        var inverseT = channels == 3 ? _band.InverseT.AsSpan(used.First, used.Count) : default;
        for (int i = 0; i < d; i++)
        {
            for (int j = i; j < d; j++)
            {
                double value = InnerProduct.Real(_derivatives[i * channels].AsSpan(used.First, used.Count), _derivatives[j * channels].AsSpan(used.First, used.Count), inverseA, _band.DfHz)
                    + InnerProduct.Real(_derivatives[i * channels + 1].AsSpan(used.First, used.Count), _derivatives[j * channels + 1].AsSpan(used.First, used.Count), inverseE, _band.DfHz);
                if (channels == 3)
                    value += InnerProduct.Real(_derivatives[i * channels + 2].AsSpan(used.First, used.Count), _derivatives[j * channels + 2].AsSpan(used.First, used.Count), inverseT, _band.DfHz);
                if (i == j) value += _priorPrecision[i];
                matrix[i * d + j] = value;
                matrix[j * d + i] = value;
            }
        }
    }

    // The union, over the 16 shifted sources, of their template bins inside the window, as offsets into the window; it
    // starts at an even offset (see the remarks) and is empty only if every template lies outside the window.
    private BinWindow UsedBins(ReadOnlySpan<double> theta)
    {
        int first = int.MaxValue, end = int.MinValue;
        for (int i = 0; i < Dimension; i++)
        {
            double step = Step(i, theta);
            foreach (double shift in (ReadOnlySpan<double>)[step, -step])
            {
                theta.CopyTo(_shifted);
                _shifted[i] += shift;
                var parameters = GalacticBinarySourceVector.ToParameters(_shifted, _snrScale);
                var bins = _generator.TemplateBins(parameters.FrequencyHz, parameters.FrequencyDerivativeHzS);
                first = Math.Min(first, bins.First);
                end = Math.Max(end, bins.End);
            }
        }
        first = Math.Max(first - _band.Window.First, 0);
        end = Math.Min(end - _band.Window.First, _band.Window.Count);
        if (end <= first) return new BinWindow(0, 0);
        first -= first % 2;
        return new BinWindow(first, end - first);
    }

    private double Step(int index, ReadOnlySpan<double> theta) => index switch
    {
        GalacticBinarySourceVector.Frequency => 1e-3 * _band.DfHz,
        GalacticBinarySourceVector.FrequencyDerivative => _derivativeStep,
        GalacticBinarySourceVector.Snr => 1e-4 * Math.Max(theta[index], 1.0),
        _ => 1e-4,
    };

    private void Render(ReadOnlySpan<double> theta, int index, double step, Span<Complex> a, Span<Complex> e, Span<Complex> t)
    {
        theta.CopyTo(_shifted);
        _shifted[index] += step;
        _generator.AddResponse(GalacticBinarySourceVector.ToParameters(_shifted, _snrScale), _band.Window, a, e, t);
    }

    private static void Scale(Span<Complex> values, double factor)
    {
        for (int k = 0; k < values.Length; k++) values[k] *= factor;
    }
}
