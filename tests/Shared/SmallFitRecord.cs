namespace GlobalFit.Tests.Shared;

/// <summary>The small record and run configuration the end-to-end fit tests of the engine and of the command share: a
/// month at 15 s with the foreground and three loud binaries (SNR about 20–60) near 3 mHz, two in one window, and
/// instrument levels 20 % away from the defaults the fit starts from; fitted by two 128-bin windows plus the noise
/// model, a second or so per iteration.</summary>
internal static class SmallFitRecord
{
    /// <summary>Injected f0 of the three binaries.</summary>
    public static readonly double[] BinaryFrequenciesHz = [2.9712e-3, 2.9911e-3, 3.0305e-3];

    /// <summary>The injected instrument levels.</summary>
    public const double InjectedAccelerationAsd = 3.6e-15, InjectedOmsAsd = 12e-12;

    public const string Scenario = """
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
        amplitude = 3e-22
        beta_rad = 0.4
        lambda_rad = 1.2
        iota_rad = 0.8
        psi_rad = 0.5
        phi0_rad = 2.0
        [[galactic_binaries.binary]]
        id = "loud-b"
        f0_hz = 2.9911e-3
        amplitude = 2e-22
        beta_rad = -0.7
        lambda_rad = 4.0
        iota_rad = 1.4
        psi_rad = 2.5
        phi0_rad = 0.3
        [[galactic_binaries.binary]]
        id = "loud-c"
        f0_hz = 3.0305e-3
        amplitude = 1e-22
        beta_rad = 1.0
        lambda_rad = 5.5
        iota_rad = 0.3
        psi_rad = 1.0
        phi0_rad = 4.0
        """;

    /// <summary>The run configuration.</summary>
    /// <param name="dataPath">The simulated record.</param>
    /// <param name="runFolder">The run folder.</param>
    /// <param name="iterations">Iterations; half are burn-in.</param>
    /// <param name="threads">Compute threads.</param>
    /// <param name="stepsPerUpdate">Band-worker steps per update (more makes each iteration slower).</param>
    /// <param name="checkpointEvery">Checkpoint cadence.</param>
    public static string FitConfig(string dataPath, string runFolder, int iterations, int threads, int stepsPerUpdate = 120, int checkpointEvery = 1) => $$"""
        data = "{{dataPath}}"
        run_folder = "{{runFolder}}"
        seed = 99
        iterations = {{iterations}}
        burn_in = {{iterations / 2}}
        checkpoint_every_iterations = {{checkpointEvery}}
        threads = {{threads}}
        [galactic_binaries]
        f_min_hz = 2.95e-3
        f_max_hz = 3.05e-3
        window_bins = 128
        margin_bins = 48
        steps_per_update = {{stepsPerUpdate}}
        temperatures = 3
        max_sources_per_window = 6
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        [noise]
        steps_per_update = 30
        """;
}
