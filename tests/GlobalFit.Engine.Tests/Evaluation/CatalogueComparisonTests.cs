using System.Collections.Immutable;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Engine.Tests.Evaluation;

/// <summary>The class-neutral comparison of a catalogue with its truth, through the galactic-binary module's matcher
/// (template overlap against a month at 15 s, fitted between 2.95 and 3.05 mHz).</summary>
public class CatalogueComparisonTests
{
    private static readonly FitDataShape Shape = new("month.h5", 172_800, 15.0, 0.0);

    private static ISourceMatcher Matcher()
    {
        var section = ConfigDocument.Parse("""
            [galactic_binaries]
            f_min_hz = 2.95e-3
            f_max_hz = 3.05e-3
            window_bins = 128
            margin_bins = 48
            """, "test").GetTable("galactic_binaries")!;
        var plan = new GalacticBinaryClass().PlanFit(section, Shape);
        return plan.CreateMatcher(new ModelPsdSource(new AetNoiseModel(InstrumentNoiseSettings.Default), Shape.DfHz))!;
    }

    // Three binaries in the band (78 and 104 bins apart, far more than a template's width at 3 mHz over a month) and one
    // at 4 mHz, outside it. Rows: the eight parameter columns, then snr.
    private static readonly (string Id, double[] Row)[] Injections =
    [
        ("gb-a", [2.960e-3, 1e-17, 3e-22, 0.4, 1.2, 0.8, 0.5, 2.0, 40]),
        ("gb-b", [2.990e-3, 0.0, 2e-22, -0.7, 4.0, 1.4, 2.5, 0.3, 25]),
        ("gb-c", [3.030e-3, 2e-17, 1e-22, 1.0, 5.5, 0.3, 1.0, 4.0, 12]),
        ("gb-far", [4.000e-3, 0.0, 1e-22, 0.2, 1.0, 1.0, 1.0, 1.0, 30]),
    ];

    private static TruthTable Truth() => new(GalacticBinaryClass.Id, [.. GalacticBinaryParameters.ColumnNames, "snr"],
        Injections.Select(i => i.Id), [.. Injections.SelectMany(i => i.Row)]);

    // A catalogued source whose median, interval and only sample are the injected values.
    private static CatalogueRecord Exact(string id, double[] row)
    {
        ImmutableArray<double> p = [.. row.Take(8)];
        return new CatalogueRecord(id, GalacticBinaryClass.Id, 1.0, row[8], GalacticBinaryParameters.ColumnNames, p, p, p, p);
    }

    [Fact]
    public void A_truth_table_compared_with_itself_finds_every_covered_source_with_full_coverage_and_nothing_spurious()
    {
        var sources = Injections.Take(3).Select((i, k) => Exact($"s{k}", i.Row)).ToList();
        var result = CatalogueComparison.Compare(sources, Truth(), Matcher(), detectableSnr: 7);

        Assert.Equal(3, result.Detectable);
        Assert.Equal(3, result.FoundDetectable);
        Assert.Equal(["gb-a", "gb-b", "gb-c"], result.Found.Select(f => f.TruthId));
        Assert.Empty(result.Missed);
        Assert.Empty(result.Spurious);
        Assert.Equal(1, result.NotCovered);   // gb-far lies outside the fitted band
        Assert.All(result.Found, f => Assert.Equal(1.0, f.Overlap, 12));   // a template against itself, to rounding
        Assert.All(result.Coverage, c => Assert.Equal((3, 3, 1.0, 0.0), (c.Inside, c.Count, c.Fraction, c.StandardError)));
    }

    [Fact]
    public void Removing_one_source_and_inventing_another_gives_exactly_one_missed_and_one_spurious()
    {
        var sources = new List<CatalogueRecord> { Exact("s0", Injections[0].Row), Exact("s2", Injections[2].Row) };
        sources.Add(Exact("invented", [3.010e-3, 0.0, 2e-22, 0.1, 2.0, 1.0, 1.0, 1.0, 15]));
        var result = CatalogueComparison.Compare(sources, Truth(), Matcher(), detectableSnr: 7);

        Assert.Equal("gb-b", Assert.Single(result.Missed).TruthId);
        Assert.Equal("invented", Assert.Single(result.Spurious).Id);
        Assert.Equal(2, result.Found.Length);
        var bin = result.SnrBins.Single(b => b.Low == 20);   // gb-b's SNR 25 lies in [20, 50), with gb-a's 40
        Assert.Equal((2, 1, 1), (bin.Injected, bin.Found, bin.NotFound));
        Assert.Equal(1, result.SnrBins.Single(b => b.Low == 10).Spurious);   // the invented source's SNR 15
    }

    [Fact]
    public void Errors_are_in_posterior_sigma_and_coverage_counts_truths_inside_the_interval()
    {
        // Median 0.5 σ above the truth in f0 with σ from the 90 % interval; the amplitude's interval misses the truth.
        var row = Injections[0].Row;
        double sigma = 1e-9;
        double half = sigma * CatalogueComparison.NinetyPercentHalfWidthInSigma;
        var median = row.Take(8).ToArray();
        median[0] += 0.5 * sigma;
        var lower = median.ToArray();
        var upper = median.ToArray();
        lower[0] -= half;
        upper[0] += half;
        lower[2] = upper[2] = median[2] = 2 * row[2];
        var source = new CatalogueRecord("s", GalacticBinaryClass.Id, 1, 40, GalacticBinaryParameters.ColumnNames, [.. median], [.. lower], [.. upper], [.. row.Take(8)]);

        var result = CatalogueComparison.Compare([source], Truth(), Matcher(), detectableSnr: 7);

        var found = Assert.Single(result.Found);
        Assert.Equal(0.5, found.ErrorsInSigma[0], 6);
        Assert.True(found.InsideInterval[0]);
        Assert.False(found.InsideInterval[2]);
        Assert.Equal(0.0, result.Coverage[2].Fraction);
    }

    [Fact]
    public void The_galactic_binary_overlap_is_one_for_a_source_with_itself_and_small_for_one_several_bins_away()
    {
        var matcher = Matcher();
        double[] row = [.. Injections[1].Row.Take(8)];
        double[] shifted = [.. row];
        shifted[0] += 4 * Shape.DfHz;
        Assert.Equal(1.0, matcher.Overlap(row, row), 12);
        // Four bins apart two near-monochromatic signals are nearly orthogonal over the month (their overlap falls like
        // a sinc of the offset in bins), far below the 0.5 threshold.
        Assert.InRange(matcher.Overlap(row, shifted), -0.2, 0.2);
        Assert.True(matcher.Covers(row));
        Assert.False(matcher.Covers(Injections[3].Row));
    }

    [Fact]
    public void A_truth_table_without_an_snr_column_is_refused()
    {
        var truth = new TruthTable(GalacticBinaryClass.Id, GalacticBinaryParameters.ColumnNames, ["x"], [.. Injections[0].Row.Take(8)]);
        var error = Assert.Throws<ArgumentException>(() => CatalogueComparison.Compare([], truth, Matcher(), 7));
        Assert.Contains("snr", error.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => CatalogueComparison.Compare([], Truth(), Matcher(), double.NaN));
    }
}
