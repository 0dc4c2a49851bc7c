using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>A semi-coherent detection statistic for inspirals: the record is cut into equal time segments, the
/// template's amplitude and phase are maximised analytically in each, and the segment powers are summed.</summary>
/// <remarks>
/// <para><c>ρ²_sc = Σ_m |⟨d|h_m⟩|² / (h_m|h_m)</c>, with h_m the template restricted to segment m
/// (<see cref="ExtremeMassRatioInspiralTemplateGenerator.AddSegmentResponse"/>) and ⟨a|b⟩ = 4Δf Σ a b* / S the complex
/// inner product (A and E added). Maximising the log-likelihood <c>Re(a* ⟨d|h_m⟩) − ½|a|²(h_m|h_m)</c> over a complex
/// amplitude a per segment gives ½ of each term, so ρ²_sc/2 is the log-likelihood maximised over one free amplitude and
/// phase per segment (the semi-coherent idea of Gair, Barack, Creighton, Cutler, Larson, Phinney &amp; Vallisneri 2004,
/// Class. Quantum Grav. 21, S1595, arXiv:gr-qc/0405137, for inspirals; reference from memory). A template that keeps
/// phase only over a segment, not over the whole record, still collects the power: the statistic tolerates parameter
/// errors that a coherent template would not.</para>
/// <para>In Gaussian noise alone ρ²_sc follows χ² with 2M degrees of freedom (M segments; the real and imaginary part
/// of each ⟨n|h_m⟩ have variance (h_m|h_m)), mean 2M; with the true signal it grows by about the squared optimal SNR.
/// Segments are taken as independent, which holds when they are much longer than the inverse bandwidth of the noise
/// weighting.</para>
/// <para>Not thread-safe; allocation-free after construction.</para>
/// </remarks>
public sealed class SemiCoherentStatistic
{
    private readonly ExtremeMassRatioInspiralTemplateGenerator _generator;
    private readonly Complex[] _dataA, _dataE, _templateA, _templateE;
    private readonly double[] _inverseA, _inverseE;
    private BinWindow _dirty;

    /// <summary>Creates the statistic over <paramref name="window"/> with <paramref name="segmentCount"/> equal segments.</summary>
    /// <exception cref="ArgumentException">A length differs from the window's.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The segment count is not positive.</exception>
    public SemiCoherentStatistic(
        ExtremeMassRatioInspiralTemplateGenerator generator, BinWindow window, int segmentCount,
        Complex[] dataA, Complex[] dataE, double[] inverseA, double[] inverseE)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(segmentCount);
        if (dataA.Length != window.Count || dataE.Length != window.Count || inverseA.Length != window.Count || inverseE.Length != window.Count)
            throw new ArgumentException($"data and inverse PSDs must hold {window.Count} bins");
        _generator = generator;
        Window = window;
        SegmentCount = segmentCount;
        _dataA = dataA; _dataE = dataE; _inverseA = inverseA; _inverseE = inverseE;
        _templateA = new Complex[window.Count];
        _templateE = new Complex[window.Count];
    }

    /// <summary>Bins of the data.</summary>
    public BinWindow Window { get; }

    /// <summary>Number of segments M.</summary>
    public int SegmentCount { get; }

    /// <summary>ρ²_sc for <paramref name="parameters"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid.</exception>
    public double Evaluate(in ExtremeMassRatioInspiralParameters parameters)
    {
        double total = 0;
        double length = _generator.DurationSeconds / SegmentCount;
        double df = _generator.FrequencyResolutionHz;
        for (int m = 0; m < SegmentCount; m++)
        {
            if (_dirty.Count > 0)
            {
                _templateA.AsSpan(_dirty.First - Window.First, _dirty.Count).Clear();
                _templateE.AsSpan(_dirty.First - Window.First, _dirty.Count).Clear();
            }
            double end = m == SegmentCount - 1 ? _generator.DurationSeconds : (m + 1) * length;
            _generator.AddSegmentResponse(parameters, m * length, end, Window, _templateA, _templateE);
            _dirty = _generator.LastTemplateBins.Intersect(Window);
            if (_dirty.Count == 0) continue;
            int o = _dirty.First - Window.First, n = _dirty.Count;
            Complex dh = InnerProduct.ComplexProduct(_dataA.AsSpan(o, n), _templateA.AsSpan(o, n), _inverseA.AsSpan(o, n), df)
                       + InnerProduct.ComplexProduct(_dataE.AsSpan(o, n), _templateE.AsSpan(o, n), _inverseE.AsSpan(o, n), df);
            double hh = InnerProduct.SquaredNorm(_templateA.AsSpan(o, n), _inverseA.AsSpan(o, n), df)
                      + InnerProduct.SquaredNorm(_templateE.AsSpan(o, n), _inverseE.AsSpan(o, n), df);
            if (hh > 0) total += (dh.Real * dh.Real + dh.Imaginary * dh.Imaginary) / hh;
        }
        return total;
    }
}
