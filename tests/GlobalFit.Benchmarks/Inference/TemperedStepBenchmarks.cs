using BenchmarkDotNet.Attributes;
using GlobalFit.Inference.Performance;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Benchmarks.Inference;

/// <summary>A tempered step (8 rungs × 2 replicas, swaps every step, adapting ladder) with a cheap likelihood,
/// which exposes the bookkeeping cost that a realistic likelihood hides.</summary>
[MemoryDiagnoser]
public class TemperedStepBenchmarks
{
    private ParallelTemperingSampler<SpinLikelihoodModel> _sampler = null!;

    /// <summary>Builds a warmed-up tempered sampler.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _sampler = new ParallelTemperingSampler<SpinLikelihoodModel>(new SpinLikelihoodModel(8, 0), new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings { TemperatureCount = 8, ChainsPerTemperature = 2 },
            Seed = 2,
        });
        _sampler.Advance(2_000);
    }

    /// <summary>One step of all 16 chains plus a swap round.</summary>
    [Benchmark(OperationsPerInvoke = 100)]
    public void TemperedStep() => _sampler.Advance(100);
}
