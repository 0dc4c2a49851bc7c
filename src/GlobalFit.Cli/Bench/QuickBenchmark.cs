using System.Diagnostics;

namespace GlobalFit.Cli.Bench;

/// <summary>One named throughput figure of <c>globalfit bench</c>.</summary>
/// <param name="Name">Stable snake_case name with its unit, e.g. <c>inner_product_gb_per_s</c>.</param>
/// <param name="Value">The measured figure.</param>
/// <param name="Description">What was timed.</param>
public sealed record BenchFigure(string Name, double Value, string Description);

/// <summary>Times a piece of work: best of several repetitions after a warm-up, which on a shared, noisy
/// machine tracks the attainable speed better than the mean.</summary>
public static class QuickTimer
{
    /// <summary>Best wall time in seconds of <paramref name="repetitions"/> runs of <paramref name="work"/>, after one warm-up run.</summary>
    public static double BestSeconds(Action work, int repetitions)
    {
        work();
        double best = double.PositiveInfinity;
        for (int i = 0; i < repetitions; i++)
        {
            long start = Stopwatch.GetTimestamp();
            work();
            best = Math.Min(best, Stopwatch.GetElapsedTime(start).TotalSeconds);
        }
        return best;
    }
}
