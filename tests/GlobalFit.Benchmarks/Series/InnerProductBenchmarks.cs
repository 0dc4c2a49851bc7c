using System.Numerics;
using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.Series;

/// <summary>Noise-weighted inner product over a million bins against a plain memory copy of the same bytes,
/// to show how close the kernel runs to memory bandwidth.</summary>
[MemoryDiagnoser]
public class InnerProductBenchmarks
{
    private const int Bins = 1_000_000;
    private Complex[] _a = [], _b = [], _copyTarget = [];
    private double[] _weights = [];

    /// <summary>Bytes the inner product reads per call: two complex arrays and one weight array.</summary>
    public const long BytesRead = Bins * (16L + 16L + 8L);

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(1);
        _a = Enumerable.Range(0, Bins).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
        _b = Enumerable.Range(0, Bins).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
        _weights = Enumerable.Range(0, Bins).Select(_ => 1.0 + random.NextDouble()).ToArray();
        _copyTarget = new Complex[Bins];
    }

    [Benchmark]
    public double InnerProductMillionBins() => InnerProduct.Real(_a, _b, _weights, 1e-8);

    /// <summary>Copies 2.5 complex arrays' worth of bytes (= <see cref="BytesRead"/>, read and written once).</summary>
    [Benchmark(Baseline = true)]
    public void MemoryCopySameBytes()
    {
        _a.AsSpan().CopyTo(_copyTarget);
        _b.AsSpan(0, Bins / 2).CopyTo(_copyTarget);
        _b.AsSpan(Bins / 2).CopyTo(_copyTarget);
    }
}
