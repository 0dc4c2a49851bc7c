namespace GlobalFit.Inference.Diagnostics;

/// <summary>Integrated autocorrelation time of a single chain with Sokal's automatic window.</summary>
/// <remarks>
/// Sokal (1997), "Monte Carlo methods in statistical mechanics: foundations and new algorithms", in
/// Functional Integration (proceedings of the 1996 Cargèse school), NATO ASI Series B 361, 131, §3: τ(M) = 1 + 2 Σ_{t=1}^{M} ρ(t),
/// with M the smallest window satisfying M ≥ c τ(M); c = 5 is adequate when the autocorrelation is roughly
/// exponential (also emcee's default). The statistical error of the estimate is about
/// τ √(2(2M + 1)/N). For an AR(1) process with coefficient ρ the exact value is (1 + ρ)/(1 − ρ).
/// </remarks>
public static class IntegratedAutocorrelationTime
{
    /// <summary>Sokal's windowed estimate of τ.</summary>
    /// <param name="chain">The draws, at least 2.</param>
    /// <param name="windowFactor">The constant c in M ≥ c τ(M); default 5.</param>
    /// <returns>τ, or NaN for a constant chain. If no window satisfies the rule within the chain, the
    /// estimate at the largest lag is returned; treat it as a lower bound (the chain is too short).</returns>
    public static double Sokal(ReadOnlySpan<double> chain, double windowFactor = 5.0)
    {
        if (chain.Length < 2)
        {
            throw new ArgumentException("Need at least two draws.", nameof(chain));
        }

        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(windowFactor);
        var autocovariance = new Autocovariance(chain);
        double variance = autocovariance.At(0);
        if (!(variance > 0.0))
        {
            return double.NaN;
        }

        double tau = 1.0;
        for (int window = 1; window < chain.Length; window++)
        {
            tau += 2.0 * autocovariance.At(window) / variance;
            if (window >= windowFactor * tau)
            {
                return tau;
            }
        }

        return tau;
    }
}
