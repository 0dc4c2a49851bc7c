using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Quick timing of the galactic-binary template with its band-limited log-likelihood (one Julian year
/// at 5 s, a 3 mHz source), its speed-up over the slow reference response, and the cost and kernel efficiency of a
/// month-long band window's update.</summary>
internal static class GalacticBinaryBench
{
    /// <summary>Runs the measurement and returns its figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var m = GalacticBinaryTemplateProbe.Measure();
        yield return new BenchFigure("galactic_binary_template_likelihoods_per_s", m.LikelihoodsPerSecond, $"galactic-binary template + band log-likelihood per second, one core (1 yr at 5 s, N = {m.EnvelopeLength})");
        yield return new BenchFigure("galactic_binary_speedup_over_slow_response", m.SpeedupOverBruteForce, "same source: slow time-domain reference response time / fast template time");
        // The demo's settings on a month at 5 s: four windows, 40 invented binaries each; the second iteration is the
        // steady state (the first holds each new window's greedy search).
        var month = new GalacticBinaryBandSettings
        {
            MinFrequencyHz = 2.4e-3, MaxFrequencyHz = 3e-3, WindowBins = 256, MarginBins = 64, MaxSourcesPerWindow = 15,
            StepsPerUpdate = 200, TemperatureCount = 4,
        };
        var slice = new GalacticBinaryBandSlice(month, 30, 5.0, 4, 40, 2027);
        slice.Run(1, month.StepsPerUpdate, 1);
        var steady = slice.Run(1, month.StepsPerUpdate, 1);
        yield return new BenchFigure("galactic_binary_month_window_update_core_s", steady.CoreSecondsPerWindowUpdate,
            "one window-update of a month at 5 s (demo settings: 200 steps, 4 temperatures), steady state, core-seconds");
        yield return new BenchFigure("galactic_binary_month_efficiency", steady.Efficiency,
            "template + likelihood kernel time over worker compute, month-long window (demo settings, steady state)");
    }
}
