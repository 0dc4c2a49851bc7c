using GlobalFit.Engine.Benchmarking;
using GlobalFit.Inference.Performance;

namespace GlobalFit.Cli.Bench;

/// <summary>Quick measurement of the sampler's own cost per step around a ~10 µs likelihood.</summary>
public static class SamplerBench
{
    /// <summary>Runs the measurement and returns its figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var report = SamplerOverheadProbe.Measure();
        yield return new BenchFigure("sampler_step_ns", report.NanosecondsPerStep, $"one sampler step around a {report.LikelihoodNanoseconds / 1e3:F1} µs likelihood, {report.Dimension} parameters");
        yield return new BenchFigure("sampler_overhead_fraction", report.OverheadFraction, "sampler cost beyond the likelihood, as a fraction of it (target ≤ 0.05)");
        yield return new BenchFigure("sampler_bytes_allocated_per_step", report.AllocatedBytesPerStep, "managed allocation per step in steady state (target 0)");
    }
}
