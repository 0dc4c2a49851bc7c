using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Quick timing of the galactic-binary template with its band-limited log-likelihood (one Julian year
/// at 5 s, a 3 mHz source) and its speed-up over the slow reference response.</summary>
internal static class GalacticBinaryBench
{
    /// <summary>Runs the measurement and returns its figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var m = GalacticBinaryTemplateProbe.Measure();
        yield return new BenchFigure("galactic_binary_template_likelihoods_per_s", m.LikelihoodsPerSecond, $"galactic-binary template + band log-likelihood per second, one core (1 yr at 5 s, N = {m.EnvelopeLength})");
        yield return new BenchFigure("galactic_binary_speedup_over_slow_response", m.SpeedupOverBruteForce, "same source: slow time-domain reference response time / fast template time");
    }
}
