using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Inspiral rows compared by the overlap of their A and E templates over the bins both reach, weighted by the
/// fit's final noise model, without maximisation over time or phase; threshold 0.5, as for galactic binaries. An
/// injection is covered when its template reaches a bin of some worker's window (the fit only follows inspirals it was
/// given a starting row for).</summary>
/// <remarks>A template costs a few milliseconds, so a comparison of one source (16 posterior samples) takes a fraction
/// of a second. Not thread-safe (one generator).</remarks>
internal sealed class InspiralMatcher : ISourceMatcher
{
    private readonly ExtremeMassRatioInspiralTemplateGenerator _generator;
    private readonly IPsdSource _noise;
    private readonly ImmutableArray<BinWindow> _windows;

    /// <summary>Creates the matcher.</summary>
    /// <param name="generator">Template generator of the data record (used by this matcher alone).</param>
    /// <param name="noise">The noise model weighting the overlap.</param>
    /// <param name="windows">The workers' windows.</param>
    public InspiralMatcher(ExtremeMassRatioInspiralTemplateGenerator generator, IPsdSource noise, ImmutableArray<BinWindow> windows)
    {
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        _noise = noise ?? throw new ArgumentNullException(nameof(noise));
        _windows = windows;
        Rule = string.Create(CultureInfo.InvariantCulture,
            $"same inspiral when the noise-weighted overlap of the A and E templates, (h1|h2)/sqrt((h1|h1)(h2|h2)) without maximisation over time or phase, is at least {Threshold}; covered: the template reaches a bin of one of the {windows.Length} inspiral workers' windows");
    }

    public ImmutableArray<string> ParameterColumns => P.ColumnNames;

    // Longitude, φ_K, Φ0, γ̃0 and α0 are periodic (the catalogue summarises them around their circular mean).
    public ImmutableArray<double> Periods { get; } =
        [.. Enumerable.Range(0, 14).Select(c => InspiralSamplingCoordinates.IsPeriodic(c) ? 2 * Math.PI : 0.0)];

    public double Threshold => 0.5;

    public string Rule { get; }

    public bool Covers(ReadOnlySpan<double> row)
    {
        var reach = Reach(P.FromSpan(row));
        foreach (var window in _windows)
            if (reach.Intersect(window).Count > 0) return true;
        return false;
    }

    public double Overlap(ReadOnlySpan<double> first, ReadOnlySpan<double> second)
    {
        var (one, two) = (P.FromSpan(first), P.FromSpan(second));
        var (binsOne, binsTwo) = (Reach(one), Reach(two));
        if (binsOne.Count == 0 || binsTwo.Count == 0) return 0.0;
        var union = new BinWindow(Math.Min(binsOne.First, binsTwo.First), Math.Max(binsOne.End, binsTwo.End) - Math.Min(binsOne.First, binsTwo.First));
        if (binsOne.Intersect(binsTwo).Count == 0) return 0.0;
        var (a1, e1, a2, e2) = (new Complex[union.Count], new Complex[union.Count], new Complex[union.Count], new Complex[union.Count]);
        _generator.AddResponse(one, union, a1, e1, Span<Complex>.Empty);
        _generator.AddResponse(two, union, a2, e2, Span<Complex>.Empty);
        var (inverseA, inverseE) = (new double[union.Count], new double[union.Count]);
        InversePsd.Fill(_noise, AetChannel.A, union, inverseA);
        InversePsd.Fill(_noise, AetChannel.E, union, inverseE);
        double df = _generator.FrequencyResolutionHz;
        double product = InnerProduct.Real(a1, a2, inverseA, df) + InnerProduct.Real(e1, e2, inverseE, df);
        double norms = (InnerProduct.SquaredNorm(a1, inverseA, df) + InnerProduct.SquaredNorm(e1, inverseE, df))
            * (InnerProduct.SquaredNorm(a2, inverseA, df) + InnerProduct.SquaredNorm(e2, inverseE, df));
        return norms > 0 ? product / Math.Sqrt(norms) : 0.0;
    }

    // The bins a row's template reaches; none for parameters the template cannot be built for.
    private BinWindow Reach(in P p)
    {
        try
        {
            return _generator.TemplateBins(p);
        }
        catch (ArgumentOutOfRangeException)
        {
            return default;
        }
    }
}
