using GlobalFit.Cli.Tests.Support;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Physics.Files;
using Xunit.Abstractions;

namespace GlobalFit.Cli.Tests.Faults;

/// <summary>A disk that fills up at any byte of any write site of <c>simulate</c>, <c>catalogue</c> and <c>fit</c>
/// (run files, samples, checkpoints, status, telemetry, the final catalogue) stops the command cleanly: exit 4 (a file
/// could not be written), one line naming the file and the cause, no temporary file left,
/// nothing half-written in place of a good file, and every checkpoint left behind intact.</summary>
/// <remarks>Each command is first run with byte counting to learn how much it writes in total, then rerun with the
/// disk filling at points spread over that total, so every write site is reached whatever the order of the writes.</remarks>
[Collection(FileFaultCollection.Name)]
public sealed class DiskFullTests(ITestOutputHelper output)
{
    // Fractions of the total bytes at which the disk fills: the first byte, the last, and points between that fall into
    // each of the writes (the observation file, or run.toml, identity, samples, checkpoints and status of a fit).
    private static readonly double[] FillPoints = [0, 0.0001, 0.001, 0.01, 0.05, 0.1, 0.2, 0.35, 0.5, 0.65, 0.8, 0.9, 0.97, 0.995, 0.9999];

    [Fact]
    public void Simulate_stops_cleanly_wherever_the_disk_fills()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("scenario.toml", Scenarios.TwoDays), data = folder.File("data.h5");
        long total = Count(() => CliRun.Run("simulate", scenario, "--out", data));
        File.Delete(data);
        foreach (long budget in Budgets(total))
        {
            var result = Fill(budget, () => CliRun.Run("simulate", scenario, "--out", data));
            ExpectCleanStop(result, budget, [ExitCodes.WriteFailed], data);
            Assert.False(File.Exists(data));
            Assert.Equal(["scenario.toml"], Directory.GetFiles(folder.Path).Select(Path.GetFileName));
        }
    }

    [Theory]
    [InlineData("csv")]
    [InlineData("json")]
    [InlineData("h5")]
    public void Catalogue_export_stops_cleanly_wherever_the_disk_fills_and_keeps_the_previous_export(string format)
    {
        using var folder = new TempFolder();
        string run = FitOnce(folder), target = folder.File("catalogue." + format);
        Assert.Equal(0, CliRun.Run("catalogue", run, "--format", format, "--out", target).ExitCode);
        byte[] previous = File.ReadAllBytes(target);
        long total = Count(() => CliRun.Run("catalogue", run, "--format", format, "--out", target, "--force"));
        foreach (long budget in Budgets(total))
        {
            var result = Fill(budget, () => CliRun.Run("catalogue", run, "--format", format, "--out", target, "--force"));
            ExpectCleanStop(result, budget, [ExitCodes.WriteFailed], target);
            Assert.Equal(previous, File.ReadAllBytes(target)); // the earlier export is untouched
            Assert.Empty(Directory.GetFiles(folder.Path, "*.tmp"));
        }
    }

    [Fact]
    public void A_fit_stops_cleanly_wherever_the_disk_fills_and_leaves_only_intact_checkpoints()
    {
        using var folder = new TempFolder();
        string data = Simulate(folder);
        long total = Count(() => CliRun.Run("fit", FitConfig(folder, data, folder.File("counted"))));
        int n = 0;
        foreach (long budget in Budgets(total))
        {
            string run = folder.File($"run{n++}");
            var result = Fill(budget, () => CliRun.Run("fit", FitConfig(folder, data, run)));
            // A fit's telemetry varies in length with timing, so the last fill points may lie beyond what this run wrote.
            if (WriteFaults.FirstFailure is null)
            {
                Assert.Equal(0, result.ExitCode);
                continue;
            }
            if (WriteFaults.FirstFailure.EndsWith("telemetry.jsonl", StringComparison.Ordinal) && result.ExitCode == 0)
            {
                // Telemetry is diagnostics: losing it does not stop a fit whose samples and checkpoints are safe, but
                // it is reported.
                Assert.Contains("warning: telemetry could not be written", result.Error, StringComparison.Ordinal);
                continue;
            }
            ExpectCleanStop(result, budget, [ExitCodes.WriteFailed], null);
            if (!Directory.Exists(run)) continue;
            Assert.Empty(Directory.GetFiles(run, "*.tmp", SearchOption.AllDirectories));
            if (CheckpointFile.Exists(run)) Assert.True(CheckpointFile.Read(run, _ => { }).Iteration >= 1);
            // Once the fit has written its status, the run is reported as stopped, never as still running (the status
            // file itself may be the write that failed, so the report rests on the lock the process released).
            if (File.Exists(Path.Combine(run, "status.json")))
            {
                var status = CliRun.Run("status", run, "--json");
                Assert.NotEqual("running", System.Text.Json.JsonDocument.Parse(status.Out).RootElement.GetProperty("state").GetString());
            }
        }
    }

    private void ExpectCleanStop(CliResult result, long budget, int[] codes, string? namedFile)
    {
        output.WriteLine($"disk full after {budget} bytes ({WriteFaults.FirstFailure}): exit {result.ExitCode}: {result.Error.Trim()}");
        Assert.True(codes.Contains(result.ExitCode), $"after {budget} bytes: exit {result.ExitCode}: {result.Error}");
        string line = Assert.Single(result.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries), l => l.StartsWith("error:", StringComparison.Ordinal));
        Assert.Contains("No space left on device", line, StringComparison.Ordinal);
        if (namedFile is not null) Assert.Contains(namedFile, line, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Error, StringComparison.Ordinal); // no stack trace
    }

    private static IEnumerable<long> Budgets(long total) => FillPoints.Select(f => (long)(f * total)).Distinct();

    private static long Count(Func<CliResult> run)
    {
        using (WriteFaults.Count())
        {
            Assert.Equal(0, run().ExitCode);
            return WriteFaults.Written;
        }
    }

    // A hung command fails the test instead of stalling the suite: two minutes is far above the few seconds each takes.
    private static CliResult Fill(long budget, Func<CliResult> run)
    {
        using (WriteFaults.Inject(budget))
        {
            var task = Task.Run(run);
            Assert.True(task.Wait(TimeSpan.FromMinutes(2)), $"still running two minutes after the disk filled at byte {budget} (first failed write: {WriteFaults.FirstFailure})");
            return task.Result;
        }
    }

    private static string Simulate(TempFolder folder)
    {
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", Scenarios.TwoDays), "--out", data).ExitCode);
        return data;
    }

    private static string FitOnce(TempFolder folder)
    {
        string run = folder.File("run");
        Assert.Equal(0, CliRun.Run("fit", FitConfig(folder, Simulate(folder), run)).ExitCode);
        return run;
    }

    private static string FitConfig(TempFolder folder, string data, string run) =>
        folder.Write("fit.toml", $"data = \"{data}\"\nrun_folder = \"{run}\"\niterations = 3\ncheckpoint_every_iterations = 1\n[noise]\nsteps_per_update = 5\n");
}

/// <summary>Fault tests change process-wide file behaviour and so run alone.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class FileFaultCollection
{
    public const string Name = "file faults";
}
