namespace GlobalFit.Cli.Commands;

/// <summary>The built-in demo scenario: an invented month of data with instrument noise, the confusion
/// foreground and an invented population of galactic binaries. Other source classes join as they arrive.</summary>
internal static class DemoScenario
{
    public const string Toml = """
        # Built-in demo: one invented month of observation with noise, the galactic foreground and an
        # invented population of galactic binaries (a few loud enough to be resolved over a weak crowd).
        name = "demo: one month of galactic binaries"
        seed = 20261201

        [observation]
        duration_days = 30
        cadence_s = 5

        [noise]
        acceleration_asd = 3e-15
        oms_asd = 15e-12

        [noise.foreground]
        enabled = true
        fit_years = 1
        amplitude = 1.0

        [galactic_binaries.population]
        count = 4000
        f_min_hz = 1e-3
        f_max_hz = 8e-3
        """;
}
