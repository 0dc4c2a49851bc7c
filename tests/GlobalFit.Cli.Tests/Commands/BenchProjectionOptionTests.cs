using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary><c>bench --projection</c>'s options are checked before anything is measured.</summary>
public class BenchProjectionOptionTests
{
    [Theory]
    [InlineData("--projection-cores", "0")]
    [InlineData("--projection-iterations", "-5")]
    public void A_projection_option_below_one_is_bad_input_naming_it(string option, string value)
    {
        var result = CliRun.Run("bench", "--projection", option, value);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains(option, result.Error);
        Assert.Contains("must be at least 1", result.Error);
    }
}
