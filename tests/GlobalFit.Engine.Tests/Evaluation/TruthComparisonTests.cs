using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Tests.Evaluation;

public sealed class TruthComparisonTests
{
    // Injections on a toy key "x": a (x 1, SNR 20), b (x 2, SNR 10), quiet c (x 3, SNR 3), d (x 5, SNR 12, outside the
    // analysed range [0, 4.5)). Tolerance 0.1, detectable from SNR 7.
    private static readonly TruthTable Truth = new("toy", ["x", "snr"], ["a", "b", "c", "d"], [1.0, 20, 2.0, 10, 3.0, 3, 5.0, 12]);

    [Fact]
    public void Loud_injections_take_the_nearest_entry_and_only_entries_near_no_injection_are_spurious()
    {
        var entries = new[] { Entry("near-a", 0.98), Entry("also-a", 1.05), Entry("on-c", 3.02), Entry("nothing", 4.2) };
        var result = TruthComparison.Compare(entries, Truth, "x", 0.1, 0.0, 4.5, 7.0);

        Assert.Equal(2, result.DetectableCount); // a and b; d lies outside the range, c is quiet
        var found = Assert.Single(result.Found);
        Assert.Equal(("a", "near-a"), (found.TruthId, found.EntryId));
        Assert.Equal("b", Assert.Single(result.Missed).TruthId);
        // "also-a" is a second entry on a real source and "on-c" a marginal detection of a quiet one: neither is spurious.
        Assert.Equal("nothing", Assert.Single(result.Spurious).Id);
    }

    [Fact]
    public void Errors_are_in_units_of_the_sigma_of_a_gaussian_with_the_same_ninety_percent_interval()
    {
        var result = TruthComparison.Compare([Entry("e", 1.05, halfWidth: 0.1)], Truth, "x", 0.1, 0.0, 4.5, 7.0);
        // σ = (0.95 quantile − 0.05 quantile) / (2 × 1.6448536), 1.6448536 being the standard normal 95 % point (value
        // from memory, Φ(1.6448536) = 0.95); (1.05 − 1.0) / (0.2 / 3.2897072) = 0.82243.
        Assert.Equal(0.05 / (0.2 / (2 * 1.6448536269514722)), result.Found[0].ErrorsInSigma["x"], 12);
        Assert.False(result.Found[0].ErrorsInSigma.ContainsKey("snr"));
    }

    private static CatalogueRecord Entry(string id, double x, double halfWidth = 0.02) =>
        new(id, "toy", 1.0, 10.0, ["x"], [x], [x - halfWidth], [x + halfWidth], [x]);
}
