namespace GlobalFit.Inference.Diagnostics;

/// <summary>Acceptance counts of one proposal on one ladder rung, summed over that rung's replicas.</summary>
/// <param name="Name">Proposal name (or <c>"birth"</c>, <c>"death"</c>, <c>"split"</c>, <c>"merge"</c> for reversible-jump moves).</param>
/// <param name="TemperatureIndex">Ladder rung, 0 = cold.</param>
/// <param name="Proposed">Number of proposals made.</param>
/// <param name="Accepted">Number accepted.</param>
public readonly record struct ProposalAcceptance(string Name, int TemperatureIndex, long Proposed, long Accepted)
{
    /// <summary>Accepted / Proposed, or NaN before the first proposal.</summary>
    public double Rate => Proposed == 0 ? double.NaN : (double)Accepted / Proposed;
}
