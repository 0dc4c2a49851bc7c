using GlobalFit.Engine.Benchmarking;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>Quick timing of one noise-worker likelihood evaluation (A/E group with foreground plus T) for a year at
/// 5 s over the default fit range 0.1–30 mHz (943 573 bins); the BenchmarkDotNet version, which also times every
/// one-sided bin, is tests/GlobalFit.Benchmarks/Noise/NoiseLikelihoodBenchmarks.cs.</summary>
internal static class NoiseLikelihoodBench
{
    /// <summary>Runs the measurement and returns its figure.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        const int bins = 943_573;
        var random = new Random(1);
        double[] Fill(double low, double high)
        {
            var values = new double[bins];
            for (int i = 0; i < bins; i++) values[i] = low + (high - low) * random.NextDouble();
            return values;
        }
        double[] powerAe = Fill(0, 4), powerT = Fill(0, 2), acceleration = Fill(0.1, 0.5), oms = Fill(0.3, 0.6), foreground = Fill(0, 0.2);
        double sink = 0;
        double seconds = QuickTimer.BestSeconds(() => sink +=
            WhittleLikelihood.LogLikelihood(powerAe, acceleration, oms, foreground, 1.1, 0.9, 1.05, 2.0)
            + WhittleLikelihood.LogLikelihood(powerT, acceleration, oms, 0.95, 1.02, 1.0), 20);
        GC.KeepAlive(sink);
        yield return new BenchFigure("noise_likelihood_year_5s_ms", seconds * 1e3, "one noise-worker ln L evaluation, a year at 5 s over 0.1-30 mHz (A/E with foreground, and T)");
    }
}
