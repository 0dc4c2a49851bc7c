using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>Uniform prior on [0, 100], likelihood e^(−x): the posterior is Exp(1) truncated at 100
/// (mean 1, variance 1 up to e^(−100)).</summary>
internal sealed class ExponentialModel : ITargetModel
{
    public ParameterSchema Schema { get; } = new([new ParameterSpec("x", string.Empty, 0.0, 100.0, BoundaryKind.Reject)]);

    public double LogPrior(ReadOnlySpan<double> theta) => Schema.Contains(theta) ? -Math.Log(100.0) : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random) => theta[0] = random.NextUniform(0.0, 100.0);

    public double LogLikelihood(ReadOnlySpan<double> theta) => -theta[0];
}
