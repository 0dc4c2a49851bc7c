using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Proposals;

/// <summary>An independence proposal that draws the candidate from the prior.</summary>
/// <remarks>
/// q(x′ | x) = p(x′), so the log ratio is ln p(x) − ln p(x′) and the acceptance probability reduces to the
/// likelihood ratio (Tierney 1994, Ann. Statist. 22, 1701, §2.3.3). Useful mostly in hot chains.
/// </remarks>
public sealed class PriorDrawProposal : IProposal
{
    private readonly IPriorDensity _prior;

    /// <summary>Creates the proposal.</summary>
    /// <param name="prior">The prior to draw from.</param>
    public PriorDrawProposal(IPriorDensity prior)
    {
        _prior = prior ?? throw new ArgumentNullException(nameof(prior));
    }

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        _prior.DrawFromPrior(candidate, ref random);
        return _prior.LogPrior(current) - _prior.LogPrior(candidate);
    }
}
