using System.Diagnostics;
using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>The fit commands driven as separate processes, as a user's shell (or a cluster's scheduler) would.</summary>
public class FitProcessTests
{
    private const string Scenario = """
        name = "two loud binaries"
        seed = 31
        [observation]
        duration_days = 30
        cadence_s = 15
        [noise.foreground]
        enabled = true
        fit_years = 1
        [[galactic_binaries.binary]]
        id = "loud-a"
        f0_hz = 2.9712e-3
        amp = 3e-22
        beta_rad = 0.4
        lambda_rad = 1.2
        iota_rad = 0.8
        [[galactic_binaries.binary]]
        id = "loud-b"
        f0_hz = 3.0305e-3
        amp = 2e-22
        beta_rad = -0.7
        lambda_rad = 4.0
        iota_rad = 1.4
        """;

    private static string Config(string data, string run) => $$"""
        data = "{{data}}"
        run_folder = "{{run}}"
        seed = 5
        iterations = 10
        burn_in = 4
        checkpoint_every = 1
        threads = 2
        [galactic_binaries]
        f_min_hz = 2.95e-3
        f_max_hz = 3.05e-3
        window_bins = 128
        padding_bins = 48
        steps_per_update = 300
        temperatures = 3
        max_sources_per_window = 6
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        [noise]
        steps_per_update = 30
        foreground_fit_years = 1
        """;

    [Fact]
    public void A_fit_killed_after_five_iterations_and_resumed_ends_with_the_same_catalogue_bytes_as_an_uninterrupted_fit()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", Scenario), "--out", data).ExitCode);
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
        Assert.True(JsonDocument.Parse(catalogue.Out).RootElement.GetProperty("entries").GetArrayLength() >= 2);
        var trace = CliRun.Run("trace", killedRun, "--json");
        Assert.Equal(0, trace.ExitCode);
    }

    [Fact]
    public void A_terminate_signal_checkpoints_the_last_complete_iteration_and_exits_with_code_130()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", Scenario), "--out", data).ExitCode);
        string run = folder.File("run");
        using var fit = Globalfit.Start("fit", folder.Write("fit.toml", Config(data, run).Replace("checkpoint_every = 1", "checkpoint_every = 100", StringComparison.Ordinal)));
        WaitForIteration(run, 2, fit, TimeSpan.FromMinutes(5));
        using (var signal = Process.Start("kill", ["-TERM", fit.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)])) signal.WaitForExit();
        Assert.True(fit.WaitForExit(TimeSpan.FromMinutes(2)), "the fit did not stop after SIGTERM");
        Assert.Equal(130, fit.ExitCode);
        var status = JsonDocument.Parse(CliRun.Run("status", run, "--json").Out).RootElement;
        Assert.Equal("interrupted", status.GetProperty("state").GetString());
        long iteration = status.GetProperty("iteration").GetInt64();
        Assert.True(iteration >= 2);
        // checkpoint_every = 100, so this checkpoint can only come from the signal.
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
