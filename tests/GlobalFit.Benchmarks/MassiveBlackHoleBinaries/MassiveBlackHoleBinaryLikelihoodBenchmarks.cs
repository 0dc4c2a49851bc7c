using System.Numerics;
using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.MassiveBlackHoleBinaries;

/// <summary>Cost of the massive black-hole binary template and likelihoods: a 1e6 M_sun binary (q = 2) merging 25 days into a
/// 30.3-day record at 10 s, on its natural grid from 0.1 mHz to the model's cut-off 0.2/M (106182 bins); the full likelihood over
/// those bins against the heterodyned one (156 bins); and the two halves of an edge evaluation (waveform, response).</summary>
[MemoryDiagnoser]
public class MassiveBlackHoleBinaryLikelihoodBenchmarks
{
    private const double Cadence = 10.0;
    private const int SampleCount = 1 << 18;

    private readonly MassiveBlackHoleBinaryParameters _source = new(
        BinaryMasses.FromComponents(6.6667e5, 3.3333e5).ChirpMass, 2.0, 0.5, 0.2, 25.0 * 86400.0, 3e4, -0.3, 4.0, 1.0, 0.4, 2.2);

    private MassiveBlackHoleBinaryParameters _nearby;
    private MassiveBlackHoleBinaryTemplateGenerator _generator = null!;
    private MassiveBlackHoleBinaryData _data = null!;
    private MassiveBlackHoleBinaryLikelihood _full = null!;
    private MassiveBlackHoleBinaryHeterodynedLikelihood _heterodyned = null!;
    private MassiveBlackHoleBinaryResponse _response = null!;
    private double[] _edges = null!, _amplitude = null!, _phase = null!, _time = null!;
    private Complex[] _a = null!, _e = null!, _t = null!;
    private Complex[] _gridA = null!, _gridE = null!, _gridT = null!;

    /// <summary>Builds the grid, noise-free data (the source itself), both likelihoods and edge buffers.</summary>
    [GlobalSetup]
    public void Setup()
    {
        double df = 1.0 / (SampleCount * Cadence);
        double fMax = MassiveBlackHoleBinaryTemplateGenerator.Waveform(_source).MaximumFrequencyHz;
        int first = (int)Math.Ceiling(1e-4 / df);
        int last = Math.Min(SampleCount / 2, (int)Math.Floor(fMax / df));
        var window = new BinWindow(first, last - first + 1);
        var orbits = new RigidOrbits();
        _generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, window.Count, earliestTimeS: 0.0);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var channels = new Complex[3][];
        var inverse = new double[3][];
        var kinds = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            var psd = new double[window.Count];
            noise.FillPsd(kinds[c], first * df, df, psd);
            inverse[c] = new double[window.Count];
            InnerProduct.InvertPsd(psd, inverse[c]);
            channels[c] = new Complex[window.Count];
        }
        _generator.RenderBins(_source, window, df, channels[0], channels[1], channels[2]);
        _data = new MassiveBlackHoleBinaryData(window, df, channels, inverse);
        _full = new MassiveBlackHoleBinaryLikelihood(_generator, _data);
        _heterodyned = new MassiveBlackHoleBinaryHeterodynedLikelihood(_generator.WithOwnBuffers(), _data, _source);
        _nearby = _source with { ChirpMassMsun = _source.ChirpMassMsun * (1 + 1e-5), CoalescenceTimeS = _source.CoalescenceTimeS + 1.0 };
        _edges = _heterodyned.BinEdgesHz.ToArray();
        int n = _edges.Length;
        (_amplitude, _phase, _time) = (new double[n], new double[n], new double[n]);
        (_a, _e, _t) = (new Complex[n], new Complex[n], new Complex[n]);
        _response = new MassiveBlackHoleBinaryResponse(orbits);
        (_gridA, _gridE, _gridT) = (new Complex[window.Count], new Complex[window.Count], new Complex[window.Count]);
    }

    /// <summary>A, E, T on all 106182 bins of the natural grid.</summary>
    [Benchmark]
    public void TemplateOnNaturalGrid() =>
        _generator.RenderBins(_nearby, _data.Window, _data.DfHz, _gridA, _gridE, _gridT);

    /// <summary>Full log-likelihood ratio (template plus inner products over every bin).</summary>
    [Benchmark(Baseline = true)]
    public double FullLogLikelihood() => _full.LogLikelihoodRatio(_nearby);

    /// <summary>Heterodyned log-likelihood ratio (template at the 157 bin edges plus the binned sums).</summary>
    [Benchmark]
    public double HeterodynedLogLikelihood() => _heterodyned.LogLikelihoodRatio(_nearby);

    /// <summary>IMRPhenomD amplitude, phase and time at the 157 edges.</summary>
    [Benchmark]
    public void WaveformAtEdges() => MassiveBlackHoleBinaryTemplateGenerator.Waveform(_nearby).Evaluate(_edges, _amplitude, _phase, _time);

    /// <summary>Response transfer functions at the 157 edges.</summary>
    [Benchmark]
    public void ResponseAtEdges() =>
        _response.Transfer(_edges, _time, new SkyPosition(_nearby.EclipticLatitudeRad, _nearby.EclipticLongitudeRad),
            _nearby.PolarisationRad, _nearby.InclinationRad, _nearby.ReferencePhaseRad, _a, _e, _t);
}
