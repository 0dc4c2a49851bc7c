using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Galactic-binary rows compared by the overlap of their A and E templates over the analysed bins, weighted by
/// the fit's final noise model: the same overlap (no maximisation over time or phase) and the same threshold, 0.5, that
/// associate samples into catalogue sources (<see cref="CatalogueBuilder"/>). A source is covered when its f0 lies in a
/// window's core, the bins the fit gave a worker to own.</summary>
/// <remarks>Rows are in <see cref="GalacticBinaryParameters.ColumnNames"/> order; a ninth column, when present, is
/// <c>fddot_hz_s2</c>. Not thread-safe (it reuses its template buffers).</remarks>
internal sealed class GalacticBinaryMatcher : ISourceMatcher
{
    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly BinWindow _bins;
    private readonly double _coreStartHz;
    private readonly double _coreEndHz;
    private readonly double[] _inverseA;
    private readonly double[] _inverseE;
    private readonly Complex[][] _scratch;

    /// <summary>Creates the matcher.</summary>
    /// <param name="generator">Template generator of the data record (used by this matcher alone).</param>
    /// <param name="bins">The analysed bins.</param>
    /// <param name="coreStartHz">Lowest frequency a window owns.</param>
    /// <param name="coreEndHz">End of the highest window's core.</param>
    /// <param name="noise">The noise model weighting the overlap.</param>
    public GalacticBinaryMatcher(GalacticBinaryTemplateGenerator generator, BinWindow bins, double coreStartHz, double coreEndHz, IPsdSource noise)
    {
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        ArgumentNullException.ThrowIfNull(noise);
        _bins = bins;
        _coreStartHz = coreStartHz;
        _coreEndHz = coreEndHz;
        _inverseA = new double[bins.Count];
        _inverseE = new double[bins.Count];
        InversePsd.Fill(noise, AetChannel.A, bins, _inverseA);
        InversePsd.Fill(noise, AetChannel.E, bins, _inverseE);
        _scratch = [.. Enumerable.Range(0, 4).Select(_ => new Complex[generator.MaximumEnvelopeLength])];
        Rule = string.Create(CultureInfo.InvariantCulture,
            $"same source when the noise-weighted overlap of the A and E templates, (h1|h2)/sqrt((h1|h1)(h2|h2)) without maximisation over time or phase, is at least {Threshold}; covered: f0 in {coreStartHz * 1e3:F4}-{coreEndHz * 1e3:F4} mHz");
    }

    public ImmutableArray<string> ParameterColumns => GalacticBinaryParameters.ColumnNames;

    // λ on [0, 2π), ψ on [0, π), φ0 on [0, 2π): the ranges the catalogue summarises them on.
    public ImmutableArray<double> Periods { get; } = [0, 0, 0, 0, 2 * Math.PI, 0, Math.PI, 2 * Math.PI];

    public double Threshold => 0.5;

    public string Rule { get; }

    public bool Covers(ReadOnlySpan<double> row) => row[0] >= _coreStartHz && row[0] < _coreEndHz;

    public double Overlap(ReadOnlySpan<double> first, ReadOnlySpan<double> second)
    {
        var one = Parameters(first);
        var two = Parameters(second);
        var binsOne = _generator.TemplateBins(one.FrequencyHz, one.FrequencyDerivativeHzS).Intersect(_bins);
        var binsTwo = _generator.TemplateBins(two.FrequencyHz, two.FrequencyDerivativeHzS).Intersect(_bins);
        var shared = binsOne.Intersect(binsTwo);
        if (shared.Count == 0) return 0.0;
        double normOne = Template(one, binsOne, _scratch[0], _scratch[1]);
        double normTwo = Template(two, binsTwo, _scratch[2], _scratch[3]);
        if (normOne <= 0 || normTwo <= 0) return 0.0;
        int i = shared.First - binsOne.First, j = shared.First - binsTwo.First, w = shared.First - _bins.First;
        double df = _generator.FrequencyResolutionHz;
        double product = InnerProduct.Real(_scratch[0].AsSpan(i, shared.Count), _scratch[2].AsSpan(j, shared.Count), _inverseA.AsSpan(w, shared.Count), df)
            + InnerProduct.Real(_scratch[1].AsSpan(i, shared.Count), _scratch[3].AsSpan(j, shared.Count), _inverseE.AsSpan(w, shared.Count), df);
        return product / Math.Sqrt(normOne * normTwo);
    }

    private static GalacticBinaryParameters Parameters(ReadOnlySpan<double> row)
    {
        var p = GalacticBinaryParameters.FromRow(row);
        return row.Length > ColumnMap.Width ? p with { SecondFrequencyDerivativeHzS2 = row[ColumnMap.Width] } : p;
    }

    // Writes the template into a and e (from index 0) and returns its squared norm.
    private double Template(in GalacticBinaryParameters source, BinWindow bins, Complex[] a, Complex[] e)
    {
        var spanA = a.AsSpan(0, bins.Count);
        var spanE = e.AsSpan(0, bins.Count);
        spanA.Clear();
        spanE.Clear();
        if (bins.Count == 0) return 0.0;
        _generator.AddResponse(source, bins, spanA, spanE, Span<Complex>.Empty);
        int offset = bins.First - _bins.First;
        double df = _generator.FrequencyResolutionHz;
        return InnerProduct.SquaredNorm(spanA, _inverseA.AsSpan(offset, bins.Count), df)
            + InnerProduct.SquaredNorm(spanE, _inverseE.AsSpan(offset, bins.Count), df);
    }
}
