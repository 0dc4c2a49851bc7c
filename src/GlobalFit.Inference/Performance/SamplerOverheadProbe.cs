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
    /// The two are timed in ten interleaved blocks and the fastest block of each kind is reported.
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
        // Warm up for at least half a second and 20 000 steps so that tiered compilation has promoted the sampler's
        // loop (its promotion allocates, and on a loaded machine half a second may hold too few steps for it) and the
        // adaptation has settled.
        long warmUpStart = Stopwatch.GetTimestamp();
        for (int warmUpSteps = 0; warmUpSteps < 20_000 || Stopwatch.GetElapsedTime(warmUpStart).TotalSeconds < 0.5; warmUpSteps += 1_000)
        {
            sampler.Advance(1_000);
        }

        // Interleaved blocks, keeping the fastest block of each kind: on a shared machine the minimum is the
        // estimate least disturbed by other processes, and interleaving exposes both to the same conditions.
        double[] point = sampler.Position(0).ToArray();
        const int rounds = 10;
        int block = steps / rounds;
        double likelihoodSeconds = double.PositiveInfinity;
        double stepSeconds = double.PositiveInfinity;
        long allocated = 0;
        for (int round = 0; round < rounds; round++)
        {
            likelihoodSeconds = Math.Min(likelihoodSeconds, TimeLikelihood(model, point, block));
            long allocatedBefore = GC.GetAllocatedBytesForCurrentThread();
            long start = Stopwatch.GetTimestamp();
            sampler.Advance(block);
            stepSeconds = Math.Min(stepSeconds, Stopwatch.GetElapsedTime(start).TotalSeconds);
            allocated += GC.GetAllocatedBytesForCurrentThread() - allocatedBefore;
        }

        double likelihoodNanoseconds = likelihoodSeconds * 1e9 / block;
        double stepNanoseconds = stepSeconds * 1e9 / block;
        return new SamplerOverheadReport(
            dimension, block * rounds, likelihoodNanoseconds, stepNanoseconds,
            (stepNanoseconds - likelihoodNanoseconds) / likelihoodNanoseconds, (double)allocated / (block * rounds));
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
                // One refinement pass: the first timings may have run before the JIT promoted the loop to
                // optimised code, which overstates the cost per iteration.
                var scaled = new SpinLikelihoodModel(dimension, Math.Max(1, (int)(iterations * likelihoodMicroseconds / microseconds)));
                TimeLikelihood(scaled, point, 2_000);
                double refined = Math.Min(TimeLikelihood(scaled, point, 200), TimeLikelihood(scaled, point, 200)) * 1e6 / 200;
                return new SpinLikelihoodModel(dimension, Math.Max(1, (int)(scaled.WorkIterations * likelihoodMicroseconds / refined)));
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
