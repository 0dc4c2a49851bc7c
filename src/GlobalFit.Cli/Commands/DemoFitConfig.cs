namespace GlobalFit.Cli.Commands;

/// <summary>The run configuration the demo fits its simulated month with: galactic binaries in the band where the
/// scenario's loud binaries lie, and the noise levels and foreground refitted every iteration.</summary>
internal static class DemoFitConfig
{
    /// <summary>Iterations of the demo fit by default (about three minutes on two cores).</summary>
    public const int Iterations = 24;

    /// <summary>The configuration with <paramref name="iterations"/> iterations, a third of them burn-in.</summary>
    public static string Toml(int iterations) => $$"""
        # Built-in demo fit: galactic binaries between 2 and 5 mHz plus the noise model, on the demo's month of data.
        data = "data.h5"
        run_folder = "run"
        seed = 7
        iterations = {{iterations}}
        burn_in = {{iterations / 3}}
        checkpoint_every = 8

        [galactic_binaries]
        f_min_hz = 2e-3
        f_max_hz = 5e-3
        window_bins = 256
        padding_bins = 64
        steps_per_update = 300
        temperatures = 4
        max_sources_per_window = 12
        # A coarser F-statistic map than the default: the map is rebuilt every update and dominates its cost.
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8

        [noise]
        steps_per_update = 40
        # The demo scenario simulates the foreground of the one-year fit; the default would take the shape nearest
        # the record's length (half a year), which is louder between 1 and 4 mHz.
        foreground_fit_years = 1
        """;
}
