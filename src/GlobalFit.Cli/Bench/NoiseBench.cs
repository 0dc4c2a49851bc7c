using GlobalFit.Engine.Benchmarking;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Cli.Bench;

/// <summary>Quick timing of A/E/T noise synthesis over one Julian year at 5 s (6,311,520 samples per channel,
/// a non-power-of-two length) and over 2^22 samples.</summary>
public static class NoiseBench
{
    /// <summary>Runs the measurements and returns their figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var year = NoiseSynthesisProbe.Measure(6_311_520);
        yield return new BenchFigure("noise_year_aet_5s_seconds", year.Seconds, "A/E/T noise for one Julian year at 5 s cadence (6,311,520 points per channel)");
        var pow2 = NoiseSynthesisProbe.Measure(1 << 22);
        yield return new BenchFigure("noise_aet_points_per_s", pow2.SamplesPerSecond, "A/E/T noise points synthesised per second (2^22 per channel)");
    }
}
