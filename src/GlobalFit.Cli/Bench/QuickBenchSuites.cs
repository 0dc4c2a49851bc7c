using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.SourceClasses;

namespace GlobalFit.Cli.Bench;

/// <summary>Every suite <c>globalfit bench</c> runs: the class-neutral kernels here, then each registered class's own.</summary>
public static class QuickBenchSuites
{
    /// <summary>The suites in run order.</summary>
    public static IReadOnlyList<QuickBenchSuite> All { get; } =
    [
        new("inner product and FFT", SeriesBench.Run),
        new("noise synthesis", NoiseBench.Run),
        new("sampler overhead", SamplerBench.Run),
        .. SourceClassRegistry.Default.Classes.SelectMany(c => c.BenchSuites),
        new("engine orchestration", OrchestrationBench.Run),
    ];
}
