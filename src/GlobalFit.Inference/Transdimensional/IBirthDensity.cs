using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>
/// The density from which birth moves draw a new source, and against which death moves score the removed
/// one (e.g. a prior, or an F-statistic map of the residual supplied by a source class).
/// </summary>
/// <remarks>
/// It must be a normalised density over one source's parameters and must not depend on the chain state
/// during a run (it may be replaced between runs, e.g. per Gibbs update); otherwise the reversible-jump
/// acceptance ratio is wrong. Draws outside the source schema's range are rejected by the sampler.
/// </remarks>
public interface IBirthDensity
{
    /// <summary>Draws a new source into <paramref name="source"/> and returns its log density ln b(θ).</summary>
    /// <param name="source">Destination of length d.</param>
    /// <param name="random">The chain's random stream.</param>
    /// <returns>ln b of the drawn point.</returns>
    double Draw(Span<double> source, ref RandomStream random);

    /// <summary>ln b(θ) of a given source; −∞ where the density is zero.</summary>
    /// <param name="source">A source of length d.</param>
    /// <returns>The log density.</returns>
    double LogDensity(ReadOnlySpan<double> source);
}
