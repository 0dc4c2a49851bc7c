using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>Small simulated records and run configurations for end-to-end fits through <see cref="FitRunner"/>.</summary>
internal static class FitRunFixture
{
    /// <summary>A month at 15 s with the foreground and three loud binaries (SNR about 20–60) near 3 mHz, two of them in
    /// one window, plus instrument levels 20 % away from the defaults the fit starts from.</summary>
    public const string LoudBinariesScenario = """
        name = "three loud binaries"
        seed = 4242
        [observation]
        duration_days = 30
        cadence_s = 15
        [noise]
        acceleration_asd = 3.6e-15
        oms_asd = 12e-12
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
        psi_rad = 0.5
        phi0_rad = 2.0
        [[galactic_binaries.binary]]
        id = "loud-b"
        f0_hz = 2.9911e-3
        amp = 2e-22
        beta_rad = -0.7
        lambda_rad = 4.0
        iota_rad = 1.4
        psi_rad = 2.5
        phi0_rad = 0.3
        [[galactic_binaries.binary]]
        id = "loud-c"
        f0_hz = 3.0305e-3
        amp = 1e-22
        beta_rad = 1.0
        lambda_rad = 5.5
        iota_rad = 0.3
        psi_rad = 1.0
        phi0_rad = 4.0
        """;

    /// <summary>The injected instrument levels of <see cref="LoudBinariesScenario"/>.</summary>
    public const double InjectedAccelerationAsd = 3.6e-15, InjectedOmsAsd = 12e-12;

    /// <summary>A fit of two 128-bin windows around the binaries plus the noise model.</summary>
    public static string FitConfig(string dataPath, string runFolder, int iterations, int threads, int checkpointEvery = 1) => $$"""
        data = "{{dataPath}}"
        run_folder = "{{runFolder}}"
        seed = 99
        iterations = {{iterations}}
        burn_in = {{iterations / 2}}
        checkpoint_every = {{checkpointEvery}}
        threads = {{threads}}
        [galactic_binaries]
        f_min_hz = 2.95e-3
        f_max_hz = 3.05e-3
        window_bins = 128
        padding_bins = 48
        steps_per_update = 120
        temperatures = 3
        max_sources_per_window = 6
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        [noise]
        steps_per_update = 30
        foreground_fit_years = 1
        """;

    /// <summary>Simulates <paramref name="scenarioToml"/> into <paramref name="path"/>.</summary>
    public static void Simulate(string scenarioToml, string path)
    {
        var scenario = SimulationScenario.FromConfig(ConfigDocument.Parse(scenarioToml, "test scenario"));
        ObservationFile.Write(ObservationSimulator.Simulate(scenario, "globalfit tests", new Dictionary<string, string>(), null), path, overwrite: false);
    }

    /// <summary>Runs a fit to the end with progress collected.</summary>
    public static (FitOutcome Outcome, CollectingProgress Progress) Fit(string configPath)
    {
        var progress = new CollectingProgress();
        var outcome = FitRunner.Start(configPath, new FitRunOptions(progress, null, CancellationToken.None));
        return (outcome, progress);
    }
}

/// <summary>Keeps what a fit reports.</summary>
internal sealed class CollectingProgress : IFitProgress
{
    public List<IterationReport> Reports { get; } = [];

    public List<string> Warnings { get; } = [];

    public void IterationCompleted(IterationReport report)
    {
        lock (Reports) Reports.Add(report);
    }

    public void Warning(string message)
    {
        lock (Warnings) Warnings.Add(message);
    }
}
