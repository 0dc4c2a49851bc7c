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

/// <summary>Cost of the inspiral template for one Julian year at 10 s: the fast stationary-phase template with the
/// log-likelihood over its bins (the sampler's inner loop), for e0 = 0.2 and 0.4, against the direct path (strain at
/// every sample, FFT). At this setting the fast template matches the direct one to ≥ 0.999 (tests).</summary>
/// <remarks>In-process with few iterations: the direct path takes seconds per call, and building a separate benchmark
/// executable of the whole solution exceeded BenchmarkDotNet's two-minute build limit on the shared machine.</remarks>
[MemoryDiagnoser]
[Config(typeof(ShortInProcess))]
public class InspiralTemplateBenchmarks
{
    private sealed class ShortInProcess : ManualConfig
    {
        public ShortInProcess() => AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance)
            .WithLaunchCount(1).WithWarmupCount(2).WithIterationCount(5));
    }

    private const double Cadence = 10.0;
    private ExtremeMassRatioInspiralTemplateGenerator _generator = null!;
    private ExtremeMassRatioInspiralLikelihood _likelihood = null!;
    private ExtremeMassRatioInspiralDirectWaveform _direct = null!;
    private ExtremeMassRatioInspiralParameters _source;

    /// <summary>Initial eccentricity of the source.</summary>
    [Params(0.2, 0.4)]
    public double Eccentricity { get; set; }

    /// <summary>Builds the generator, the data (the source itself) over the template's bins, and the direct path.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _source = new ExtremeMassRatioInspiralParameters(1e6, 10, 0.5, 8e-4, Eccentricity, 0.9, 0.4, 1.9, 1.1, 4.0, 1000, 0.3, 1.2, 2.5);
        _generator = new ExtremeMassRatioInspiralTemplateGenerator(PhysicalConstants.JulianYearS, Cadence);
        var window = _generator.TemplateBins(_source);
        var dataA = new Complex[window.Count];
        var dataE = new Complex[window.Count];
        _generator.AddResponse(_source, window, dataA, dataE, Span<Complex>.Empty);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        double df = _generator.FrequencyResolutionHz;
        var psd = new double[window.Count];
        var inverseA = new double[window.Count];
        var inverseE = new double[window.Count];
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        _likelihood = new ExtremeMassRatioInspiralLikelihood(_generator, window, dataA, dataE, inverseA, inverseE);
        _direct = new ExtremeMassRatioInspiralDirectWaveform(_generator.SampleCount, Cadence);
    }

    /// <summary>Fast template (A, E) plus (d|h) − ½(h|h).</summary>
    [Benchmark(Baseline = true)]
    public double FastTemplateAndLogLikelihood() => _likelihood.LogLikelihoodRatio(_source);

    /// <summary>Everything but the per-bin stationary-phase sums: orbit, coarse grid, amplitudes, sideband choice.</summary>
    [Benchmark]
    public double TemplateWithoutBins() => _generator.TemplateBins(_source).Count;

    /// <summary>Direct path: strain at all 3.2 million samples, two FFTs, transfer factor.</summary>
    [Benchmark]
    public int DirectSpectra() => _direct.Spectra(_source).A.Length;
}
