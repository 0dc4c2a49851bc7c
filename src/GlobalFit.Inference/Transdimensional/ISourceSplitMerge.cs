using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>
/// The dimension-matching map of split and merge moves: a bijection between one source θ together with d auxiliary
/// variables u and an ordered pair of sources (θ₁, θ₂), supplied by a source class that knows which pairs of its sources
/// are easily confused with one.
/// </summary>
/// <remarks>
/// <para>Green (1995), Biometrika 82(4), 711, §3.3: a jump k → k+1 that draws u ~ g(· | θ) and maps (θ, u) to
/// (θ₁, θ₂) through a diffeomorphism S, reversed by the deterministic inverse M = S⁻¹, is accepted with the target
/// ratio times g(u | θ)⁻¹ times the Jacobian |∂(θ₁, θ₂)/∂(θ, u)|. Both directions must therefore use the same
/// Jacobian, evaluated at (θ, u), and the same density g.</para>
/// <para>Contract: <see cref="TryMerge"/> is the exact inverse of <see cref="TrySplit"/> on the image of the split, and
/// returns false for every ordered pair outside that image (e.g. pairs too far apart); periodic parameters are wrapped
/// by the map itself, never reflected by the sampler, because reflection would break the bijection. A sub-normalised
/// g (draws the split refuses count as rejected moves) is allowed. Implementations must be deterministic, stateless
/// during a run and allocation-free.</para>
/// </remarks>
public interface ISourceSplitMerge
{
    /// <summary>Draws the d auxiliary variables of a split of <paramref name="source"/> and returns ln g(u | θ).</summary>
    /// <param name="source">The source to split, length d.</param>
    /// <param name="auxiliary">Destination of length d.</param>
    /// <param name="random">The chain's random stream.</param>
    /// <returns>ln g of the drawn variables; −∞ if the draw is refused.</returns>
    double DrawAuxiliary(ReadOnlySpan<double> source, Span<double> auxiliary, ref RandomStream random);

    /// <summary>ln g(u | θ) of given auxiliary variables; −∞ where the density is zero.</summary>
    /// <param name="source">The merged source θ, length d.</param>
    /// <param name="auxiliary">The auxiliary variables u, length d.</param>
    /// <returns>The log density.</returns>
    double LogAuxiliaryDensity(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary);

    /// <summary>Maps (θ, u) to the pair (θ₁, θ₂).</summary>
    /// <param name="source">θ, length d.</param>
    /// <param name="auxiliary">u, length d.</param>
    /// <param name="first">Destination θ₁, length d.</param>
    /// <param name="second">Destination θ₂, length d.</param>
    /// <param name="logJacobian">ln |∂(θ₁, θ₂)/∂(θ, u)| at (θ, u).</param>
    /// <returns>False if (θ, u) lies outside the map's domain.</returns>
    bool TrySplit(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary, Span<double> first, Span<double> second, out double logJacobian);

    /// <summary>Maps the ordered pair (θ₁, θ₂) back to (θ, u).</summary>
    /// <param name="first">θ₁, length d.</param>
    /// <param name="second">θ₂, length d.</param>
    /// <param name="source">Destination θ, length d.</param>
    /// <param name="auxiliary">Destination u, length d.</param>
    /// <param name="logJacobian">ln |∂(θ₁, θ₂)/∂(θ, u)| of the split at the returned (θ, u).</param>
    /// <returns>False if the pair is not the image of any split.</returns>
    bool TryMerge(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> source, Span<double> auxiliary, out double logJacobian);
}
