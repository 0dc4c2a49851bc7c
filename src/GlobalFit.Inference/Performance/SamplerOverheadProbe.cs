using System.Diagnostics;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Inference.Performance;

/// <summary>
/// A quick, dependency-free measurement of the sampler's per-step overhead relative to a likelihood of a
/// given cost, for <c>globalfit bench</c>. BenchmarkDotNet gives the careful numbers; this gives a figure
/// in about a second.
/// </summary>
public static class SamplerOverheadProbe
{
    /// <summary>
    /// Calibrates a <see cref="SpinLikelihoodModel"/> to about <paramref name="likelihoodMicroseconds"/> per
    /// call, then times <paramref name="steps"/> likelihood calls alone and <paramref name="steps"/> steps of a
    /// single-chain sampler with the default proposal mixture, after a warm-up that lets adaptation settle.
    /// </summary>
    /// <param name="likelihoodMicroseconds">Target likelihood cost in µs, &gt; 0.</param>
    /// <param name="steps">Timed steps, ≥ 100.</param>
    /// <param name="dimension">Parameter dimension, ≥ 1.</param>
    /// <returns>The measured figures.</returns>
    public static SamplerOverheadReport Measure(double likelihoodMicroseconds = 10.0, int steps = 20_000, int dimension = 8)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(likelihoodMicroseconds);
        ArgumentOutOfRangeException.ThrowIfLessThan(steps, 100);
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        SpinLikelihoodModel model = Calibrate(dimension, likelihoodMicroseconds);
        var sampler = new ParallelTemperingSampler<SpinLikelihoodModel>(model, new ParallelTemperingSettings { Seed = 1 });
        sampler.Advance(Math.Max(steps / 4, 2_000));

        double[] point = sampler.Position(0).ToArray();
        double likelihoodSeconds = TimeLikelihood(model, point, steps);

        long allocatedBefore = GC.GetAllocatedBytesForCurrentThread();
        long start = Stopwatch.GetTimestamp();
        sampler.Advance(steps);
        double stepSeconds = Stopwatch.GetElapsedTime(start).TotalSeconds;
        long allocated = GC.GetAllocatedBytesForCurrentThread() - allocatedBefore;

        double likelihoodNanoseconds = likelihoodSeconds * 1e9 / steps;
        double stepNanoseconds = stepSeconds * 1e9 / steps;
        return new SamplerOverheadReport(
            dimension, steps, likelihoodNanoseconds, stepNanoseconds,
            (stepNanoseconds - likelihoodNanoseconds) / likelihoodNanoseconds, (double)allocated / steps);
    }

    private static SpinLikelihoodModel Calibrate(int dimension, double likelihoodMicroseconds)
    {
        double[] point = new double[dimension];
        int iterations = 256;
        while (true)
        {
            var model = new SpinLikelihoodModel(dimension, iterations);
            TimeLikelihood(model, point, 50);
            // The minimum of three timings is the least disturbed by other processes on a shared machine.
            double seconds = Math.Min(TimeLikelihood(model, point, 200), Math.Min(TimeLikelihood(model, point, 200), TimeLikelihood(model, point, 200)));
            double microseconds = seconds * 1e6 / 200;
            if (microseconds >= likelihoodMicroseconds || iterations > int.MaxValue / 4)
            {
                return new SpinLikelihoodModel(dimension, Math.Max(1, (int)(iterations * likelihoodMicroseconds / microseconds)));
            }

            iterations *= 2;
        }
    }

    private static double TimeLikelihood(SpinLikelihoodModel model, double[] point, int calls)
    {
        double sink = 0.0;
        long start = Stopwatch.GetTimestamp();
        for (int i = 0; i < calls; i++)
        {
            sink += model.LogPrior(point) + model.LogLikelihood(point);
        }

        double seconds = Stopwatch.GetElapsedTime(start).TotalSeconds;
        // Keeps the loop observable without affecting the result.
        GC.KeepAlive(sink);
        return seconds;
    }
}
