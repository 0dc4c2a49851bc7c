using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

public class InspiralCatalogueTests
{
    [Fact]
    public void A_periodic_interval_that_straddles_zero_stays_one_interval_around_its_circular_mean()
    {
        // Samples at ±0.1 rad around 0 (written in [0, 2π)): a plain sort would give a median near π.
        double[] column = [.. Enumerable.Range(0, 101).Select(i => InspiralSamplingCoordinates.Wrap(-0.1 + 0.002 * i))];
        var (median, lower, upper) = InspiralCatalogue.Summarise(column, periodic: true);
        Assert.Equal(0.0, median, 1e-9);
        // Order statistics at ⌊0.05 × 100⌋ = 5 and ⌊0.95 × 100⌋ = 95: −0.09 and +0.09.
        Assert.Equal(-0.09, lower, 1e-9);
        Assert.Equal(0.09, upper, 1e-9);
        var (plainMedian, plainLower, plainUpper) = InspiralCatalogue.Summarise([1, 2, 3, 4, 5], periodic: false);
        Assert.Equal((3.0, 1.0, 4.0), (plainMedian, plainLower, plainUpper));
    }

    [Fact]
    public void Rows_hold_every_column_the_samples_after_burn_in_and_the_snr_of_the_source()
    {
        var source = InspiralFitFixture.Source;
        var plan = InspiralFitFixture.Plan("", ("a", source));
        var catalogue = plan.CreateCatalogue(new DefaultNoise(InspiralFitFixture.Month.DfHz), 1, 0);
        string worker = plan.Groups[0].Workers[0].Id;
        double[] row = source.ToArray();
        SampleBlock Block(long iteration, int count) => new(worker, ExtremeMassRatioInspiralClass.Id, iteration, [.. P.ColumnNames],
            [.. Enumerable.Repeat(1, count)], [.. Enumerable.Range(0, count).SelectMany(_ => row)], new double[count]);
        catalogue.Add(Block(1, 5));   // burn-in: left out
        catalogue.Add(Block(2, 3));
        var record = Assert.Single(catalogue.Build());
        Assert.Equal("emri-0001", record.Id);
        Assert.Equal(ExtremeMassRatioInspiralClass.Id, record.ClassId);
        Assert.Equal(3, record.SampleCount);
        Assert.Equal(1.0, record.Confidence);
        Assert.Equal(P.ColumnNames, record.ParameterNames);
        for (int c = 0; c < row.Length; c++)
        {
            Assert.Equal(row[c], record.Median[c], Math.Abs(row[c]) * 1e-15);
            Assert.Equal(record.Median[c], record.Lower[c], Math.Abs(row[c]) * 1e-15);
        }
        // Every sample is the source itself, so the median SNR is its optimal SNR to rounding.
        Assert.Equal(InspiralFitFixture.Snr(source), record.Snr, 1e-9 * record.Snr);
        Assert.Throws<ArgumentException>(() => catalogue.Add(Block(3, 1) with { ParameterNames = ["f0_hz"] }));
    }

    private sealed class DefaultNoise(double dfHz) : IPsdSource
    {
        public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
        {
            for (int k = 0; k < psd.Length; k++) psd[k] = InspiralFitFixture.Noise.Psd(channel, (bins.First + k) * dfHz);
        }
    }
}
