using GlobalFit.Physics.Files;

namespace GlobalFit.Physics.Tests.Files;

/// <summary>Numbers for people and CSV readers carry a lower-case e and a two-digit signed exponent, and the round-trip
/// form reads back bit for bit.</summary>
public class NumberTextTests
{
    [Theory]
    [InlineData(7.43e-21, "7.43e-21")]
    [InlineData(2e-22, "2e-22")]
    [InlineData(1e-5, "1e-05")]
    [InlineData(1e20, "1e+20")]
    [InlineData(0.001, "0.001")]
    [InlineData(-3.5e-300, "-3.5e-300")]
    [InlineData(double.NaN, "NaN")]
    public void Round_trip_text_has_a_lower_case_two_digit_exponent(double value, string expected)
    {
        string text = NumberText.RoundTrip(value);
        Assert.Equal(expected, text);
        Assert.Equal(value, double.Parse(text, System.Globalization.CultureInfo.InvariantCulture));
    }

    [Theory]
    [InlineData(7.4312e-21, 2, "7.43e-21")]
    [InlineData(1.0, 2, "1.00e+00")]
    [InlineData(-6.02e23, 1, "-6.0e+23")]
    [InlineData(5e-5, 0, "5e-05")]
    [InlineData(double.PositiveInfinity, 2, "Infinity")]
    public void Scientific_text_never_has_three_exponent_digits_below_1e100(double value, int decimals, string expected) =>
        Assert.Equal(expected, NumberText.Scientific(value, decimals));

    [Theory]
    [InlineData(7.4312e-21, 3, "7.43e-21")]
    [InlineData(0.012345, 3, "0.0123")]
    [InlineData(123456.0, 4, "1.235e+05")]
    public void Significant_text_is_the_shorter_form_with_a_lower_case_exponent(double value, int digits, string expected) =>
        Assert.Equal(expected, NumberText.Significant(value, digits));

    [Fact]
    public void Digits_outside_their_range_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberText.Significant(1.0, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberText.Significant(1.0, 18));
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberText.Scientific(1.0, -1));
        Assert.Throws<ArgumentOutOfRangeException>(() => NumberText.Scientific(1.0, 17));
    }

    [Fact]
    public void A_moment_is_written_in_utc_to_the_second_with_a_z()
    {
        var moment = new DateTimeOffset(2026, 12, 5, 13, 6, 56, 789, TimeSpan.FromHours(2));
        Assert.Equal("2026-12-05T11:06:56Z", UtcText.Format(moment));
    }
}
