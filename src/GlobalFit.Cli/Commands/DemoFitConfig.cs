namespace GlobalFit.Cli.Commands;

/// <summary>The run configuration the demo fits its simulated month with: each demo class's section
/// (<see cref="Engine.SourceClasses.IDemoPart.FitToml"/>), and the noise levels and foreground refitted every
/// iteration.</summary>
internal static class DemoFitConfig
{
    /// <summary>Iterations of the demo fit by default (about two minutes for the whole demo on two cores).</summary>
    public const int Iterations = 24;

    /// <summary>The configuration with <paramref name="iterations"/> iterations, a third of them burn-in.</summary>
    public static string Toml(int iterations) => string.Join("\n\n", [Header(iterations), .. DemoScenario.Parts.Select(p => p.FitToml), Noise]) + "\n";

    private static string Header(int iterations) => $"""
        # Built-in demo fit: every demo class plus the noise model, on the demo's month of data.
        data = "data.h5"
        run_folder = "run"
        seed = 7
        iterations = {iterations}
        burn_in = {iterations / 3}
        checkpoint_every_iterations = 8
        """;

    private const string Noise = """
        [noise]
        steps_per_update = 40
        """;
}
