using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;

namespace GlobalFit.Engine.Tests.Runs;

public sealed class NoiseOnlyFitTests
{
    private const string Scenario = """
        name = "noise only, levels off the defaults"
        seed = 777
        [observation]
        duration_days = 30
        cadence_s = 15
        [noise]
        acceleration_asd = 2.5e-15
        oms_asd = 18e-12
        [noise.foreground]
        enabled = true
        fit_years = 1
        amplitude = 1.3
        """;

    [Fact]
    public void A_noise_only_fit_recovers_the_injected_levels_within_their_posterior_widths()
    {
        using var folder = new TemporaryRunFolder();
        string dataPath = folder.File("noise.h5");
        FitRunFixture.Simulate(Scenario, dataPath);
        string config = folder.File("fit.toml");
        File.WriteAllText(config, $$"""
            data = "{{dataPath}}"
            run_folder = "{{folder.File("run")}}"
            iterations = 8
            burn_in = 3
            [noise]
            steps_per_update = 60
            [noise.foreground]
            fit_years = 1
            """);
        var (outcome, _) = FitRunFixture.Fit(config);
        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
        var samples = NoiseSamples.After(new RunFolderLayout(folder.File("run")), 3);
        // 3σ per level (false-failure rate ≈ 0.3 % each if the posterior is Gaussian and the chain has mixed).
        NoiseSamples.AssertWithin(samples, "acceleration_asd_ae_m_s2_rthz", 2.5e-15);
        NoiseSamples.AssertWithin(samples, "oms_asd_ae_m_rthz", 18e-12);
        NoiseSamples.AssertWithin(samples, "foreground_amplitude_relative", 1.3);
    }
}
