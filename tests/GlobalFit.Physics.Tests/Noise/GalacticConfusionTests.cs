using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Tests.CheckValues;
using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

public class GalacticConfusionTests
{
    /// <summary>Rows of CheckValues/galactic-confusion.csv (each names its source).</summary>
    public static IEnumerable<object[]> FitRows => CheckValueTable.Load("galactic-confusion").Numbers("observation_years", "f_hz", "s_c_per_hz");

    // Source: CheckValues/galactic-confusion.csv (derived from Robson, Cornish & Liu 2019, arXiv:1803.01944, Eq. 14
    // and its table; formula and table from memory). Seven printed figures: 1e-6 relative. Because the source is
    // from memory, the limit tests below also apply.
    [Theory]
    [MemberData(nameof(FitRows))]
    public void Strain_PSD_matches_the_reference(double years, double fHz, double expected)
    {
        var foreground = new GalacticConfusion(new GalacticConfusionSettings(years));
        RelativeAssert.Close(expected, foreground.StrainPsd(fHz), 1e-6);
    }

    // Limits that do not depend on the recalled coefficients: well below every knee, 1 + tanh → 2 and the
    // exponential → e^{-f^α} ≈ e^{-1}·(…), so S_c ∝ f^{-7/3} to within the slow exp factor; we check the local
    // log-slope at 10 µHz is −7/3 within 0.05, and that the foreground switches off far above the knee.
    [Theory]
    [InlineData(0.5)]
    [InlineData(1.0)]
    [InlineData(2.0)]
    [InlineData(4.0)]
    public void Foreground_falls_as_f_to_minus_seven_thirds_below_the_knee_and_vanishes_above(double years)
    {
        var foreground = new GalacticConfusion(new GalacticConfusionSettings(years));
        double slope = Math.Log(foreground.StrainPsd(1.01e-5) / foreground.StrainPsd(1e-5)) / Math.Log(1.01);
        Assert.Equal(-7.0 / 3.0, slope, 0.05);
        Assert.Equal(0.0, foreground.StrainPsd(0.05));
        Assert.Equal(0.0, foreground.StrainPsd(10.0));
    }

    [Fact]
    public void Amplitude_multiplier_scales_the_foreground_and_zero_turns_it_off()
    {
        var one = new GalacticConfusion(new GalacticConfusionSettings(1.0));
        var half = new GalacticConfusion(new GalacticConfusionSettings(1.0, 0.5));
        var off = new GalacticConfusion(new GalacticConfusionSettings(1.0, 0.0));
        Assert.Equal(0.5 * one.StrainPsd(1e-3), half.StrainPsd(1e-3), 1e-50);
        Assert.Equal(0.0, off.StrainPsd(1e-3));
        Assert.Equal(0.0, off.StrainPsd(0.0));
    }

    [Theory]
    [InlineData(3.0)]
    [InlineData(1.5)]
    [InlineData(0.0)]
    [InlineData(double.NaN)]
    public void Untabulated_observation_time_is_rejected_listing_the_allowed_ones(double years)
    {
        var error = Assert.Throws<ArgumentException>(() => new GalacticConfusionSettings(years));
        Assert.Equal("ObservationYears", error.ParamName);
        Assert.Contains("0.5, 1, 2, 4", error.Message);
    }

    [Theory]
    [InlineData(-0.1)]
    [InlineData(double.PositiveInfinity)]
    public void Negative_or_infinite_amplitude_multiplier_is_rejected(double scale)
    {
        var error = Assert.Throws<ArgumentException>(() => new GalacticConfusionSettings(1.0, scale));
        Assert.Equal("AmplitudeScale", error.ParamName);
    }
}
