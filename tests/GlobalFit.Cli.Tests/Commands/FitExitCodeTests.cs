using GlobalFit.Cli.Commands;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>How each way a fit can end reaches the user: the exit code and the lines on standard error.</summary>
public sealed class FitExitCodeTests
{
    [Theory]
    [InlineData(FitOutcomeKind.Completed, ExitCodes.Success)]
    [InlineData(FitOutcomeKind.Interrupted, ExitCodes.Interrupted)]
    [InlineData(FitOutcomeKind.Failed, ExitCodes.FitFailed)]
    [InlineData(FitOutcomeKind.WriteFailed, ExitCodes.WriteFailed)]
    public void Every_outcome_has_its_documented_exit_code(FitOutcomeKind kind, int expected)
    {
        var (code, _) = Run(new FitOutcome(kind, 3, 2, "the cause"));
        Assert.Equal(expected, code);
    }

    [Fact]
    public void A_write_failure_names_the_cause_keeps_the_checkpoint_and_prints_how_to_resume()
    {
        var (_, error) = Run(new FitOutcome(FitOutcomeKind.WriteFailed, 3, 2, "RUN/checkpoints/latest.tmp cannot be written: No space left on device"));
        Assert.Contains("No space left on device", error, StringComparison.Ordinal);
        Assert.Contains("checkpoint (iteration 2) is kept", error, StringComparison.Ordinal);
        Assert.Contains("globalfit resume", error, StringComparison.Ordinal);
    }

    private static (int Code, string Error) Run(FitOutcome outcome)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = FitCommand.Run(new CliContext(output, error, OutputIsTerminal: false), _ => outcome, otlp: null);
        return (code, error.ToString());
    }
}
