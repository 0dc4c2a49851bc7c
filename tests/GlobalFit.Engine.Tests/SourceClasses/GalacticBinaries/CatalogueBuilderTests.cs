using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class CatalogueBuilderTests
{
    private const double Days = 30;
    private static readonly BinWindow Bins = new(7776 - 64, 400);

    private static (BandTestData Data, CatalogueBuilder Builder) Setup(double threshold = 0.5)
    {
        var data = new BandTestData(Days, Bins, [], 1, noise: false);
        return (data, new CatalogueBuilder(data.Generator, Bins, data.InverseA, data.InverseE, threshold));
    }

    private static GalacticBinaryParameters Source(BandTestData data, double bin, double snr) =>
        data.WithSnr(new GalacticBinaryParameters(bin * data.DfHz, 0, 1e-22, 0.3, 2.0, 0.8, 0.6, 1.5), snr);

    // A source present in every sample with a known spread of f0 (±49.5 steps of 0.002 bins, far below the template's
    // width) and one present in 30 of 100 samples: confidences are exact counts, and the median and the 5 %/95 %
    // quantiles of f0 are the type-7 quantiles of the evenly spaced values, known in closed form.
    [Fact]
    public void Entries_have_the_fraction_of_samples_they_appear_in_and_the_quantiles_of_their_members()
    {
        var (data, builder) = Setup();
        var steady = Source(data, 7776 + 50.3, 30);
        var occasional = Source(data, 7776 + 200.7, 15);
        double step = 0.002 * data.DfHz;
        for (int i = 0; i < 100; i++)
        {
            var sample = new List<GalacticBinaryParameters> { steady with { FrequencyHz = steady.FrequencyHz + (i - 49.5) * step } };
            if (i % 10 < 3) sample.Add(occasional);
            builder.Add(sample);
        }
        var rows = builder.Build();
        Assert.Equal(2, rows.Length);
        Assert.Equal(1.0, rows[0].Confidence);
        Assert.Equal(0.3, rows[1].Confidence, 12);
        Assert.Equal(steady.FrequencyHz, rows[0].Median.FrequencyHz, 1e-15);
        Assert.Equal(steady.FrequencyHz + (0.05 * 99 - 49.5) * step, rows[0].Lower.FrequencyHz, 1e-15);
        Assert.Equal(steady.FrequencyHz + (0.95 * 99 - 49.5) * step, rows[0].Upper.FrequencyHz, 1e-15);
        // SNRs were set to 30 and 15 over these bins; the f0 spread changes ρ by far less than 1 %.
        Assert.Equal(30, rows[0].MedianSnr, 0.3);
        Assert.Equal(15, rows[1].MedianSnr, 1e-6);
        Assert.Single(builder.Build(0.5));
    }

    [Fact]
    public void Two_sources_of_one_sample_never_share_an_entry()
    {
        var (data, builder) = Setup();
        var source = Source(data, 7776 + 100.2, 20);
        builder.Add([source]);
        builder.Add([source, source with { InitialPhaseRad = source.InitialPhaseRad + 0.01 }]);
        var rows = builder.Build();
        Assert.Equal(2, rows.Length);
        Assert.All(rows, e => Assert.True(e.Confidence <= 1.0));
        Assert.Equal([1.0, 0.5], rows.Select(e => e.Confidence).Order().Reverse().ToArray());
    }

    // A phase shift of π/2 makes the overlap cos(π/2) = 0 while leaving f0 alone: the threshold decides, not proximity.
    [Fact]
    public void Sources_that_overlap_less_than_the_threshold_open_new_entries()
    {
        var (data, builder) = Setup();
        var source = Source(data, 7776 + 100.2, 20);
        builder.Add([source]);
        builder.Add([source with { InitialPhaseRad = source.InitialPhaseRad + 0.5 * Math.PI }]);
        builder.Add([source with { InitialPhaseRad = source.InitialPhaseRad + 0.3 }]);
        var rows = builder.Build();
        Assert.Equal(2, rows.Length);
        Assert.Equal(2, rows.Max(e => e.MemberCount));
    }

    [Fact]
    public void Weights_that_do_not_cover_the_bins_and_bad_thresholds_are_refused()
    {
        var data = new BandTestData(Days, Bins, [], 1, noise: false);
        Assert.Throws<ArgumentException>(() => new CatalogueBuilder(data.Generator, Bins, new double[3], data.InverseE));
        Assert.Throws<ArgumentException>(() => new CatalogueBuilder(data.Generator, Bins, data.InverseA, data.InverseE, 0.0));
        Assert.Throws<ArgumentException>(() => new CatalogueBuilder(data.Generator, Bins, data.InverseA, data.InverseE, 1.5));
    }
}
