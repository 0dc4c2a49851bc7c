namespace GlobalFit.Inference.Proposals;

/// <summary>A proposal that learns from the chain it serves.</summary>
public interface IAdaptiveProposal : IProposal
{
    /// <summary>Called once per step of the owning chain with its position after the accept/reject decision.</summary>
    /// <param name="position">The chain's current position.</param>
    void Observe(ReadOnlySpan<double> position);
}
