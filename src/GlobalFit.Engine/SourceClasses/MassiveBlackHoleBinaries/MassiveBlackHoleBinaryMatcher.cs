using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Massive black-hole binary rows compared by the overlap of their A and E templates over the workers' window,
/// weighted by the fit's final noise model, without maximisation over time or phase; the same source at an overlap of
/// 0.5 or more. A binary is covered when its merger time lies in the fit's t_c range.</summary>
/// <remarks>The threshold is that of the galactic-binary matcher: two templates that share more than half their noise-weighted
/// power are one signal (a binary in a secondary sky mode of the posterior still overlaps the truth at 0.9 or more, while
/// two different mergers a day apart share nothing). Rows in <see cref="MassiveBlackHoleBinaryParameters.ColumnNames"/> order.
/// Each overlap renders two templates over the window. Not thread-safe (it reuses its buffers).</remarks>
internal sealed class MassiveBlackHoleBinaryMatcher : ISourceMatcher
{
    private readonly MassiveBlackHoleBinaryTemplateGenerator _generator;
    private readonly BinWindow _window;
    private readonly double _dfHz;
    private readonly double _tcMinS;
    private readonly double _tcMaxS;
    private readonly double[] _inverseA;
    private readonly double[] _inverseE;
    private readonly Complex[][] _scratch;

    public MassiveBlackHoleBinaryMatcher(IConstellationOrbits orbits, FitDataShape shape, MassiveBlackHoleBinaryFitSettings settings, IPsdSource noise)
    {
        ArgumentNullException.ThrowIfNull(noise);
        _window = settings.Window(shape);
        _dfHz = shape.DfHz;
        _tcMinS = settings.CoalescenceMinS;
        _tcMaxS = settings.CoalescenceMaxS;
        _generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, _window.Count, shape.StartS);
        _inverseA = new double[_window.Count];
        _inverseE = new double[_window.Count];
        InversePsd.Fill(noise, AetChannel.A, _window, _inverseA);
        InversePsd.Fill(noise, AetChannel.E, _window, _inverseE);
        _scratch = [.. Enumerable.Range(0, 4).Select(_ => new Complex[_window.Count])];
        Rule = string.Create(CultureInfo.InvariantCulture,
            $"same binary when the noise-weighted overlap of the A and E templates over {settings.MinFrequencyHz * 1e3:G3}-{settings.MaxFrequencyHz * 1e3:G3} mHz, (h1|h2)/sqrt((h1|h1)(h2|h2)) without maximisation over time or phase, is at least {Threshold}; covered: t_c in {_tcMinS:F0}-{_tcMaxS:F0} s");
    }

    public ImmutableArray<string> ParameterColumns => MassiveBlackHoleBinaryParameters.ColumnNames;

    // λ on [0, 2π), ψ on [0, π), φ_ref on [0, 2π): the sampler's periodic ranges.
    public ImmutableArray<double> Periods { get; } = [0, 0, 0, 0, 0, 0, 0, 2 * Math.PI, 0, Math.PI, 2 * Math.PI];

    public double Threshold => 0.5;

    public string Rule { get; }

    public bool Covers(ReadOnlySpan<double> row) => row[4] >= _tcMinS && row[4] <= _tcMaxS;

    public double Overlap(ReadOnlySpan<double> first, ReadOnlySpan<double> second)
    {
        double normOne = Template(MassiveBlackHoleBinaryParameters.FromSpan(first), _scratch[0], _scratch[1]);
        double normTwo = Template(MassiveBlackHoleBinaryParameters.FromSpan(second), _scratch[2], _scratch[3]);
        if (!(normOne > 0) || !(normTwo > 0)) return 0.0;
        double product = InnerProduct.Real(_scratch[0], _scratch[2], _inverseA, _dfHz) + InnerProduct.Real(_scratch[1], _scratch[3], _inverseE, _dfHz);
        return product / Math.Sqrt(normOne * normTwo);
    }

    // Writes the template into a and e and returns its squared norm; a row the waveform refuses has none.
    private double Template(in MassiveBlackHoleBinaryParameters source, Complex[] a, Complex[] e)
    {
        try
        {
            _generator.RenderBins(source, _window, _dfHz, a, e, Span<Complex>.Empty);
        }
        catch (ArgumentOutOfRangeException)
        {
            return 0.0;
        }
        return InnerProduct.SquaredNorm(a, _inverseA, _dfHz) + InnerProduct.SquaredNorm(e, _inverseE, _dfHz);
    }
}
