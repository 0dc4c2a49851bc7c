using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>A flat target on [0, 1]² whose first parameter is periodic and second reflecting: the posterior is
/// uniform (mean 1/2, variance 1/12 per component) only if wrap and reflection keep the walk symmetric.</summary>
internal sealed class PeriodicUniformModel : ITargetModel
{
    public ParameterSchema Schema { get; } = new(
    [
        new ParameterSpec("phase", "cycles", 0.0, 1.0, BoundaryKind.Periodic),
        new ParameterSpec("fraction", string.Empty, 0.0, 1.0, BoundaryKind.Reflect),
    ]);

    public double LogPrior(ReadOnlySpan<double> theta) => Schema.Contains(theta) ? 0.0 : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        theta[0] = random.NextDouble();
        theta[1] = random.NextDouble();
    }

    public double LogLikelihood(ReadOnlySpan<double> theta) => 0.0;
}
