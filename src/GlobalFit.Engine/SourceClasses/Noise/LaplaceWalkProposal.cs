using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>Gaussian random walk shaped by the update's Laplace covariance: x′ = x + (2.38/√d) N(0, P⁻¹/β).</summary>
/// <remarks>Symmetric, so the log ratio is 0. It explores where the posterior departs from the Gaussian
/// approximation (e.g. a poorly constrained level pressed against its prior bound), where the independence move
/// is rarely accepted. Scale: the optimal random-walk factor 2.38/√d (Gelman, Roberts &amp; Gilks 1996).</remarks>
internal sealed class LaplaceWalkProposal(LaplaceApproximation approximation, ChainTemperature temperature) : IProposal
{
    public const string Name = "laplace-walk";

    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        double beta = Math.Max(temperature.InverseTemperature, 1e-6);
        approximation.DrawOffset(candidate, 2.38 / Math.Sqrt(approximation.Dimension * beta), ref random);
        for (int i = 0; i < candidate.Length; i++) candidate[i] += current[i];
        return 0.0;
    }
}
