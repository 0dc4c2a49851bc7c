using BenchmarkDotNet.Attributes;
using GlobalFit.Inference.Performance;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Benchmarks.Inference;

/// <summary>
/// Sampler overhead per step against a ~10 µs stand-in likelihood. The target is
/// (Step − LikelihoodAndPrior) / LikelihoodAndPrior ≤ 5 % and 0 B allocated per step.
/// </summary>
/// <remarks>Each invocation runs <see cref="StepsPerInvoke"/> operations, so the reported time is per step.
/// The work count is fixed (not calibrated) so that runs on different machines are comparable; on the
/// development machine (2.4 GHz) it costs ≈ 10 µs.</remarks>
[MemoryDiagnoser]
public class SamplerOverheadBenchmarks
{
    /// <summary>Operations per benchmark invocation.</summary>
    public const int StepsPerInvoke = 200;

    private SpinLikelihoodModel _model = null!;
    private ParallelTemperingSampler<SpinLikelihoodModel> _sampler = null!;
    private double[] _point = null!;

    /// <summary>Parameter dimension.</summary>
    [Params(8)]
    public int Dimension { get; set; }

    /// <summary>Multiply-add iterations of the stand-in likelihood; 0 leaves the sampler's own cost per step, which on a
    /// shared machine is a steadier figure than the difference of two 10 µs timings.</summary>
    [Params(6_000, 0)]
    public int WorkIterations { get; set; }

    /// <summary>Builds the model and a warmed-up single-chain sampler with the default proposal mixture.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _model = new SpinLikelihoodModel(Dimension, WorkIterations);
        _sampler = new ParallelTemperingSampler<SpinLikelihoodModel>(_model, new ParallelTemperingSettings { Seed = 1 });
        _sampler.Advance(5_000);
        _point = _sampler.Position(0).ToArray();
    }

    /// <summary>One prior and one likelihood evaluation: the model's share of a step.</summary>
    /// <returns>A value that keeps the work observable.</returns>
    [Benchmark(Baseline = true, OperationsPerInvoke = StepsPerInvoke)]
    public double LikelihoodAndPrior()
    {
        double sum = 0.0;
        for (int i = 0; i < StepsPerInvoke; i++)
        {
            sum += _model.LogPrior(_point) + _model.LogLikelihood(_point);
        }

        return sum;
    }

    /// <summary>One full sampler step: proposal, boundaries, model, accept/reject, adaptation, bookkeeping.</summary>
    [Benchmark(OperationsPerInvoke = StepsPerInvoke)]
    public void Step() => _sampler.Advance(StepsPerInvoke);
}
