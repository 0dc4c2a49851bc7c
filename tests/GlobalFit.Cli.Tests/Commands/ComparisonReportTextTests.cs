using GlobalFit.Cli.Commands;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>Errors in posterior σ fit their seven-character column however large they are.</summary>
public class ComparisonReportTextTests
{
    [Theory]
    [InlineData(0.04, "0.0")]
    [InlineData(-0.04, "0.0")]
    [InlineData(2.46, "+2.5")]
    [InlineData(-201.4, "-201.4")]
    [InlineData(9999.9, "+9999.9")]
    [InlineData(-1807417242.2, "-2e+09")]
    [InlineData(6103228001.2, "+6e+09")]
    [InlineData(double.NaN, "-")]
    public void Errors_in_sigma_are_one_decimal_or_a_short_exponent(double error, string expected)
    {
        string text = ComparisonReport.SigmaText(error);
        Assert.Equal(expected, text);
        Assert.True(text.Length <= 7, text);
    }
}
