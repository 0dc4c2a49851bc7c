using System.Diagnostics;
using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>Result of <see cref="GalacticBinaryTemplateProbe.Measure"/>.</summary>
/// <param name="EnvelopeLength">N of the probe source.</param>
/// <param name="LikelihoodsPerSecond">Template plus band-limited log-likelihood evaluations per second on one thread.</param>
/// <param name="BruteForceSeconds">Wall time of the brute-force response of the same source over one day (scaled to
/// the record by <see cref="SpeedupOverBruteForce"/>).</param>
/// <param name="SpeedupOverBruteForce">Time of the brute-force A/E/T over the whole record divided by the time of one
/// fast template plus log-likelihood evaluation.</param>
public readonly record struct GalacticBinaryTemplateMeasurement(int EnvelopeLength, double LikelihoodsPerSecond, double BruteForceSeconds, double SpeedupOverBruteForce);

/// <summary>A quick timing of the galactic-binary template for <c>globalfit bench</c>.</summary>
/// <remarks>Source: f0 = 3 mHz, ḟ = 1e-17 Hz/s, one Julian year at 5 s, default rigid orbits and instrument noise.
/// The likelihood loop runs for about <c>seconds</c> of wall time; the brute force is timed over one day of the record
/// and scaled linearly (its cost is per sample), because a full year takes tens of seconds. Each part is first run for
/// half a second so that the timed code is the optimised one.</remarks>
public static class GalacticBinaryTemplateProbe
{
    private const double WarmUpSeconds = 0.5;

    /// <summary>Times the template and the brute force.</summary>
    /// <param name="seconds">Wall time to spend on the likelihood loop; default 1 s.</param>
    public static GalacticBinaryTemplateMeasurement Measure(double seconds = 1.0)
    {
        const double cadence = 5.0;
        double duration = PhysicalConstants.JulianYearS;
        var generator = new GalacticBinaryTemplateGenerator(duration, cadence);
        var source = new GalacticBinaryParameters(3e-3, 1e-17, 1e-21, 0.4, 1.9, 0.8, 0.6, 0.25);
        var window = generator.TemplateBins(source.FrequencyHz, source.FrequencyDerivativeHzS);
        window = new BinWindow(window.First - 32, window.Count + 64);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var (dataA, dataE) = (new Complex[window.Count], new Complex[window.Count]);
        generator.AddResponse(source, window, dataA, dataE, Span<Complex>.Empty);
        var (inverseA, inverseE) = (new double[window.Count], new double[window.Count]);
        var psd = new double[window.Count];
        noise.FillPsd(AetChannel.A, window.First * generator.FrequencyResolutionHz, generator.FrequencyResolutionHz, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, window.First * generator.FrequencyResolutionHz, generator.FrequencyResolutionHz, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        var likelihood = new GalacticBinaryBandLikelihood(generator, new GalacticBinaryBand(window, generator.FrequencyResolutionHz, dataA, dataE, inverseA, inverseE));

        // Warm up long enough for tiered compilation to replace the first, unoptimised code (it waits ~100 ms and
        // needs ~30 calls per method); timing tier-0 code would understate the rate twentyfold.
        double sink = 0;
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed.TotalSeconds < WarmUpSeconds)
            for (int i = 0; i < 100; i++) sink += likelihood.LogLikelihoodRatio(source with { InitialPhaseRad = 0.001 * i });
        long calls = 0;
        clock.Restart();
        while (clock.Elapsed.TotalSeconds < seconds)
        {
            for (int i = 0; i < 500; i++)
                sink += likelihood.LogLikelihoodRatio(source with { InitialPhaseRad = 1e-4 * i });
            calls += 500;
        }
        double perSecond = calls / clock.Elapsed.TotalSeconds;

        const int daySamples = 17_280;
        var strain = new MonochromaticBinaryStrain(source.FrequencyHz, source.FrequencyDerivativeHzS, source.Amplitude,
            source.InclinationRad, source.PolarisationRad, source.InitialPhaseRad, new SkyPosition(source.EclipticLatitudeRad, source.EclipticLongitudeRad));
        clock.Restart();
        while (clock.Elapsed.TotalSeconds < WarmUpSeconds)
            GC.KeepAlive(SlowReferenceResponse.Compute(strain, generator.Orbits, 0.0, cadence, daySamples / 24));
        clock.Restart();
        var response = SlowReferenceResponse.Compute(strain, generator.Orbits, 0.0, cadence, daySamples);
        double daySeconds = clock.Elapsed.TotalSeconds;
        GC.KeepAlive(response);
        GC.KeepAlive(sink);
        double fullRecordSeconds = daySeconds * generator.SampleCount / daySamples;
        return new GalacticBinaryTemplateMeasurement(generator.EnvelopeLength(source.FrequencyHz, source.FrequencyDerivativeHzS),
            perSecond, daySeconds, fullRecordSeconds * perSecond);
    }
}
