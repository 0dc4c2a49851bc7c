using GlobalFit.Inference.Diagnostics;
using GlobalFit.Inference.Random;
using MathNet.Numerics.Distributions;

namespace GlobalFit.Inference.Tests.Diagnostics;

public sealed class ConvergenceDiagnosticsTests
{
    /// <summary>Two chains of 60 draws of a deterministic AR(1)-like recursion driven by a sine hash,
    /// with a small offset between chains. Fixed data, so the expected values below are exact up to rounding.</summary>
    private static double[][] FixedChains()
    {
        double[][] chains = new double[2][];
        for (int m = 0; m < 2; m++)
        {
            chains[m] = new double[60];
            double x = 0.0;
            for (int i = 0; i < 60; i++)
            {
                double shock = Math.Sin(12.9898 * (i + 1) + 78.233 * (m + 1)) * 43758.5453;
                shock -= Math.Floor(shock);
                x = 0.5 * x + (shock - 0.5);
                chains[m][i] = x + 0.1 * m;
            }
        }

        return chains;
    }

    [Fact]
    public void Split_Rhat_matches_a_plain_computation_from_the_paper_definitions()
    {
        // Source: Vehtari et al. 2021 (arXiv:1903.08008) §3: split chains, rank-normalise with
        // (r − 3/8)/(S + 1/4) and average ranks, R̂ = √(var⁺/W) with var⁺ = (n−1)/n W + B/n, and the final
        // R̂ = max(bulk, folded). Computed here with counting ranks and explicit sums; 1e-12 relative.
        double[][] chains = FixedChains();
        double[][] split = SplitPlain(chains);
        double bulk = RhatPlain(RankNormalisePlain(split));
        double median = MedianPlain(split);
        double[][] folded = split.Select(c => c.Select(v => Math.Abs(v - median)).ToArray()).ToArray();
        double tail = RhatPlain(RankNormalisePlain(folded));
        double expected = Math.Max(bulk, tail);

        Assert.Equal(expected, ConvergenceDiagnostics.SplitRhat(chains), 12);
    }

    [Fact]
    public void Bulk_ESS_matches_a_plain_computation_from_the_paper_definitions()
    {
        // Source: Vehtari et al. 2021 §3.2, eqs. 10–11 (multi-chain ρ̂_t, Geyer's initial monotone
        // sequence on pair sums P_k = ρ̂_2k + ρ̂_2k+1), plus the reference code's extra term ρ̂_2K at the
        // first non-positive pair K (posterior::ess_rfun). Written pair-wise here; 1e-10 relative.
        double[][] chains = FixedChains();
        double expected = EssPlain(RankNormalisePlain(SplitPlain(chains)));
        double actual = ConvergenceDiagnostics.BulkEffectiveSampleSize(chains);
        Assert.True(Math.Abs(actual - expected) <= 1e-10 * expected, $"ESS {actual} vs {expected}");
    }

    [Fact]
    public void Tail_ESS_matches_a_plain_computation_from_the_paper_definitions()
    {
        // Source: Vehtari et al. 2021 §4.3: tail ESS = min over the 5 % and 95 % quantile indicators of the
        // ESS on split chains; quantiles by linear interpolation (type 7). 1e-10 relative.
        double[][] chains = FixedChains();
        double[][] split = SplitPlain(chains);
        double[] pooled = split.SelectMany(c => c).OrderBy(v => v).ToArray();
        double Quantile(double p)
        {
            double h = p * (pooled.Length - 1);
            int lo = (int)h;
            return pooled[lo] + (h - lo) * (pooled[Math.Min(lo + 1, pooled.Length - 1)] - pooled[lo]);
        }

        double q05 = Quantile(0.05), q95 = Quantile(0.95);
        double expected = Math.Min(
            EssPlain(split.Select(c => c.Select(v => v <= q05 ? 1.0 : 0.0).ToArray()).ToArray()),
            EssPlain(split.Select(c => c.Select(v => v <= q95 ? 1.0 : 0.0).ToArray()).ToArray()));
        double actual = ConvergenceDiagnostics.TailEffectiveSampleSize(chains);
        Assert.True(Math.Abs(actual - expected) <= 1e-10 * expected, $"tail ESS {actual} vs {expected}");
    }

    [Fact]
    public void AR1_process_gives_the_closed_form_autocorrelation_time_and_ESS()
    {
        // Source: for x_t = ρ x_{t−1} + ε_t the autocorrelation is ρ^|t|, so τ = (1 + ρ)/(1 − ρ) = 9 at ρ = 0.8
        // (e.g. Sokal 1997 §3; emcee's test_autocorr). Sokal's error estimate τ √(2(2M+1)/N) with M ≈ 5τ and
        // N = 2·10^5 is 3 %; the ±12 % bound is 4σ: false-failure rate < 1e-4 per assertion. The ESS of the
        // mean is N/τ with a comparable relative error; same bound.
        const double rho = 0.8;
        const int n = 200_000;
        double[] chain = Ar1(rho, n, seed: 2024);
        double exact = (1 + rho) / (1 - rho);

        double tau = IntegratedAutocorrelationTime.Sokal(chain);
        Assert.InRange(tau, exact * 0.88, exact * 1.12);

        double ess = ConvergenceDiagnostics.EffectiveSampleSize([chain]);
        Assert.InRange(ess, n / exact * 0.88, n / exact * 1.12);
    }

    [Fact]
    public void Rhat_is_near_one_for_mixed_chains_and_large_for_separated_chains()
    {
        // Four independent AR(1) chains of 5000 draws (τ = 3): R̂ − 1 has sd of order 1/√(ESS) ≈ 0.003 per chain
        // pair, so the 1.01 threshold recommended by Vehtari et al. is ~3σ away; at this fixed seed it holds.
        // Shifting one chain by 3 marginal sd must push R̂ far above 1.01 (deterministic given the data).
        double[][] chains = [Ar1(0.5, 5000, 1), Ar1(0.5, 5000, 2), Ar1(0.5, 5000, 3), Ar1(0.5, 5000, 4)];
        Assert.InRange(ConvergenceDiagnostics.SplitRhat(chains), 0.99, 1.01);
        double sd = Math.Sqrt(1.0 / (1 - 0.25));
        chains[3] = chains[3].Select(v => v + 3 * sd).ToArray();
        Assert.True(ConvergenceDiagnostics.SplitRhat(chains) > 1.2);
    }

    internal static double[] Ar1(double rho, int n, ulong seed)
    {
        var random = RandomStream.FromSeed(seed);
        double[] chain = new double[n];
        double x = random.NextGaussian() / Math.Sqrt(1 - rho * rho);
        for (int i = 0; i < n; i++)
        {
            x = rho * x + random.NextGaussian();
            chain[i] = x;
        }

        return chain;
    }

    private static double[][] SplitPlain(double[][] chains)
    {
        var split = new List<double[]>();
        foreach (double[] chain in chains)
        {
            int half = chain.Length / 2;
            split.Add(chain.Take(half).ToArray());
            split.Add(chain.Skip(chain.Length - half).ToArray());
        }

        return [.. split];
    }

    private static double[][] RankNormalisePlain(double[][] chains)
    {
        double[] all = chains.SelectMany(c => c).ToArray();
        int s = all.Length;
        return chains.Select(c => c.Select(v =>
        {
            int below = all.Count(w => w < v);
            int equal = all.Count(w => w == v);
            double rank = below + (equal + 1) / 2.0;
            return Normal.InvCDF(0, 1, (rank - 0.375) / (s + 0.25));
        }).ToArray()).ToArray();
    }

    private static double MedianPlain(double[][] chains)
    {
        double[] sorted = chains.SelectMany(c => c).OrderBy(v => v).ToArray();
        double h = 0.5 * (sorted.Length - 1);
        int lo = (int)h;
        return sorted[lo] + (h - lo) * (sorted[lo + 1] - sorted[lo]);
    }

    private static double RhatPlain(double[][] chains)
    {
        int m = chains.Length, n = chains[0].Length;
        double[] means = chains.Select(c => c.Average()).ToArray();
        double grand = means.Average();
        double b = n / (m - 1.0) * means.Sum(x => (x - grand) * (x - grand));
        double w = chains.Select((c, j) => c.Sum(x => (x - means[j]) * (x - means[j])) / (n - 1.0)).Average();
        double varPlus = (n - 1.0) / n * w + b / n;
        return Math.Sqrt(varPlus / w);
    }

    private static double EssPlain(double[][] chains)
    {
        int m = chains.Length, n = chains[0].Length;
        double[] means = chains.Select(c => c.Average()).ToArray();
        double grand = means.Average();
        double b = n / (m - 1.0) * means.Sum(x => (x - grand) * (x - grand));
        double w = chains.Select((c, j) => c.Sum(x => (x - means[j]) * (x - means[j])) / (n - 1.0)).Average();
        double varPlus = (n - 1.0) / n * w + b / n;

        double Rho(int t)
        {
            // ρ̂_t = 1 − (W − mean_m[s_m² ρ̂_{t,m}]) / var⁺ with s_m² ρ̂_{t,m} = (1/n) Σ (x_i − x̄)(x_{i+t} − x̄)·n/(n−1)·(n−1)/n.
            double meanAutocovariance = 0.0;
            for (int j = 0; j < m; j++)
            {
                double sum = 0.0;
                for (int i = 0; i + t < n; i++)
                {
                    sum += (chains[j][i] - means[j]) * (chains[j][i + t] - means[j]);
                }

                meanAutocovariance += sum / n / m;
            }

            return 1.0 - (w - meanAutocovariance) / varPlus;
        }

        // ρ̂_0 is 1 by definition (the formula would give 1 − B/(n var⁺) instead).
        var pairs = new List<double> { 1.0 + Rho(1) };
        int k = 1;
        double extra = 0.0;
        while (true)
        {
            if (2 * k - 2 >= n - 5)
            {
                // Reference code stops at lag n − 5 and keeps only the even term of the last pair.
                pairs.RemoveAt(pairs.Count - 1);
                extra = Math.Max(Rho(2 * k - 2), 0.0);
                break;
            }

            double pair = Rho(2 * k) + Rho(2 * k + 1);
            if (pair <= 0)
            {
                extra = Math.Max(Rho(2 * k), 0.0);
                break;
            }

            pairs.Add(Math.Min(pair, pairs[^1]));
            k++;
        }

        double tau = -1.0 + 2.0 * pairs.Sum() + extra;
        tau = Math.Max(tau, 1.0 / Math.Log10(m * n));
        return m * n / tau;
    }
}
