using System.Globalization;
using System.Text.Json;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>The options of <c>catalogue</c>, <c>resume</c>, <c>sensitivity</c> and <c>simulate</c> that let a user choose
/// what to export, extend a run, and set the noise or the seed from the command line.</summary>
public class CommandOptionsTests
{
    [Fact]
    public void Catalogue_options_choose_burn_in_floors_and_samples_and_export_the_noise_posterior_and_resume_extends_a_finished_run()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5"), run = folder.File("run");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        var fit = CliRun.Run("fit", folder.Write("fit.toml", SmallFitRecord.FitConfig(data, run, iterations: 2, threads: 1, stepsPerUpdate: 20)));
        Assert.True(fit.ExitCode == 0, fit.Error);

        JsonElement Sources(params string[] options) =>
            JsonDocument.Parse(CliRun.Run(["catalogue", run, "--format", "json", .. options]).Out).RootElement.GetProperty("sources");

        // The noise posterior is a row of its own, with the levels and the foreground amplitude.
        var noise = Sources().EnumerateArray().Single(s => s.GetProperty("class").GetString() == "noise");
        Assert.Contains("foreground_amplitude_relative", noise.GetProperty("parameters").EnumerateArray().Select(p => p.GetString()));
        // burn_in is 1 of 2 iterations; --burn-in 0 keeps the first iteration's samples too.
        long kept = noise.GetProperty("sample_count").GetInt64();
        long all = Sources("--burn-in", "0").EnumerateArray().Single(s => s.GetProperty("class").GetString() == "noise").GetProperty("sample_count").GetInt64();
        Assert.Equal(2 * kept, all);
        // --no-samples: summaries and counts only.
        Assert.All(Sources("--no-samples").EnumerateArray(), s =>
        {
            Assert.False(s.TryGetProperty("samples", out _));
            Assert.True(s.GetProperty("sample_count").GetInt64() > 0);
        });
        // An SNR floor above every source leaves the noise row (which has no SNR); a confidence above 1 is refused.
        Assert.Equal(["noise"], Sources("--min-snr", "1e6").EnumerateArray().Select(s => s.GetProperty("id").GetString()));
        Assert.Contains("noise", Sources("--min-confidence", "1").EnumerateArray().Select(s => s.GetProperty("id").GetString()));
        Assert.NotEqual(0, CliRun.Run("catalogue", run, "--min-confidence", "1.5").ExitCode);
        Assert.Equal(2, CliRun.Run("catalogue", run, "--no-samples").ExitCode);   // CSV holds no samples to leave out

        // resume --iterations: fewer than done is refused; more extends the finished run.
        Assert.Equal(2, CliRun.Run("resume", run, "--iterations", "1").ExitCode);
        var extended = CliRun.Run("resume", run, "--iterations", "3");
        Assert.True(extended.ExitCode == 0, extended.Error);
        var status = JsonDocument.Parse(CliRun.Run("status", run, "--json").Out).RootElement;
        Assert.Equal((3L, 3L, "completed"), (status.GetProperty("iteration").GetInt64(), status.GetProperty("iterations_total").GetInt64(), status.GetProperty("state").GetString()));
        Assert.Contains("iterations = 3\n", File.ReadAllText(Path.Combine(run, "run.toml")));
    }

    [Fact]
    public void Sensitivity_takes_the_noise_levels_or_a_scenario()
    {
        using var folder = new TempFolder();
        double PsdA(params string[] options)
        {
            string csv = folder.File(Guid.NewGuid().ToString("N") + ".csv");
            Assert.Equal(0, CliRun.Run(["sensitivity", "--out", csv, "--f-min", "1e-2", "--f-max", "2e-2", "--points", "2", .. options]).ExitCode);
            return double.Parse(File.ReadAllLines(csv)[1].Split(',')[1], CultureInfo.InvariantCulture);
        }
        double standard = PsdA();
        // At 10 mHz the optical-metrology term dominates S_A (derived: the acceleration term falls as f⁻⁴ and is about
        // 1/20 of it there), so doubling its ASD raises S_A by nearly 4.
        Assert.InRange(PsdA("--oms-asd", "30e-12") / standard, 3.5, 4.0);
        Assert.True(PsdA("--acceleration-asd", "6e-15") > standard);
        string scenario = folder.Write("noise.toml", "name = \"loud\"\n[observation]\nduration_days = 1\n[noise]\noms_asd = 30e-12\n");
        Assert.Equal(PsdA("--oms-asd", "30e-12"), PsdA("--scenario", scenario), 1e-9 * standard);   // same model by two paths: rounding only
        Assert.Equal(2, CliRun.Run("sensitivity", "--out", folder.File("x.csv"), "--scenario", scenario, "--oms-asd", "1e-11").ExitCode);
        Assert.Equal(2, CliRun.Run("sensitivity", "--out", folder.File("y.csv"), "--oms-asd", "-1").ExitCode);
    }

    [Fact]
    public void Simulate_seed_overrides_the_scenarios_and_is_recorded()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        string first = folder.File("a.h5"), second = folder.File("b.h5");
        Assert.Equal(0, CliRun.Run("simulate", scenario, "--out", first, "--seed", "99").ExitCode);
        Assert.Equal(0, CliRun.Run("simulate", scenario, "--out", second).ExitCode);
        var inspected = JsonDocument.Parse(CliRun.Run("inspect", first, "--json").Out).RootElement;
        Assert.Equal("99", inspected.GetProperty("provenance").GetProperty("seed").GetString());
        Assert.Equal("7", JsonDocument.Parse(CliRun.Run("inspect", second, "--json").Out).RootElement.GetProperty("provenance").GetProperty("seed").GetString());
    }
}
