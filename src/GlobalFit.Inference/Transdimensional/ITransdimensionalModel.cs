using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>
/// A model made of a variable number k of same-kind sources inside one window, each described by the
/// same d parameters. The prior is p(k) Π_j p(θ_j): a count prior times i.i.d. source priors.
/// </summary>
/// <remarks>
/// Sources are stored as a labelled list (k·d values, source-major) and the target is symmetric under
/// relabelling, so the sampler may reorder them. Both priors must be normalised, because the posterior
/// over k depends on their normalisation. Implementations must be deterministic.
/// </remarks>
public interface ITransdimensionalModel
{
    /// <summary>The parameters of one source.</summary>
    ParameterSchema SourceSchema { get; }

    /// <summary>The normalised prior of one source's parameters.</summary>
    IPriorDensity SourcePrior { get; }

    /// <summary>ln p(k), normalised over 0 ≤ k ≤ the sampler's cap; −∞ for excluded counts.</summary>
    /// <param name="count">Number of sources.</param>
    /// <returns>The log count prior.</returns>
    double LogCountPrior(int count);

    /// <summary>ln L of a configuration; −∞ outside the support. Never throws for that.</summary>
    /// <param name="sources">count × d values, source-major.</param>
    /// <param name="count">Number of sources k (may be zero).</param>
    /// <returns>The log likelihood.</returns>
    double LogLikelihood(ReadOnlySpan<double> sources, int count);
}
