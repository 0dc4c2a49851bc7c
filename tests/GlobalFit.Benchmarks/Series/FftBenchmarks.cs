using System.Numerics;
using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.Series;

/// <summary>Complex FFT of 2^22 points, and the real transform of 2^22 samples to the one-sided spectrum.</summary>
[MemoryDiagnoser]
public class FftBenchmarks
{
    private const int Length = 1 << 22;
    private Complex[] _complex = [];
    private double[] _real = [];
    private Complex[] _spectrum = [];

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(2);
        _complex = Enumerable.Range(0, Length).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
        _real = Enumerable.Range(0, Length).Select(_ => random.NextDouble()).ToArray();
        _spectrum = new Complex[FourierTransform.OneSidedLength(Length)];
        FftPlan.ForLength(Length);
    }

    [Benchmark]
    public void ComplexFft4M() => FftPlan.ForLength(Length).Forward(_complex);

    [Benchmark]
    public void RealForward4M() => FourierTransform.Forward(_real, 5.0, _spectrum);
}
