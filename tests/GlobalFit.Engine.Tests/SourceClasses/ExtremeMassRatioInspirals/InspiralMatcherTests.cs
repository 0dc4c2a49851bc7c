using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

public class InspiralMatcherTests
{
    private static readonly P Source = InspiralFitFixture.Source;

    [Fact]
    public void A_row_overlaps_itself_fully_and_a_row_out_of_phase_or_elsewhere_much_less()
    {
        var plan = InspiralFitFixture.Plan("", ("a", Source));
        var matcher = plan.CreateMatcher(new DefaultNoise(InspiralFitFixture.Month.DfHz))!;
        double[] row = Source.ToArray();
        // Same template on both sides: 1 to rounding.
        Assert.Equal(1.0, matcher.Overlap(row, row), 1e-12);
        // Φ0 moved by π/2 turns the dominant n = 2 harmonic by π: the overlap is far below the threshold.
        double shifted = matcher.Overlap(row, (Source with { Phi0Rad = Source.Phi0Rad + Math.PI / 2 }).ToArray());
        Assert.True(shifted < matcher.Threshold, $"overlap {shifted:F3} out of phase");
        Assert.True(matcher.Covers(row));
        // A nearly circular inspiral at 0.1 mHz orbital frequency radiates below the worker's window (1.15-6.8 mHz).
        var elsewhere = Source with { CentralMassMsun = 5e6, OrbitalFrequency0Hz = 1e-4, Eccentricity0 = 0.05 };
        Assert.False(matcher.Covers(elsewhere.ToArray()));
        Assert.Equal(0.0, matcher.Overlap(row, elsewhere.ToArray()));
        Assert.Equal(P.ColumnNames, matcher.ParameterColumns);
        Assert.Equal([7, 9, 11, 12, 13], Enumerable.Range(0, 14).Where(c => matcher.Periods[c] > 0));
    }

    private sealed class DefaultNoise(double dfHz) : IPsdSource
    {
        public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
        {
            for (int k = 0; k < psd.Length; k++) psd[k] = InspiralFitFixture.Noise.Psd(channel, (bins.First + k) * dfHz);
        }
    }
}
