using System.Numerics;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.Series;

namespace GlobalFit.Cli.Bench;

/// <summary>Quick measurements of the series kernels: the inner product against a memory copy of the same
/// bytes, and FFTs of 2^22 points (the BenchmarkDotNet versions live in tests/GlobalFit.Benchmarks/Series).</summary>
public static class SeriesBench
{
    /// <summary>Runs the measurements and returns their figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        const int bins = 1_000_000;
        var random = new Random(1);
        var a = new Complex[bins];
        var b = new Complex[bins];
        var w = new double[bins];
        for (int k = 0; k < bins; k++)
        {
            a[k] = new Complex(random.NextDouble(), random.NextDouble());
            b[k] = new Complex(random.NextDouble(), random.NextDouble());
            w[k] = 1 + random.NextDouble();
        }
        double bytes = bins * (16.0 + 16.0 + 8.0);
        double sink = 0;
        double innerSeconds = QuickTimer.BestSeconds(() => sink += InnerProduct.Real(a, b, w, 1e-8), 20);
        var target = new Complex[bins];
        double copySeconds = QuickTimer.BestSeconds(() =>
        {
            a.AsSpan().CopyTo(target);
            b.AsSpan(0, bins / 2).CopyTo(target);
            b.AsSpan(bins / 2).CopyTo(target);
        }, 20);
        GC.KeepAlive(sink);
        yield return new BenchFigure("inner_product_1e6_bins_gigabytes_per_s", bytes / innerSeconds / 1e9, "noise-weighted inner product over 1e6 bins, bytes read per second");
        yield return new BenchFigure("memory_copy_same_bytes_gigabytes_per_s", bytes / copySeconds / 1e9, "memory copy of the same number of bytes (baseline)");

        const int n = 1 << 22;
        var data = new Complex[n];
        for (int i = 0; i < n; i++) data[i] = new Complex(random.NextDouble(), 0);
        var plan = FftPlan.ForLength(n);
        double fftSeconds = QuickTimer.BestSeconds(() => plan.Forward(data), 3);
        yield return new BenchFigure("fft_complex_2p22_ms", fftSeconds * 1e3, "in-place complex FFT of 2^22 points");
        var real = new double[n];
        for (int i = 0; i < n; i++) real[i] = random.NextDouble();
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        double realSeconds = QuickTimer.BestSeconds(() => FourierTransform.Forward(real, 5.0, spectrum), 3);
        yield return new BenchFigure("fft_real_2p22_ms", realSeconds * 1e3, "real-to-one-sided transform of 2^22 samples");
    }
}
