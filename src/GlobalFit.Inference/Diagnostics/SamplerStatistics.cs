using System.Collections.Immutable;

namespace GlobalFit.Inference.Diagnostics;

/// <summary>A snapshot of a sampler's acceptance and swap statistics.</summary>
/// <param name="Step">Steps taken so far.</param>
/// <param name="InverseTemperatures">Current β per rung.</param>
/// <param name="Proposals">Acceptance per proposal and rung.</param>
/// <param name="SwapAcceptanceRates">Accepted/attempted swaps between rungs i and i+1 (NaN before the first attempt).</param>
/// <param name="MeanLogLikelihoods">⟨ln L⟩ per rung since the last evidence reset (NaN if no steps).</param>
public sealed record SamplerStatistics(
    long Step,
    ImmutableArray<double> InverseTemperatures,
    ImmutableArray<ProposalAcceptance> Proposals,
    ImmutableArray<double> SwapAcceptanceRates,
    ImmutableArray<double> MeanLogLikelihoods)
{
    /// <summary>Accepted over proposed moves of every proposal on the cold rung (index 0); 0 before any was proposed.</summary>
    public double ColdAcceptanceRate
    {
        get
        {
            long proposed = 0, accepted = 0;
            foreach (var proposal in Proposals)
            {
                if (proposal.TemperatureIndex != 0) continue;
                proposed += proposal.Proposed;
                accepted += proposal.Accepted;
            }
            return proposed == 0 ? 0.0 : (double)accepted / proposed;
        }
    }
}
