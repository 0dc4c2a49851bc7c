namespace GlobalFit.Inference.Targets;

/// <summary>A model that can supply its Fisher information matrix at a point.</summary>
/// <remarks>Used by <see cref="Proposals.FisherEigenProposal"/>. A model with a whitened template can
/// implement this with <see cref="FiniteDifferenceFisher"/>.</remarks>
public interface IFisherInformation
{
    /// <summary>Number of parameters d.</summary>
    int Dimension { get; }

    /// <summary>Writes the d×d Fisher matrix F(θ) at <paramref name="theta"/> into <paramref name="matrix"/>, row-major.</summary>
    /// <param name="theta">The point.</param>
    /// <param name="matrix">Destination of length d·d; must come back symmetric.</param>
    void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix);
}
