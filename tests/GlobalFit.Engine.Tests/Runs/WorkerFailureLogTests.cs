using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;

namespace GlobalFit.Engine.Tests.Runs;

public sealed class WorkerFailureLogTests
{
    [Fact]
    public void Each_failure_is_appended_with_its_time_worker_and_stack_trace_as_documented()
    {
        using var folder = new TemporaryRunFolder();
        var log = new WorkerFailureLog(folder.File("worker-failures.log"));
        log.Record("galactic_binaries/0003", Thrown("first"));
        log.Record("noise", Thrown("second"));

        // Read back by the documented layout: a header line 'UTC-TIME worker ID failed:', the exception, a blank line.
        var entries = File.ReadAllText(log.Path).Split("\n\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(2, entries.Length);
        string[] first = entries[0].Split('\n');
        Assert.Matches(@"^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z worker galactic_binaries/0003 failed:$", first[0]);
        Assert.Equal("System.InvalidOperationException: first", first[1]);
        Assert.Contains(first, l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal) && l.Contains(nameof(Thrown), StringComparison.Ordinal));
        Assert.Contains("worker noise failed:", entries[1], StringComparison.Ordinal);
    }

    [Fact]
    public void A_log_that_cannot_be_written_does_not_throw()
    {
        using var folder = new TemporaryRunFolder();
        string path = folder.File("worker-failures.log");
        Directory.CreateDirectory(path); // a folder where the file must go
        new WorkerFailureLog(path).Record("noise", Thrown("x"));
        Assert.True(Directory.Exists(path));
    }

    private static Exception Thrown(string message)
    {
        try
        {
            throw new InvalidOperationException(message);
        }
        catch (InvalidOperationException e)
        {
            return e;
        }
    }
}
