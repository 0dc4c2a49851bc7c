using BenchmarkDotNet.Attributes;
using GlobalFit.Inference.Random;

namespace GlobalFit.Benchmarks.Inference;

/// <summary>
/// Cost of one standard normal draw from <see cref="RandomStream"/>, against one 64-bit uniform output as the floor;
/// Gaussian draws are the largest item of the sampler's per-step overhead (the adaptive Gaussian proposal takes d of
/// them per step).
/// </summary>
[MemoryDiagnoser]
public class GaussianDrawBenchmarks
{
    /// <summary>Draws per benchmark invocation.</summary>
    public const int DrawsPerInvoke = 1_000;

    private RandomStream _random = RandomStream.FromSeed(1);

    /// <summary>One xoshiro256** output.</summary>
    /// <returns>A value that keeps the work observable.</returns>
    [Benchmark(Baseline = true, OperationsPerInvoke = DrawsPerInvoke)]
    public ulong Uniform()
    {
        ulong sum = 0;
        for (int i = 0; i < DrawsPerInvoke; i++)
        {
            sum ^= _random.NextUInt64();
        }

        return sum;
    }

    /// <summary>One standard normal draw.</summary>
    /// <returns>A value that keeps the work observable.</returns>
    [Benchmark(OperationsPerInvoke = DrawsPerInvoke)]
    public double Gaussian()
    {
        double sum = 0.0;
        for (int i = 0; i < DrawsPerInvoke; i++)
        {
            sum += _random.NextGaussian();
        }

        return sum;
    }
}
