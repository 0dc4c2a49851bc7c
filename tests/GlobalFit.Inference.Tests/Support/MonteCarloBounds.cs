using GlobalFit.Inference.Diagnostics;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>Monte-Carlo error bounds for sample means based on the effective sample size.</summary>
internal static class MonteCarloBounds
{
    /// <summary>Mean over all chains of the draws.</summary>
    public static double Mean(double[][] chains)
    {
        double sum = 0.0;
        long count = 0;
        foreach (double[] chain in chains)
        {
            foreach (double value in chain)
            {
                sum += value;
                count++;
            }
        }

        return sum / count;
    }

    /// <summary>Population variance over all chains.</summary>
    public static double Variance(double[][] chains)
    {
        double mean = Mean(chains);
        double sum = 0.0;
        long count = 0;
        foreach (double[] chain in chains)
        {
            foreach (double value in chain)
            {
                sum += (value - mean) * (value - mean);
                count++;
            }
        }

        return sum / count;
    }

    /// <summary>Standard error of the mean of the draws: sd / √ESS (Geyer 1992 via the multi-chain ESS).</summary>
    public static double StandardError(double[][] chains) =>
        Math.Sqrt(Variance(chains) / ConvergenceDiagnostics.EffectiveSampleSize(chains));

    /// <summary>Asserts |mean − expected| ≤ sigmas × standard error and returns the mean.</summary>
    public static double AssertMeanWithin(double[][] chains, double expected, double sigmas, string what)
    {
        double mean = Mean(chains);
        double error = StandardError(chains);
        Xunit.Assert.True(
            Math.Abs(mean - expected) <= sigmas * error,
            $"{what}: mean {mean:G6} vs expected {expected:G6}, allowed ±{sigmas * error:G3} ({sigmas}σ, σ = {error:G3}).");
        return mean;
    }
}
