namespace GlobalFit.Cli.Bench;

/// <summary>A named group of quick measurements.</summary>
/// <param name="Name">Shown while the suite runs.</param>
/// <param name="Run">Runs the measurements.</param>
public sealed record QuickBenchSuite(string Name, Func<IEnumerable<BenchFigure>> Run);

/// <summary>Every suite <c>globalfit bench</c> runs; a new hot kernel adds its suite here.</summary>
public static class QuickBenchSuites
{
    /// <summary>The suites in run order.</summary>
    public static IReadOnlyList<QuickBenchSuite> All { get; } =
    [
        new("inner product and FFT", SeriesBench.Run),
        new("noise synthesis", NoiseBench.Run),
        new("noise likelihood", NoiseLikelihoodBench.Run),
        new("sampler overhead", SamplerBench.Run),
        new("galactic-binary template", GalacticBinaryBench.Run),
        new("engine orchestration", OrchestrationBench.Run),
    ];
}
