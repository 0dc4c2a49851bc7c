using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>
/// Rosenbrock "banana": −ln p(x, y) = (a − x)² + b (y − x²)² with a = 1, b = 1/2, under a uniform box prior
/// far wider than the posterior.
/// </summary>
/// <remarks>
/// Closed-form moments: x ~ N(a, 1/2) and y | x ~ N(x², 1/(2b)), so E[x] = 1, Var[x] = 1/2,
/// E[y] = a² + 1/2 = 3/2, Var[y] = 1/(2b) + Var(x²) = 1 + (4a²σ² + 2σ⁴) = 1 + 2 + 1/2 = 7/2 with σ² = 1/2,
/// Cov[x, y] = Cov(x, x²) = 2aσ² = 1 (Gaussian moment identities).
/// </remarks>
internal sealed class BananaModel : ITargetModel
{
    public const double A = 1.0;
    public const double B = 0.5;

    public ParameterSchema Schema { get; } = new(
    [
        new ParameterSpec("x", string.Empty, -10.0, 12.0, BoundaryKind.Reject),
        new ParameterSpec("y", string.Empty, -20.0, 150.0, BoundaryKind.Reject),
    ]);

    public double LogPrior(ReadOnlySpan<double> theta) => Schema.Contains(theta) ? -Math.Log(22.0 * 170.0) : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        theta[0] = random.NextUniform(-10.0, 12.0);
        theta[1] = random.NextUniform(-20.0, 150.0);
    }

    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        double x = theta[0], y = theta[1];
        return -((A - x) * (A - x) + B * (y - x * x) * (y - x * x));
    }
}
