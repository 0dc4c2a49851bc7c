using System.Diagnostics;
using System.Text.Json;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>The fit commands driven as separate processes, as a user's shell (or a cluster's scheduler) would.</summary>
public class FitProcessTests
{
    private static string Config(string data, string run) => SmallFitRecord.FitConfig(data, run, iterations: 10, threads: 2, stepsPerUpdate: 300);

    [Fact]
    public void A_fit_killed_after_five_iterations_and_resumed_ends_with_the_same_catalogue_bytes_as_an_uninterrupted_fit()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        string straightRun = folder.File("straight"), killedRun = folder.File("killed");

        var straight = Globalfit.Run("fit", folder.Write("straight.toml", Config(data, straightRun)));
        Assert.True(straight.Code == 0, straight.Error);

        using (var killed = Globalfit.Start("fit", folder.Write("killed.toml", Config(data, killedRun))))
        {
            long reached = WaitForIteration(killedRun, 5, killed, TimeSpan.FromMinutes(5));
            killed.Kill(entireProcessTree: true); // SIGKILL: no handler runs, no checkpoint is written on the way out
            killed.WaitForExit();
            Assert.InRange(reached, 5, 9);
        }
        var status = CliRun.Run("status", killedRun, "--json");
        Assert.Equal(0, status.ExitCode);
        Assert.Equal("stopped", JsonDocument.Parse(status.Out).RootElement.GetProperty("state").GetString());

        var resumed = Globalfit.Run("resume", killedRun);
        Assert.True(resumed.Code == 0, resumed.Error);
        Assert.Equal(File.ReadAllBytes(Path.Combine(straightRun, "catalogue.csv")), File.ReadAllBytes(Path.Combine(killedRun, "catalogue.csv")));
        Assert.Equal(File.ReadAllBytes(Path.Combine(straightRun, "catalogue.h5")), File.ReadAllBytes(Path.Combine(killedRun, "catalogue.h5")));

        var catalogue = CliRun.Run("catalogue", killedRun, "--format", "json");
        Assert.Equal(0, catalogue.ExitCode);
        Assert.True(JsonDocument.Parse(catalogue.Out).RootElement.GetProperty("sources").GetArrayLength() >= 3);
        var trace = CliRun.Run("trace", killedRun, "--json");
        Assert.Equal(0, trace.ExitCode);
    }

    [Fact]
    public void A_terminate_signal_checkpoints_the_last_complete_iteration_and_exits_with_code_130()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        string run = folder.File("run");
        using var fit = Globalfit.Start("fit", folder.Write("fit.toml", Config(data, run).Replace("checkpoint_every_iterations = 1", "checkpoint_every_iterations = 100", StringComparison.Ordinal)));
        WaitForIteration(run, 2, fit, TimeSpan.FromMinutes(5));
        using (var signal = Process.Start("kill", ["-TERM", fit.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)])) signal.WaitForExit();
        Assert.True(fit.WaitForExit(TimeSpan.FromMinutes(2)), "the fit did not stop after SIGTERM");
        Assert.Equal(130, fit.ExitCode);
        var status = JsonDocument.Parse(CliRun.Run("status", run, "--json").Out).RootElement;
        Assert.Equal("interrupted", status.GetProperty("state").GetString());
        long iteration = status.GetProperty("iteration").GetInt64();
        Assert.True(iteration >= 2);
        // checkpoint_every_iterations = 100, so this checkpoint can only come from the signal.
        Assert.Equal(iteration, status.GetProperty("checkpoint_iteration").GetInt64());
    }

    [Fact]
    public void Resume_of_a_folder_that_is_not_a_run_exits_with_code_two_and_names_it()
    {
        using var folder = new TempFolder();
        var result = Globalfit.Run("resume", folder.Path);
        Assert.Equal(2, result.Code);
        Assert.Contains(folder.Path, result.Error);
        Assert.Contains("not a run folder", result.Error);
    }

    // Polls the run's status file (rewritten atomically after every iteration) until it reports the iteration.
    private static long WaitForIteration(string run, long iteration, Process process, TimeSpan patience)
    {
        var clock = Stopwatch.StartNew();
        string status = Path.Combine(run, "status.json");
        while (clock.Elapsed < patience)
        {
            if (process.HasExited) throw new InvalidOperationException($"the fit exited early with code {process.ExitCode}");
            if (File.Exists(status))
            {
                try
                {
                    long reached = JsonDocument.Parse(File.ReadAllText(status)).RootElement.GetProperty("iteration").GetInt64();
                    if (reached >= iteration) return reached;
                }
                catch (IOException) { }
            }
            Thread.Sleep(20);
        }
        throw new TimeoutException($"iteration {iteration} not reached in {patience}");
    }
}
