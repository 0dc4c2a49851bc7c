namespace GlobalFit.Inference.Proposals;

/// <summary>A proposal whose internal state must be checkpointed for a bit-identical resume.</summary>
public interface IStatefulProposal : IProposal
{
    /// <summary>Copies the complete internal state.</summary>
    /// <returns>A snapshot that <see cref="RestoreState"/> accepts on a freshly created instance.</returns>
    ProposalState CaptureState();

    /// <summary>Replaces the internal state with a snapshot from <see cref="CaptureState"/>.</summary>
    /// <param name="state">The snapshot.</param>
    /// <exception cref="ArgumentException">The snapshot does not fit this instance.</exception>
    void RestoreState(ProposalState state);
}
