using GlobalFit.Inference.Random;
using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>
/// A split/merge map for <see cref="LinearBumpsModel"/> whose Jacobian depends on the state, so that a wrong or missing
/// Jacobian biases p(k | y): a → (r a, (1 − r) a) with r ~ U(0, 1), b → (b/2 + w, b/2 − w) with w ~ N(0, s²).
/// </summary>
/// <remarks>
/// |∂(a₁, a₂)/∂(a, r)| = |det[[r, a], [1 − r, −a]]| = |a| and |∂(b₁, b₂)/∂(b, w)| = |det[[½, 1], [½, −1]]| = 1, so
/// |J| = |a|. The inverse is a = a₁ + a₂, r = a₁/a, b = b₁ + b₂, w = (b₁ − b₂)/2; pairs whose a's differ in sign (r
/// outside (0, 1)) are not the image of any split and cannot merge. Both sums are preserved, so the likelihood of the
/// model (which sees only Σa and Σb) does not change and the acceptance tests the prior, g and the Jacobian alone.
/// </remarks>
internal sealed class LinearBumpsSplitMerge(double offsetSigma) : ISourceSplitMerge
{
    public double DrawAuxiliary(ReadOnlySpan<double> source, Span<double> auxiliary, ref RandomStream random)
    {
        auxiliary[0] = random.NextDouble();
        auxiliary[1] = offsetSigma * random.NextGaussian();
        return LogAuxiliaryDensity(source, auxiliary);
    }

    public double LogAuxiliaryDensity(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary)
    {
        if (!(auxiliary[0] > 0.0 && auxiliary[0] < 1.0))
        {
            return double.NegativeInfinity;
        }

        double w = auxiliary[1] / offsetSigma;
        return -0.5 * w * w - 0.5 * Math.Log(2 * Math.PI * offsetSigma * offsetSigma);
    }

    public bool TrySplit(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary, Span<double> first, Span<double> second, out double logJacobian)
    {
        double r = auxiliary[0];
        first[0] = r * source[0];
        second[0] = (1.0 - r) * source[0];
        first[1] = 0.5 * source[1] + auxiliary[1];
        second[1] = 0.5 * source[1] - auxiliary[1];
        logJacobian = Math.Log(Math.Abs(source[0]));
        return source[0] != 0.0;
    }

    public bool TryMerge(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> source, Span<double> auxiliary, out double logJacobian)
    {
        double a = first[0] + second[0];
        logJacobian = Math.Log(Math.Abs(a));
        if (a == 0.0)
        {
            return false;
        }

        double r = first[0] / a;
        source[0] = a;
        source[1] = first[1] + second[1];
        auxiliary[0] = r;
        auxiliary[1] = 0.5 * (first[1] - second[1]);
        return r > 0.0 && r < 1.0;
    }
}
