namespace GlobalFit.Cli.Commands;

/// <summary>The built-in demo scenario: an invented month of data with instrument noise and the
/// confusion foreground. Sources are added here as their classes arrive.</summary>
internal static class DemoScenario
{
    public const string Toml = """
        # Built-in demo: one invented month of observation, noise and galactic foreground only.
        name = "demo: one quiet month"
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
        """;
}
