using GlobalFit.Engine.SourceClasses;

namespace GlobalFit.Cli.Commands;

/// <summary>The built-in demo scenario: an invented month of data with instrument noise and the confusion foreground,
/// plus each registered class's invented sources (<see cref="IDemoPart.ScenarioToml"/>).</summary>
internal static class DemoScenario
{
    private const string Observation = """
        # Built-in demo: one invented month of observation with noise, the confusion foreground and the invented
        # sources of every source class in the demo.
        name = "demo: one invented month"
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

    /// <summary>The scenario's TOML.</summary>
    public static string Toml => string.Join("\n\n", [Observation, .. Parts.Select(p => p.ScenarioToml)]) + "\n";

    /// <summary>The demo parts of the registered classes, in registration order.</summary>
    public static IEnumerable<IDemoPart> Parts => SourceClassRegistry.Default.Classes.Select(c => c.Demo).OfType<IDemoPart>();
}
