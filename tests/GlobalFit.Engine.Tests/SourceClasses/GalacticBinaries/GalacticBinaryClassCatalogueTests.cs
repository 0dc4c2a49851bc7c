using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryClassCatalogueTests
{
    private const double Days = 30;
    private static readonly BinWindow Bins = new(7776 - 64, 400);
    private static readonly string[] Columns = [.. GalacticBinaryParameters.ColumnNames];

    private static (BandTestData Data, GalacticBinaryClassCatalogue Catalogue) Setup(long burnIn = 0, double minimumConfidence = 0)
    {
        var data = new BandTestData(Days, Bins, [], 1, noise: false);
        var noise = new ModelPsdSource(new AetNoiseModel(InstrumentNoiseSettings.Default), data.DfHz);
        return (data, new GalacticBinaryClassCatalogue(data.Generator, Bins, noise, burnIn, minimumConfidence));
    }

    private static GalacticBinaryParameters Source(BandTestData data, double bin, double snr) =>
        data.WithSnr(new GalacticBinaryParameters(bin * data.DfHz, 0, 1e-22, 0.3, 2.0, 0.8, 0.6, 1.5), snr);

    private static double[] Row(GalacticBinaryParameters p) =>
        [p.FrequencyHz, p.FrequencyDerivativeHzS, p.Amplitude, p.EclipticLatitudeRad, p.EclipticLongitudeRad, p.InclinationRad, p.PolarisationRad, p.InitialPhaseRad];

    private static SampleBlock Block(string worker, long iteration, IReadOnlyList<IReadOnlyList<GalacticBinaryParameters>> samples) =>
        new(worker, "galactic_binaries", iteration, Columns, [.. samples.Select(s => s.Count)],
            [.. samples.SelectMany(s => s).SelectMany(Row)], [.. samples.Select(_ => -1.0)]);

    // 21 samples of one source whose f0 and amplitude take evenly spaced values v_i = v_0 + i·step (i = 0 … 20) in a
    // scrambled order. The type-7 quantile at q sits at position q·(21 − 1) of the sorted values, so the median is v_10,
    // the 5 % quantile v_1 and the 95 % quantile v_19 exactly — order statistics, no interpolation. The f0 spread (±0.02
    // bins) is far below the template's width, so every sample joins one entry.
    [Fact]
    public void Medians_and_90_percent_intervals_are_the_order_statistics_of_a_hand_made_sample_set()
    {
        var (data, catalogue) = Setup(burnIn: 1);
        var steady = Source(data, 7776 + 50.3, 30);
        double fStep = 0.002 * data.DfHz, aStep = 0.01 * steady.Amplitude;
        int[] order = [7, 0, 13, 20, 4, 11, 16, 2, 9, 18, 5, 14, 1, 19, 8, 3, 12, 17, 6, 10, 15];
        var samples = order.Select(i => (IReadOnlyList<GalacticBinaryParameters>)
            [steady with { FrequencyHz = steady.FrequencyHz + i * fStep, Amplitude = steady.Amplitude + i * aStep }]).ToList();
        // Burn-in junk (a source far away) must not appear; the kept samples arrive in two iterations.
        catalogue.Add(Block("galactic_binaries/0000", 1, [[Source(data, 7776 + 250.5, 20)]]));
        catalogue.Add(Block("galactic_binaries/0000", 2, samples[..10]));
        catalogue.Add(Block("galactic_binaries/0000", 3, samples[10..]));

        var record = Assert.Single(catalogue.Build());
        Assert.Equal("gb-0001", record.Id);
        Assert.Equal("galactic_binaries", record.ClassId);
        // The catalogue's columns are the truth table's: the sampled eight with fddot_hz_s2 beside fdot_hz_s.
        Assert.Equal(["f0_hz", "fdot_hz_s", "fddot_hz_s2", "amplitude", "beta_rad", "lambda_rad", "iota_rad", "psi_rad", "phi0_rad"], record.ParameterNames.ToArray());
        Assert.Equal(1.0, record.Confidence);
        Assert.Equal(21, record.SampleCount);
        // Tolerance: v_0 + i·step is evaluated once here and once in the builder's interpolation; 1e-15 relative.
        Assert.Equal(steady.FrequencyHz + 10 * fStep, record.Median[0], steady.FrequencyHz * 1e-15);
        Assert.Equal(steady.FrequencyHz + 1 * fStep, record.Lower[0], steady.FrequencyHz * 1e-15);
        Assert.Equal(steady.FrequencyHz + 19 * fStep, record.Upper[0], steady.FrequencyHz * 1e-15);
        Assert.Equal(0.0, record.Median[2]); // f̈: the samples hold none, so 0, the value the fit keeps it at
        Assert.Equal(steady.Amplitude + 10 * aStep, record.Median[3], steady.Amplitude * 1e-14);
        Assert.Equal(steady.Amplitude + 1 * aStep, record.Lower[3], steady.Amplitude * 1e-14);
        Assert.Equal(steady.Amplitude + 19 * aStep, record.Upper[3], steady.Amplitude * 1e-14);
        Assert.Equal(steady.EclipticLatitudeRad, record.Median[4]);
        // The SNR was set to 30 at the central amplitude; ±10 % amplitude spread moves the median SNR by the median's 10 %.
        Assert.Equal(30 * (1 + 10 * 0.01), record.Snr, 0.3);
        // Samples keep their arrival order, one row of the nine catalogue columns each.
        Assert.Equal(steady.FrequencyHz + order[0] * fStep, record.Samples[0]);
        Assert.Equal(steady.FrequencyHz + order[20] * fStep, record.Samples[20 * 9]);
    }

    // Confidence is per band: a source in half of its own band's samples has confidence 0.5, however many other bands
    // there are. Ids follow median f0 across bands.
    [Fact]
    public void Confidence_counts_the_samples_of_the_sources_own_worker_and_ids_follow_frequency()
    {
        var (data, catalogue) = Setup(minimumConfidence: 0.4);
        var high = Source(data, 7776 + 200.7, 20);
        var low = Source(data, 7776 + 40.2, 15);
        var rare = Source(data, 7776 + 120.2, 12);
        var highSamples = Enumerable.Range(0, 20).Select(_ => (IReadOnlyList<GalacticBinaryParameters>)[high]).ToList();
        var lowSamples = Enumerable.Range(0, 20).Select(i => (IReadOnlyList<GalacticBinaryParameters>)(
            i % 2 == 0 ? [low] : i == 1 ? [rare] : [])).ToList();
        catalogue.Add(Block("galactic_binaries/0001", 1, highSamples));
        catalogue.Add(Block("galactic_binaries/0000", 1, lowSamples));

        var records = catalogue.Build();

        Assert.Equal(["gb-0001", "gb-0002"], records.Select(r => r.Id));
        Assert.Equal(0.5, records[0].Confidence);
        Assert.Equal(low.FrequencyHz, records[0].Median[0]);
        Assert.Equal(1.0, records[1].Confidence);
    }

    [Fact]
    public void Blocks_of_another_class_or_missing_a_column_are_refused_naming_the_worker()
    {
        var (data, catalogue) = Setup();
        var block = Block("galactic_binaries/0003", 4, [[Source(data, 7776 + 50.3, 10)]]);
        var wrongClass = Assert.Throws<ArgumentException>(() => catalogue.Add(block with { ClassId = "noise" }));
        Assert.Contains("galactic_binaries/0003", wrongClass.Message);
        var missing = Assert.Throws<ArgumentException>(() => catalogue.Add(block with { ParameterNames = [.. Columns.Take(7), "phase"] }));
        Assert.Contains("phi0_rad", missing.Message);
        Assert.Empty(catalogue.Build());
    }

    [Fact]
    public void Columns_are_found_by_name_in_any_order()
    {
        var (data, catalogue) = Setup();
        var source = Source(data, 7776 + 50.3, 10);
        var row = Row(source);
        int[] permutation = [7, 6, 5, 4, 3, 2, 1, 0];
        catalogue.Add(new SampleBlock("galactic_binaries/0000", "galactic_binaries", 1, [.. permutation.Select(i => Columns[i])], [1],
            [.. permutation.Select(i => row[i])], [0.0]));
        Assert.Equal(source.ToTableRow(), Assert.Single(catalogue.Build()).Median);
    }
}
