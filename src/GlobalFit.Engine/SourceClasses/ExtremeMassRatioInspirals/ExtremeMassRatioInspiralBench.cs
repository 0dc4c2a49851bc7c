using System.Diagnostics;
using System.Numerics;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Quick timing of the fast inspiral template with its log-likelihood (one Julian year at 10 s; M = 1e6,
/// μ = 10, χ = 0.5, e0 = 0.2), its ratio to the direct time-domain path, the semi-coherent statistic's cost per
/// segment and the blind search's per year of data.</summary>
/// <remarks>The likelihood loop runs for one second after half a second of warm-up (so the timed code is the
/// optimised one). The direct path costs several seconds for a year, so it is timed over 30 days and scaled to the year
/// by the sample count (its cost is per sample); the whole suite takes a few seconds.</remarks>
internal static class ExtremeMassRatioInspiralBench
{
    private const double Cadence = 10.0;
    private const double DirectDays = 30;
    private const int SearchSegments = 8;

    private static readonly ExtremeMassRatioInspiralParameters Source =
        new(1e6, 10, 0.5, 1.5e-4, 0.2, 0.9, 0.3, 1.2, 1.0, 2.5, 1000, 0.4, 1.1, 2.0);

    /// <summary>Runs the measurement and returns its figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(PhysicalConstants.JulianYearS, Cadence);
        var window = generator.TemplateBins(Source);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var (dataA, dataE) = (new Complex[window.Count], new Complex[window.Count]);
        generator.AddResponse(Source, window, dataA, dataE, Span<Complex>.Empty);
        var (inverseA, inverseE, psd) = (new double[window.Count], new double[window.Count], new double[window.Count]);
        double df = generator.FrequencyResolutionHz;
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        var likelihood = new ExtremeMassRatioInspiralLikelihood(generator, window, dataA, dataE, inverseA, inverseE);

        double sink = 0;
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed.TotalSeconds < 0.5) sink += likelihood.LogLikelihoodRatio(Source with { Phi0Rad = 0.4 + 1e-3 * clock.Elapsed.TotalSeconds });
        long calls = 0;
        clock.Restart();
        while (clock.Elapsed.TotalSeconds < 1.0)
        {
            sink += likelihood.LogLikelihoodRatio(Source with { Phi0Rad = 0.4 + 1e-6 * calls });
            calls++;
        }
        double perSecond = calls / clock.Elapsed.TotalSeconds;

        // The search's statistic with its first stage's eight segments over the same year and bins.
        var statistic = new SemiCoherentStatistic(generator, window, SearchSegments, dataA, dataE, inverseA, inverseE);
        sink += statistic.Evaluate(Source);
        long evaluations = 0;
        clock.Restart();
        while (clock.Elapsed.TotalSeconds < 1.0)
        {
            sink += statistic.Evaluate(Source with { Phi0Rad = 0.4 + 1e-6 * evaluations });
            evaluations++;
        }
        double segmentMilliseconds = 1e3 * clock.Elapsed.TotalSeconds / (evaluations * SearchSegments);

        // The blind search's default budget over the same year: its evaluations at its first stage's segment count (the
        // later stages use fewer segments, so this is an upper bound).
        var defaults = new InspiralBlindSearchSettings();
        var blind = new SemiCoherentStatistic(generator, window, defaults.Segments, dataA, dataE, inverseA, inverseE);
        sink += blind.Evaluate(Source);
        long blindEvaluations = 0;
        clock.Restart();
        while (clock.Elapsed.TotalSeconds < 1.0)
        {
            sink += blind.Evaluate(Source with { Phi0Rad = 0.4 + 1e-6 * blindEvaluations });
            blindEvaluations++;
        }
        long budget = defaults.Draws + 2L * defaults.Chains * defaults.ChainSteps + defaults.Chains;
        double blindSearchSeconds = clock.Elapsed.TotalSeconds / blindEvaluations * budget;

        int directSamples = (int)(DirectDays * 86_400 / Cadence);
        var direct = new ExtremeMassRatioInspiralDirectWaveform(directSamples, Cadence);
        GC.KeepAlive(new ExtremeMassRatioInspiralDirectWaveform(directSamples / 30, Cadence).Spectra(Source)); // warm-up
        clock.Restart();
        GC.KeepAlive(direct.Spectra(Source));
        double directYearSeconds = clock.Elapsed.TotalSeconds * generator.SampleCount / directSamples;
        GC.KeepAlive(sink);
        yield return new BenchFigure("emri_template_likelihoods_per_s", perSecond,
            $"inspiral fast template + log-likelihood per second, one core (1 yr at 10 s, e0 = 0.2, {window.Count} bins)");
        yield return new BenchFigure("emri_direct_path_s_per_year", directYearSeconds,
            $"direct time-domain path for the same year, seconds (timed over {DirectDays:F0} days, scaled by samples)");
        yield return new BenchFigure("emri_semicoherent_ms_per_segment", segmentMilliseconds,
            $"semi-coherent statistic, milliseconds per segment ({SearchSegments} segments of the same year; one evaluation costs {SearchSegments} of these)");
        yield return new BenchFigure("emri_blind_search_s_per_year", blindSearchSeconds,
            $"blind search with the default budget ({budget} semi-coherent evaluations, {defaults.Segments} then 8 segments) over the same year, seconds, one core");
        yield return new BenchFigure("emri_speedup_over_direct_path", directYearSeconds * perSecond,
            "same source: direct path time / fast template + log-likelihood time");
    }
}
