namespace GlobalFit.Inference.Tempering;

/// <summary>Evidence by thermodynamic integration over the temperature ladder.</summary>
/// <remarks>
/// Lartillot &amp; Philippe (2006), "Computing Bayes factors using thermodynamic integration", Systematic
/// Biology 55(2), 195: ln Z = ∫₀¹ ⟨ln L⟩_β dβ, here by the trapezoid rule over the rungs. If the hottest
/// rung has β &gt; 0 the segment [0, β_min] is covered by holding ⟨ln L⟩ at its β_min value, which is biased
/// unless the likelihood is flat there; put the top rung at T = ∞ for an unbiased quadrature. The
/// discretisation error of the trapezoid rule is reported as half the difference to the coarser rule that
/// uses every other rung (Vousden et al. 2016, §4.2), a rough but honest indicator.
/// </remarks>
public static class ThermodynamicIntegration
{
    /// <summary>Integrates ⟨ln L⟩_β over β.</summary>
    /// <param name="inverseTemperatures">β of each rung, strictly descending from 1.</param>
    /// <param name="meanLogLikelihoods">⟨ln L⟩ at each rung.</param>
    /// <returns>The log evidence and its quadrature-error estimate.</returns>
    public static EvidenceEstimate LogEvidence(ReadOnlySpan<double> inverseTemperatures, ReadOnlySpan<double> meanLogLikelihoods)
    {
        if (inverseTemperatures.Length != meanLogLikelihoods.Length || inverseTemperatures.Length == 0)
        {
            throw new ArgumentException("Need one mean log-likelihood per rung.", nameof(meanLogLikelihoods));
        }

        double fine = Trapezoid(inverseTemperatures, meanLogLikelihoods, 1);
        double coarse = Trapezoid(inverseTemperatures, meanLogLikelihoods, 2);
        return new EvidenceEstimate(fine, 0.5 * Math.Abs(fine - coarse));
    }

    private static double Trapezoid(ReadOnlySpan<double> betas, ReadOnlySpan<double> values, int stride)
    {
        double sum = 0.0;
        int last = 0;
        for (int i = stride; i < betas.Length; i += stride)
        {
            sum += 0.5 * (betas[last] - betas[i]) * (values[last] + values[i]);
            last = i;
        }

        if (last != betas.Length - 1)
        {
            int i = betas.Length - 1;
            sum += 0.5 * (betas[last] - betas[i]) * (values[last] + values[i]);
            last = i;
        }

        // Segment [0, β_min]: constant extrapolation (zero width when the top rung is at β = 0).
        sum += betas[last] * values[last];
        return sum;
    }
}
