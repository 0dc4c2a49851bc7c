using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The log-likelihood ratio <c>(d|h) − ½(h|h)</c> of an inspiral against A and E data on a window of bins.</summary>
/// <remarks>
/// <para>Owns its template buffers; each evaluation clears only the bins the previous template touched and sums the
/// inner products only over the bins the new one reaches, so the cost follows the template, not the window. The data
/// and inverse PSDs are referenced, not copied: the caller must not change them while the object is in use.</para>
/// <para>Not thread-safe (one per worker, with its own generator); allocation-free after construction.</para>
/// </remarks>
public sealed class ExtremeMassRatioInspiralLikelihood
{
    private readonly ExtremeMassRatioInspiralTemplateGenerator _generator;
    private readonly Complex[] _dataA, _dataE, _templateA, _templateE;
    private readonly double[] _inverseA, _inverseE;
    private BinWindow _dirty;

    /// <summary>Creates the likelihood over <paramref name="window"/>.</summary>
    /// <param name="generator">Template generator for the data record.</param>
    /// <param name="window">Bins of the data.</param>
    /// <param name="dataA">A data (window.Count bins).</param>
    /// <param name="dataE">E data.</param>
    /// <param name="inverseA">1/S_A per bin.</param>
    /// <param name="inverseE">1/S_E per bin.</param>
    /// <exception cref="ArgumentException">A length differs from the window's.</exception>
    public ExtremeMassRatioInspiralLikelihood(
        ExtremeMassRatioInspiralTemplateGenerator generator, BinWindow window,
        Complex[] dataA, Complex[] dataE, double[] inverseA, double[] inverseE)
    {
        ArgumentNullException.ThrowIfNull(generator);
        if (dataA.Length != window.Count || dataE.Length != window.Count || inverseA.Length != window.Count || inverseE.Length != window.Count)
            throw new ArgumentException($"data and inverse PSDs must hold {window.Count} bins");
        _generator = generator;
        Window = window;
        _dataA = dataA; _dataE = dataE; _inverseA = inverseA; _inverseE = inverseE;
        _templateA = new Complex[window.Count];
        _templateE = new Complex[window.Count];
    }

    /// <summary>Bins of the data.</summary>
    public BinWindow Window { get; }

    /// <summary><c>(d|h) − ½(h|h)</c> summed over A and E.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid (the caller's prior should have rejected
    /// them first).</exception>
    public double LogLikelihoodRatio(in ExtremeMassRatioInspiralParameters parameters)
    {
        if (_dirty.Count > 0)
        {
            _templateA.AsSpan(_dirty.First - Window.First, _dirty.Count).Clear();
            _templateE.AsSpan(_dirty.First - Window.First, _dirty.Count).Clear();
        }
        _generator.AddResponse(parameters, Window, _templateA, _templateE, Span<Complex>.Empty);
        _dirty = _generator.LastTemplateBins.Intersect(Window);
        if (_dirty.Count == 0) return 0.0;
        int o = _dirty.First - Window.First, n = _dirty.Count;
        double df = _generator.FrequencyResolutionHz;
        double dh = InnerProduct.Real(_dataA.AsSpan(o, n), _templateA.AsSpan(o, n), _inverseA.AsSpan(o, n), df)
                  + InnerProduct.Real(_dataE.AsSpan(o, n), _templateE.AsSpan(o, n), _inverseE.AsSpan(o, n), df);
        double hh = InnerProduct.SquaredNorm(_templateA.AsSpan(o, n), _inverseA.AsSpan(o, n), df)
                  + InnerProduct.SquaredNorm(_templateE.AsSpan(o, n), _inverseE.AsSpan(o, n), df);
        return dh - 0.5 * hh;
    }

    /// <summary>The template of the last evaluation (A, E over <see cref="Window"/>).</summary>
    public ReadOnlySpan<Complex> LastTemplateA => _templateA;

    /// <summary>The template of the last evaluation (E).</summary>
    public ReadOnlySpan<Complex> LastTemplateE => _templateE;
}
