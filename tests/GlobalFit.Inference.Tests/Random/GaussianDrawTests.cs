using GlobalFit.Inference.Random;
using MathNet.Numerics.Distributions;

namespace GlobalFit.Inference.Tests.Random;

public sealed class GaussianDrawTests
{
    [Fact]
    public void Ziggurat_layers_close_at_the_top_and_shrink_monotonically()
    {
        // Marsaglia & Tsang 2000, J. Stat. Softw. 5(8), §3: with the right (r, V) the recurrence ends at the mode, i.e.
        // the top layer x₂₅₅ × (f(0) − f(x₂₅₅)) has area V. The paper prints V to 12 significant digits, so the closure
        // holds only to that precision (measured −9.9e-10 relative); tolerance 1e-8 of V.
        double[] edges = GaussianZiggurat.Edges;
        double top = edges[GaussianZiggurat.LayerCount - 1];
        Assert.Equal(GaussianZiggurat.LayerArea, top * (1.0 - GaussianZiggurat.Density(top)), 1e-8 * GaussianZiggurat.LayerArea);
        for (int i = 0; i < GaussianZiggurat.LayerCount; i++)
        {
            Assert.True(edges[i + 1] < edges[i], $"edge {i + 1} does not shrink");
        }
    }

    [Fact]
    public void Gaussian_draws_follow_the_normal_distribution_function()
    {
        // Kolmogorov–Smirnov against Φ, n = 10^6 at a fixed seed. Asymptotically P(√n D > c) ≈ 2 exp(−2c²) (Kolmogorov
        // 1933; Marsaglia, Tsang & Wang 2003, J. Stat. Softw. 8(18)); c = 2.7 gives a false-failure rate of 9e-7.
        var random = RandomStream.FromSeed(20261202);
        const int n = 1_000_000;
        var draws = new double[n];
        for (int i = 0; i < n; i++)
        {
            draws[i] = random.NextGaussian();
        }

        Array.Sort(draws);
        double distance = 0.0;
        for (int i = 0; i < n; i++)
        {
            double cdf = Normal.CDF(0.0, 1.0, draws[i]);
            distance = Math.Max(distance, Math.Max((i + 1.0) / n - cdf, cdf - (double)i / n));
        }

        Assert.True(Math.Sqrt(n) * distance < 2.7, $"√n D = {Math.Sqrt(n) * distance:F3}");
    }

    [Fact]
    public void Gaussian_tails_beyond_the_ziggurat_base_have_the_normal_frequencies()
    {
        // The tail (|z| > r = 3.654) and the wedges near it are the parts of the ziggurat most easily got wrong, and a KS
        // test barely sees them. Pearson χ² over 24 bins of z with edges at ±0.5 … ±3, ±3.5, ±r, ±4, ±4.5, n = 4·10^6 at
        // a fixed seed (smallest expected count 13.6, beyond ±4.5); the threshold is the χ²₂₃ quantile at 1 − 1e-6, so
        // the false-failure rate is 1e-6.
        double r = GaussianZiggurat.TailStart;
        double[] positive = [0.5, 1.0, 1.5, 2.0, 2.5, 3.0, 3.5, r, 4.0, 4.5];
        double[] edges = [.. positive.Reverse().Select(e => -e), 0.0, .. positive];
        var counts = new long[edges.Length + 1];
        var random = RandomStream.FromSeed(20261203);
        const int n = 4_000_000;
        for (int i = 0; i < n; i++)
        {
            double z = random.NextGaussian();
            int bin = 0;
            while (bin < edges.Length && z >= edges[bin])
            {
                bin++;
            }

            counts[bin]++;
        }

        double chiSquare = 0.0;
        for (int bin = 0; bin < counts.Length; bin++)
        {
            double lower = bin == 0 ? 0.0 : Normal.CDF(0.0, 1.0, edges[bin - 1]);
            double upper = bin == edges.Length ? 1.0 : Normal.CDF(0.0, 1.0, edges[bin]);
            double expected = n * (upper - lower);
            chiSquare += (counts[bin] - expected) * (counts[bin] - expected) / expected;
        }

        double threshold = ChiSquared.InvCDF(counts.Length - 1, 1.0 - 1e-6);
        Assert.True(chiSquare < threshold, $"χ² = {chiSquare:F1} with {counts.Length - 1} degrees of freedom, threshold {threshold:F1}");
        Assert.True(counts[0] > 0 && counts[^1] > 0, "no draws beyond ±4.5");
    }
}
