using System.Numerics;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Quick timing of the massive black-hole binary template on its natural grid (every bin of a 30-day record
/// at 10 s that the binary emits into while the data are taken) and of the heterodyned log-likelihood around it.</summary>
internal static class MassiveBlackHoleBinaryBench
{
    /// <summary>Runs the measurement and returns its figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        const double durationS = 30 * 86_400.0, cadenceS = 10;
        int samples = (int)(durationS / cadenceS);
        int binCount = samples / 2 + 1;
        double dfHz = 1 / durationS;
        // An equal-mass-ish 10⁶ M_sun (detector frame total) binary at 10 Gpc merging 5 days before the end.
        var source = new MassiveBlackHoleBinaryParameters(4e5, 2, 0.3, -0.2, durationS - 5 * 86_400.0, 1e4, 0.3, 1.0, 0.8, 0.4, 1.2);
        var window = MassiveBlackHoleBinaryBand.InData(source, dfHz, binCount, 0, durationS);
        var generator = new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), window.Count, 0);
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        var t = new Complex[window.Count];
        const int renders = 10;
        double templateSeconds = QuickTimer.BestSeconds(() =>
        {
            for (int i = 0; i < renders; i++) generator.RenderBins(source, window, dfHz, a, e, t);
        }, 3);
        yield return new BenchFigure("massive_black_hole_binary_templates_per_s", renders / templateSeconds,
            $"massive black-hole binary A/E/T template per second on every bin it fills, one core ({window.Count} bins of a 30-day record at 10 s)");

        var inverse = new double[3][];
        for (int c = 0; c < 3; c++) inverse[c] = [.. Enumerable.Repeat(1e40, window.Count)];
        generator.RenderBins(source, window, dfHz, a, e, t);
        var data = new MassiveBlackHoleBinaryData(window, dfHz, [a, e, t], inverse);
        var heterodyned = new MassiveBlackHoleBinaryHeterodynedLikelihood(generator, data, source);
        var nearby = source with { ChirpMassMsun = source.ChirpMassMsun * (1 + 1e-5), CoalescenceTimeS = source.CoalescenceTimeS + 1 };
        const int evaluations = 2000;
        double sink = 0;
        double likelihoodSeconds = QuickTimer.BestSeconds(() =>
        {
            for (int i = 0; i < evaluations; i++) sink += heterodyned.LogLikelihoodRatio(nearby);
        }, 3);
        GC.KeepAlive(sink);
        yield return new BenchFigure("massive_black_hole_binary_heterodyned_likelihoods_per_s", evaluations / likelihoodSeconds,
            $"heterodyned log-likelihood ratio per second, one core ({heterodyned.BinCount} coarse bins over the same {window.Count} bins)");

        // The fit's default leaves T out (weight zero), which skips its response and sums.
        var aeOnly = new MassiveBlackHoleBinaryData(window, dfHz, [a, e, t], [inverse[0], inverse[1], new double[window.Count]]);
        var heterodynedAe = new MassiveBlackHoleBinaryHeterodynedLikelihood(generator, aeOnly, source);
        double aeSeconds = QuickTimer.BestSeconds(() =>
        {
            for (int i = 0; i < evaluations; i++) sink += heterodynedAe.LogLikelihoodRatio(nearby);
        }, 3);
        GC.KeepAlive(sink);
        yield return new BenchFigure("massive_black_hole_binary_heterodyned_ae_likelihoods_per_s", evaluations / aeSeconds,
            $"heterodyned log-likelihood ratio per second with A and E only (the fit's default), one core ({heterodynedAe.BinCount} coarse bins)");
    }
}
