using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.Noise;

/// <summary>One Julian year of A/E/T noise: at 5 s cadence (6,311,520 samples, not a power of two, so the
/// inverse FFT takes MathNet's Bluestein path) and at the nearest power of two, 2^23 samples (≈3.76 s cadence,
/// packed radix-2 path).</summary>
[MemoryDiagnoser]
public class NoiseSynthesisBenchmarks
{
    private AetNoiseModel _model = null!;
    private double[] _normals = null!;
    private double _dtSeconds;

    /// <summary>Samples per channel.</summary>
    [Params(6_311_520, 8_388_608)]
    public int SamplesPerChannel { get; set; }

    /// <summary>Builds the model and a fixed set of draws (their values do not affect the cost).</summary>
    [GlobalSetup]
    public void Setup()
    {
        _model = new AetNoiseModel(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));
        _dtSeconds = PhysicalConstants.JulianYearS / SamplesPerChannel;
        var random = new Random(1);
        _normals = new double[NoiseSynthesis.RequiredNormalCount(SamplesPerChannel)];
        for (int i = 0; i < _normals.Length; i++) _normals[i] = 2.0 * random.NextDouble() - 1.0;
        _model.FillPsd(AetChannel.A, 1e-4, 1e-4, new double[300]);
    }

    /// <summary>PSD evaluation, colouring and inverse FFT for A, E and T.</summary>
    [Benchmark]
    public AetTimeSeries SynthesiseOneYear() =>
        NoiseSynthesis.SynthesiseAet(_model, SamplesPerChannel, _dtSeconds, 0.0, _normals, _normals, _normals);

    /// <summary>The PSD of one channel over all one-sided bins (the model part of the cost).</summary>
    [Benchmark]
    public double FillPsdOneChannel()
    {
        var psd = new double[SamplesPerChannel / 2 + 1];
        _model.FillPsd(AetChannel.A, 0.0, 1.0 / (SamplesPerChannel * _dtSeconds), psd);
        return psd[^1];
    }
}
