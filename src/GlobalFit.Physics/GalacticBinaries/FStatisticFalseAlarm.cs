namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>False-alarm probabilities of the F-statistic in Gaussian noise.</summary>
/// <remarks>Jaranowski, Królak &amp; Schutz 1998 (arXiv:gr-qc/9804014); shared/reference/detector-noise-gb.md §G.4 (DER):
/// with noise only 2F is χ² with 4 degrees of freedom, so for one template <c>P(F &gt; F0) = (1 + F0) e^{−F0}</c>. For a
/// search over many templates the sheet advises thresholds from noise-only runs of the actual search.</remarks>
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
