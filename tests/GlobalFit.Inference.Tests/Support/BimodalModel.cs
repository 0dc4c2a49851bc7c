using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>Mixture 0.3·N((−6, −6), 0.5² I) + 0.7·N((6, 6), 0.5² I) under a uniform prior on [−15, 15]²: the
/// modes are 24σ apart (a barrier of ~140 nats), so a local sampler cannot cross without tempering.</summary>
internal sealed class BimodalModel : ITargetModel
{
    public const double LeftWeight = 0.3;
    public const double RightWeight = 0.7;
    private const double Sigma = 0.5;

    public ParameterSchema Schema { get; } = new(
    [
        new ParameterSpec("x", string.Empty, -15.0, 15.0, BoundaryKind.Reject),
        new ParameterSpec("y", string.Empty, -15.0, 15.0, BoundaryKind.Reject),
    ]);

    public double LogPrior(ReadOnlySpan<double> theta) => Schema.Contains(theta) ? -Math.Log(900.0) : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        theta[0] = random.NextUniform(-15.0, 15.0);
        theta[1] = random.NextUniform(-15.0, 15.0);
    }

    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        double left = Math.Log(LeftWeight) + Component(theta, -6.0);
        double right = Math.Log(RightWeight) + Component(theta, 6.0);
        double max = Math.Max(left, right);
        return max + Math.Log(Math.Exp(left - max) + Math.Exp(right - max));
    }

    private static double Component(ReadOnlySpan<double> theta, double centre)
    {
        double dx = theta[0] - centre, dy = theta[1] - centre;
        return -0.5 * (dx * dx + dy * dy) / (Sigma * Sigma) - Math.Log(2 * Math.PI * Sigma * Sigma);
    }
}
