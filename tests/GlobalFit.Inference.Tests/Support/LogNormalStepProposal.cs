using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>A class-supplied, asymmetric proposal: x′ = x·exp(s z). q(x′|x) = LogNormal(ln x, s²) has density
/// ∝ 1/x′, so ln q(x|x′) − ln q(x′|x) = ln x′ − ln x (Dutta 2012 style multiplicative walk).</summary>
internal sealed class LogNormalStepProposal(double scale) : IProposal
{
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        candidate[0] = current[0] * Math.Exp(scale * random.NextGaussian());
        return Math.Log(candidate[0]) - Math.Log(current[0]);
    }
}
