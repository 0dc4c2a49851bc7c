using System.Numerics;
using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Benchmarks.GalacticBinaries;

/// <summary>Cost of the fast galactic-binary template for one Julian year at 5 s: a 3 mHz source (N = 64), alone,
/// with the band-limited log-likelihood, and the F-statistic; against one day of the brute-force response
/// (multiply by 365.25 for the year).</summary>
[MemoryDiagnoser]
public class GalacticBinaryTemplateBenchmarks
{
    private const double Cadence = 5.0;

    private readonly GalacticBinaryParameters _source = new(3e-3, 1e-17, 1e-21, 0.4, 1.9, 0.8, 0.6, 0.25);
    private GalacticBinaryTemplateGenerator _generator = null!;
    private GalacticBinaryBandLikelihood _likelihood = null!;
    private FStatistic _statistic = null!;
    private GalacticBinaryBand _band = null!;
    private BinWindow _window;
    private Complex[] _a = null!, _e = null!, _t = null!;
    private MonochromaticBinaryStrain _strain = null!;

    /// <summary>Builds the generator, a band of the template's bins plus 32 on each side, and the data (the source itself).</summary>
    [GlobalSetup]
    public void Setup()
    {
        _generator = new GalacticBinaryTemplateGenerator(PhysicalConstants.JulianYearS, Cadence);
        var bins = _generator.TemplateBins(_source.FrequencyHz, _source.FrequencyDerivativeHzS);
        _window = new BinWindow(bins.First - 32, bins.Count + 64);
        (_a, _e, _t) = (new Complex[_window.Count], new Complex[_window.Count], new Complex[_window.Count]);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        double df = _generator.FrequencyResolutionHz;
        var dataA = new Complex[_window.Count];
        var dataE = new Complex[_window.Count];
        _generator.AddResponse(_source, _window, dataA, dataE, Span<Complex>.Empty);
        var psd = new double[_window.Count];
        var inverseA = new double[_window.Count];
        var inverseE = new double[_window.Count];
        noise.FillPsd(AetChannel.A, _window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, _window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        _band = new GalacticBinaryBand(_window, df, dataA, dataE, inverseA, inverseE);
        _likelihood = new GalacticBinaryBandLikelihood(_generator, _band);
        _statistic = new FStatistic(_generator);
        _strain = new MonochromaticBinaryStrain(_source.FrequencyHz, _source.FrequencyDerivativeHzS, _source.Amplitude,
            _source.InclinationRad, _source.PolarisationRad, _source.InitialPhaseRad, new SkyPosition(_source.EclipticLatitudeRad, _source.EclipticLongitudeRad));
    }

    /// <summary>Template (A, E) plus (d|h) − ½(h|h): the sampler's inner loop.</summary>
    [Benchmark(Baseline = true)]
    public double TemplateAndLogLikelihood() => _likelihood.LogLikelihoodRatio(_source);

    /// <summary>A, E and T added into a window.</summary>
    [Benchmark]
    public void TemplateAet() => _generator.AddResponse(_source, _window, _a, _e, _t);

    /// <summary>F-statistic at the source's intrinsic parameters (A and E).</summary>
    [Benchmark]
    public double FStatisticValue() => _statistic.Evaluate(GalacticBinaryIntrinsics.Of(_source), _band).Value;

    /// <summary>Brute-force X, Y, Z, A, E, T over one day at 5 s.</summary>
    [Benchmark]
    public TdiResponse BruteForceOneDay() => SlowReferenceResponse.Compute(_strain, _generator.Orbits, 0.0, Cadence, 17_280);
}
