namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The prior on a galactic binary's signal-to-noise ratio that does not favour vanishing signals:
/// <c>p(ρ) = 3ρ/(4ρ*²) (1 + ρ/(4ρ*))^−5</c> on ρ ≥ 0, truncated at ρ_max.</summary>
/// <remarks>
/// <para>Littenberg, Cornish, Lackeos &amp; Robson 2020, "Global analysis of the gravitational wave signal from
/// galactic binaries", PRD 101, 123021, arXiv:2004.08464, the SNR-based amplitude prior (form from memory; the
/// factor 3 that normalises it is derived here: integral of the density over ρ ≥ 0). It vanishes linearly at ρ = 0, so a sampler gains
/// nothing by shrinking a source to nothing, peaks at ρ = ρ* and falls as ρ^−4, so loud sources are not penalised
/// much. With u = ρ/(4ρ*) and s = 1 + u the cumulative distribution is <c>C(ρ) = 1 − 4s^−3 + 3s^−4</c>, which the
/// tests check against numerical integration; the truncated density is p(ρ)/C(ρ_max).</para>
/// <para>Immutable and thread-safe.</para>
/// </remarks>
public sealed class SnrAmplitudePrior
{
    private readonly double _logNormaliser;

    /// <summary>Creates the prior.</summary>
    /// <param name="peakSnr">ρ*, where the density peaks.</param>
    /// <param name="maxSnr">ρ_max &gt; ρ*, the truncation.</param>
    /// <exception cref="ArgumentOutOfRangeException">ρ* is not positive and finite, or ρ_max does not exceed it.</exception>
    public SnrAmplitudePrior(double peakSnr, double maxSnr)
    {
        if (!(peakSnr > 0) || !double.IsFinite(peakSnr))
            throw new ArgumentOutOfRangeException(nameof(peakSnr), peakSnr, "peak SNR must be positive and finite");
        if (!(maxSnr > peakSnr) || !double.IsFinite(maxSnr))
            throw new ArgumentOutOfRangeException(nameof(maxSnr), maxSnr, "maximum SNR must be finite and exceed the peak");
        PeakSnr = peakSnr;
        MaxSnr = maxSnr;
        _logNormaliser = Math.Log(3.0 / (4.0 * peakSnr * peakSnr)) - Math.Log(UntruncatedCumulative(maxSnr));
    }

    /// <summary>ρ*.</summary>
    public double PeakSnr { get; }

    /// <summary>ρ_max.</summary>
    public double MaxSnr { get; }

    /// <summary>ln p(ρ) of the truncated prior; −∞ outside (0, ρ_max].</summary>
    /// <param name="snr">ρ.</param>
    public double LogDensity(double snr)
    {
        if (!(snr > 0 && snr <= MaxSnr)) return double.NegativeInfinity;
        return _logNormaliser + Math.Log(snr) - 5.0 * Math.Log(1.0 + snr / (4.0 * PeakSnr));
    }

    /// <summary>The cumulative distribution of the truncated prior at <paramref name="snr"/>.</summary>
    /// <param name="snr">ρ.</param>
    public double Cumulative(double snr) =>
        snr <= 0 ? 0.0 : snr >= MaxSnr ? 1.0 : UntruncatedCumulative(snr) / UntruncatedCumulative(MaxSnr);

    /// <summary>The ρ at which the truncated cumulative distribution equals <paramref name="uniform"/> (inverse transform).</summary>
    /// <param name="uniform">A variate in [0, 1).</param>
    public double Quantile(double uniform)
    {
        double target = Math.Clamp(uniform, 0.0, 1.0) * UntruncatedCumulative(MaxSnr);
        // C is monotone in ρ, so bisection always converges (Newton can overshoot on the flat tail); 1e-12 relative suffices.
        double lower = 0.0, upper = MaxSnr;
        for (int i = 0; i < 200 && upper - lower > 1e-12 * upper; i++)
        {
            double middle = 0.5 * (lower + upper);
            if (UntruncatedCumulative(middle) < target) lower = middle;
            else upper = middle;
        }
        return 0.5 * (lower + upper);
    }

    private double UntruncatedCumulative(double snr)
    {
        double s = 1.0 + snr / (4.0 * PeakSnr);
        double inverse = 1.0 / s, inverseCubed = inverse * inverse * inverse;
        return 1.0 - 4.0 * inverseCubed + 3.0 * inverseCubed * inverse;
    }
}
