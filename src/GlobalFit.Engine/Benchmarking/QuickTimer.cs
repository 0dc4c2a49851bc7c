using System.Diagnostics;

namespace GlobalFit.Engine.Benchmarking;

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
