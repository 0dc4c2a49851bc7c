using GlobalFit.Cli.Console;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>An unexpected error reaches the user as one line and a crash log, never as a stack trace on the terminal.</summary>
public sealed class CrashReportTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("globalfit-crash-tests-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void The_crash_log_holds_the_command_line_and_the_stack_trace()
    {
        Exception error;
        try { throw new InvalidOperationException("an invariant broke"); }
        catch (InvalidOperationException e) { error = e; }
        string? path = CrashReport.Write(error, ["fit", "run.toml"], _folder);
        Assert.NotNull(path);
        string text = File.ReadAllText(path);
        Assert.Contains("command line: globalfit fit run.toml", text, StringComparison.Ordinal);
        Assert.Contains("an invariant broke", text, StringComparison.Ordinal);
        Assert.Contains(nameof(The_crash_log_holds_the_command_line_and_the_stack_trace), text, StringComparison.Ordinal); // the stack trace
    }

    [Fact]
    public void A_crash_log_that_cannot_be_written_is_reported_as_missing_not_thrown()
    {
        string notAFolder = Path.Combine(_folder, "file");
        File.WriteAllText(notAFolder, "");
        Assert.Null(CrashReport.Write(new InvalidOperationException("x"), [], notAFolder));
    }
}
