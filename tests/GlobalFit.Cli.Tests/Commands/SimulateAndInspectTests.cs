using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class SimulateAndInspectTests
{
    [Fact]
    public void Simulated_noise_inspects_as_consistent_with_its_own_model()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        string data = folder.File("d.h5");
        var simulate = CliRun.Run("simulate", scenario, "--out", data);
        Assert.Equal(0, simulate.ExitCode);
        Assert.Contains("17280 points per channel", simulate.Out);

        var inspect = CliRun.Run("inspect", data, "--json");
        Assert.Equal(0, inspect.ExitCode);
        using var json = JsonDocument.Parse(inspect.Out);
        var root = json.RootElement;
        Assert.Equal(17280, root.GetProperty("points_per_channel").GetInt32());
        Assert.Equal(10.0, root.GetProperty("cadence_s").GetDouble());
        Assert.Equal("7", root.GetProperty("provenance").GetProperty("seed").GetString());
        foreach (var channel in root.GetProperty("channels").EnumerateArray())
        {
            // Welch estimate over model: mean 1 with the standard error the report gives; 5σ keeps the
            // false-failure rate below 1e-6 per channel (the seed is fixed, so the run is repeatable anyway).
            double ratio = channel.GetProperty("mean_estimate_over_model").GetDouble();
            double se = channel.GetProperty("mean_ratio_standard_error").GetDouble();
            Assert.InRange(ratio, 1 - 5 * se, 1 + 5 * se);
        }
        foreach (var pair in root.GetProperty("cross_channels").EnumerateArray())
        {
            // Mean coherence of independent noises is 1/K'; allow a factor of two either way.
            double c = pair.GetProperty("mean_coherence").GetDouble();
            double expected = pair.GetProperty("expected_for_independent").GetDouble();
            Assert.InRange(c, 0.5 * expected, 2 * expected);
        }
    }

    [Fact]
    public void The_same_scenario_and_seed_give_identical_samples()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        Assert.Equal(0, CliRun.Run("simulate", scenario, "--out", folder.File("a.h5")).ExitCode);
        Assert.Equal(0, CliRun.Run("simulate", scenario, "--out", folder.File("b.h5")).ExitCode);
        var a = Physics.DataFiles.ObservationFile.Read(folder.File("a.h5")).Data;
        var b = Physics.DataFiles.ObservationFile.Read(folder.File("b.h5")).Data;
        Assert.Equal(a.A.Samples, b.A.Samples);
        Assert.Equal(a.T.Samples, b.T.Samples);
    }

    [Fact]
    public void Inspect_text_report_names_the_scenario_and_channels()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        CliRun.Run("simulate", scenario, "--out", folder.File("d.h5"));
        var inspect = CliRun.Run("inspect", folder.File("d.h5"), "--png", folder.File("psd.png"));
        Assert.Equal(0, inspect.ExitCode);
        Assert.Contains("scenario      two test days", inspect.Out);
        Assert.Contains("  A  rms", inspect.Out);
        Assert.Contains("injected      none", inspect.Out);
        Assert.True(new FileInfo(folder.File("psd.png")).Length > 10_000);
    }
}
