using System.Numerics;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.ExtremeMassRatioInspirals;

/// <summary>Cost of one evaluation of the semi-coherent statistic, the unit of the blind search's cost, over one
/// Julian year at 10 s (M = 1e6, μ = 10, e0 = 0.2) for 8, 16 and 32 segments: divided by the segment count it is the
/// cost per segment, and times the search's evaluations (3006 at the defaults) the cost of a blind search per year of
/// data.</summary>
/// <remarks>In-process with few iterations, as <see cref="InspiralTemplateBenchmarks"/>.</remarks>
[MemoryDiagnoser]
[Config(typeof(ShortInProcess))]
public class SemiCoherentStatisticBenchmarks
{
    private sealed class ShortInProcess : ManualConfig
    {
        public ShortInProcess() => AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance)
            .WithLaunchCount(1).WithWarmupCount(2).WithIterationCount(5));
    }

    private SemiCoherentStatistic _statistic = null!;
    private ExtremeMassRatioInspiralParameters _source;
    private int _calls;

    /// <summary>Segments of the statistic.</summary>
    [Params(8, 16, 32)]
    public int Segments { get; set; }

    /// <summary>Builds the generator and the data (the source itself) over the template's bins.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _source = new ExtremeMassRatioInspiralParameters(1e6, 10, 0.5, 1.5e-4, 0.2, 0.9, 0.3, 1.2, 1.0, 2.5, 1000, 0.4, 1.1, 2.0);
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(PhysicalConstants.JulianYearS, 10.0);
        var window = generator.TemplateBins(_source);
        var (dataA, dataE) = (new Complex[window.Count], new Complex[window.Count]);
        generator.AddResponse(_source, window, dataA, dataE, Span<Complex>.Empty);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        double df = generator.FrequencyResolutionHz;
        var (psd, inverseA, inverseE) = (new double[window.Count], new double[window.Count], new double[window.Count]);
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        _statistic = new SemiCoherentStatistic(generator, window, Segments, dataA, dataE, inverseA, inverseE);
    }

    /// <summary>One evaluation at a new point (the orbit is integrated afresh, as in a search).</summary>
    [Benchmark]
    public double Evaluate() => _statistic.Evaluate(_source with { Phi0Rad = 0.4 + 1e-6 * _calls++ });
}
