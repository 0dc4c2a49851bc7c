using MathNet.Numerics.Distributions;

namespace GlobalFit.Inference.Diagnostics;

/// <summary>Rank-normalised split R-hat and bulk/tail effective sample sizes over several chains.</summary>
/// <remarks>
/// Vehtari, Gelman, Simpson, Carpenter &amp; Bürkner (2021), "Rank-normalization, folding, and localization:
/// an improved R̂ for assessing convergence of MCMC", Bayesian Analysis 16(2), 667 (arXiv:1903.08008).
/// Chains are split in halves (the middle draw of an odd chain is dropped); draws are rank-normalised with
/// z = Φ⁻¹((r − 3/8)/(S + 1/4)) using average ranks for ties; R̂ = max(bulk R̂, folded R̂) where folding is
/// |θ − median|; bulk ESS is the ESS of the rank-normalised split chains and tail ESS is the smaller of
/// the ESS of the indicators I(θ ≤ q₀.₀₅) and I(θ ≤ q₀.₉₅). The ESS uses Geyer's initial monotone sequence
/// on the multi-chain autocorrelation ρ̂_t = 1 − (W − γ̄_t)/var⁺ (paper eqs. 10–11), including the
/// reference implementation's extra half-term and the floor τ ≥ 1/log₁₀(S).
/// All methods allocate; they are meant for summaries, not the hot path.
/// </remarks>
public static class ConvergenceDiagnostics
{
    /// <summary>The rank-normalised split R̂ (the larger of bulk and tail R̂).</summary>
    /// <param name="chains">Equal-length chains of draws of one scalar, each with at least 4 draws.</param>
    /// <returns>R̂; values above 1.01 indicate non-convergence.</returns>
    public static double SplitRhat(IReadOnlyList<double[]> chains)
    {
        double[][] split = Split(chains);
        double bulk = BasicRhat(RankNormalise(split));
        double tail = BasicRhat(RankNormalise(Fold(split)));
        return Math.Max(bulk, tail);
    }

    /// <summary>Bulk effective sample size (ESS of the rank-normalised split chains).</summary>
    /// <param name="chains">Equal-length chains of draws, each with at least 4 draws.</param>
    /// <returns>The bulk ESS.</returns>
    public static double BulkEffectiveSampleSize(IReadOnlyList<double[]> chains) =>
        EffectiveSampleSize(RankNormalise(Split(chains)));

    /// <summary>Tail effective sample size: min of the ESS of I(θ ≤ q₀.₀₅) and I(θ ≤ q₀.₉₅) on split chains.</summary>
    /// <param name="chains">Equal-length chains of draws, each with at least 4 draws.</param>
    /// <returns>The tail ESS.</returns>
    public static double TailEffectiveSampleSize(IReadOnlyList<double[]> chains)
    {
        double[][] split = Split(chains);
        double[] pooled = Pool(split);
        double low = Quantile(pooled, 0.05);
        double high = Quantile(pooled, 0.95);
        return Math.Min(EffectiveSampleSize(Indicator(split, low)), EffectiveSampleSize(Indicator(split, high)));
    }

    /// <summary>The ESS of the mean of the raw draws (no splitting or rank normalisation).</summary>
    /// <param name="chains">Equal-length chains, each with at least 2 draws.</param>
    /// <returns>The ESS.</returns>
    public static double EffectiveSampleSize(IReadOnlyList<double[]> chains)
    {
        int m = CheckShape(chains, 2);
        int n = chains[0].Length;
        var autocovariances = new Autocovariance[m];
        double meanVariance = 0.0;
        double meanOfMeans = 0.0;
        for (int c = 0; c < m; c++)
        {
            autocovariances[c] = new Autocovariance(chains[c]);
            meanVariance += autocovariances[c].At(0) * n / (n - 1.0);
            meanOfMeans += autocovariances[c].Mean;
        }

        meanVariance /= m;
        meanOfMeans /= m;
        double variancePlus = meanVariance * (n - 1.0) / n;
        if (m > 1)
        {
            double betweenVariance = 0.0;
            for (int c = 0; c < m; c++)
            {
                double deviation = autocovariances[c].Mean - meanOfMeans;
                betweenVariance += deviation * deviation;
            }

            variancePlus += betweenVariance / (m - 1);
        }

        double[] rho = new double[n + 1];
        double RhoAt(int lag)
        {
            double mean = 0.0;
            for (int c = 0; c < m; c++)
            {
                mean += autocovariances[c].At(lag);
            }

            return 1.0 - (meanVariance - mean / m) / variancePlus;
        }

        int t = 0;
        double even = 1.0;
        double odd = RhoAt(1);
        rho[0] = even;
        rho[1] = odd;
        while (t < n - 5 && !double.IsNaN(even + odd) && even + odd > 0.0)
        {
            t += 2;
            even = RhoAt(t);
            odd = RhoAt(t + 1);
            if (even + odd >= 0.0)
            {
                rho[t] = even;
                rho[t + 1] = odd;
            }
        }

        int maxLag = t;
        if (even > 0.0)
        {
            rho[maxLag] = even;
        }

        // Geyer's initial monotone sequence: pair sums may not increase.
        for (int pair = 2; pair <= maxLag - 2; pair += 2)
        {
            if (rho[pair] + rho[pair + 1] > rho[pair - 2] + rho[pair - 1])
            {
                rho[pair] = 0.5 * (rho[pair - 2] + rho[pair - 1]);
                rho[pair + 1] = rho[pair];
            }
        }

        double total = (double)m * n;
        double sum = 0.0;
        for (int lag = 0; lag < maxLag; lag++)
        {
            sum += rho[lag];
        }

        double tau = -1.0 + 2.0 * sum + rho[maxLag];
        tau = Math.Max(tau, 1.0 / Math.Log10(total));
        return total / tau;
    }

    private static double BasicRhat(double[][] chains)
    {
        int m = chains.Length;
        int n = chains[0].Length;
        double grandMean = 0.0;
        double within = 0.0;
        double[] means = new double[m];
        for (int c = 0; c < m; c++)
        {
            double mean = 0.0;
            foreach (double value in chains[c])
            {
                mean += value;
            }

            mean /= n;
            means[c] = mean;
            grandMean += mean / m;
            double sumOfSquares = 0.0;
            foreach (double value in chains[c])
            {
                sumOfSquares += (value - mean) * (value - mean);
            }

            within += sumOfSquares / (n - 1) / m;
        }

        double betweenOverN = 0.0;
        foreach (double mean in means)
        {
            betweenOverN += (mean - grandMean) * (mean - grandMean) / (m - 1);
        }

        double variancePlus = (n - 1.0) / n * within + betweenOverN;
        return Math.Sqrt(variancePlus / within);
    }

    private static int CheckShape(IReadOnlyList<double[]> chains, int minimumLength)
    {
        ArgumentNullException.ThrowIfNull(chains);
        if (chains.Count == 0)
        {
            throw new ArgumentException("Need at least one chain.", nameof(chains));
        }

        int n = chains[0]?.Length ?? 0;
        foreach (double[] chain in chains)
        {
            if (chain is null || chain.Length != n || n < minimumLength)
            {
                throw new ArgumentException($"Chains must have equal lengths of at least {minimumLength}.", nameof(chains));
            }
        }

        return chains.Count;
    }

    private static double[][] Split(IReadOnlyList<double[]> chains)
    {
        int m = CheckShape(chains, 4);
        int n = chains[0].Length;
        int half = n / 2;
        double[][] split = new double[2 * m][];
        for (int c = 0; c < m; c++)
        {
            split[2 * c] = chains[c].AsSpan(0, half).ToArray();
            split[2 * c + 1] = chains[c].AsSpan(n - half, half).ToArray();
        }

        return split;
    }

    private static double[] Pool(double[][] chains)
    {
        int n = chains[0].Length;
        double[] pooled = new double[chains.Length * n];
        for (int c = 0; c < chains.Length; c++)
        {
            chains[c].CopyTo(pooled, c * n);
        }

        return pooled;
    }

    private static double[][] RankNormalise(double[][] chains)
    {
        int n = chains[0].Length;
        double[] pooled = Pool(chains);
        int total = pooled.Length;
        int[] order = new int[total];
        for (int i = 0; i < total; i++)
        {
            order[i] = i;
        }

        Array.Sort((double[])pooled.Clone(), order);
        double[] ranks = new double[total];
        int start = 0;
        while (start < total)
        {
            int end = start;
            while (end + 1 < total && pooled[order[end + 1]] == pooled[order[start]])
            {
                end++;
            }

            // Ties share the average of their 1-based ranks.
            double averageRank = 0.5 * (start + end) + 1.0;
            for (int i = start; i <= end; i++)
            {
                ranks[order[i]] = averageRank;
            }

            start = end + 1;
        }

        double[][] normalised = new double[chains.Length][];
        for (int c = 0; c < chains.Length; c++)
        {
            normalised[c] = new double[n];
            for (int i = 0; i < n; i++)
            {
                normalised[c][i] = Normal.InvCDF(0.0, 1.0, (ranks[c * n + i] - 0.375) / (total + 0.25));
            }
        }

        return normalised;
    }

    private static double[][] Fold(double[][] chains)
    {
        double median = Quantile(Pool(chains), 0.5);
        double[][] folded = new double[chains.Length][];
        for (int c = 0; c < chains.Length; c++)
        {
            folded[c] = new double[chains[c].Length];
            for (int i = 0; i < chains[c].Length; i++)
            {
                folded[c][i] = Math.Abs(chains[c][i] - median);
            }
        }

        return folded;
    }

    private static double[][] Indicator(double[][] chains, double threshold)
    {
        double[][] indicator = new double[chains.Length][];
        for (int c = 0; c < chains.Length; c++)
        {
            indicator[c] = new double[chains[c].Length];
            for (int i = 0; i < chains[c].Length; i++)
            {
                indicator[c][i] = chains[c][i] <= threshold ? 1.0 : 0.0;
            }
        }

        return indicator;
    }

    /// <summary>Sample quantile with linear interpolation between order statistics (Hyndman &amp; Fan 1996, type 7).</summary>
    private static double Quantile(double[] values, double probability)
    {
        double[] sorted = (double[])values.Clone();
        Array.Sort(sorted);
        double position = probability * (sorted.Length - 1);
        int lower = (int)Math.Floor(position);
        int upper = Math.Min(lower + 1, sorted.Length - 1);
        return sorted[lower] + (position - lower) * (sorted[upper] - sorted[lower]);
    }
}
