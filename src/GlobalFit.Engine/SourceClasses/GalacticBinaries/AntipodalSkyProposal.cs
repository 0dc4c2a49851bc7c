using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using static GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinarySourceVector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Jumps a galactic binary to a mirror image of its sky position, chosen with probability ½ each: the antipode
/// (sin β, λ) → (−sin β, λ + π) or the reflection in the ecliptic (sin β, λ) → (−sin β, λ); the other parameters are
/// unchanged.</summary>
/// <remarks>Over data much shorter than a year the detector's orbital motion barely separates a direction from its
/// opposite, nor a point from its mirror image in the ecliptic, so the sky posterior is multimodal and a random walk rarely crosses between the modes (Crowder &amp;
/// Cornish 2007, PRD 75, 043008, discuss such sky degeneracies for these sources; the plain reflection here is our
/// choice). Each map is an involution that preserves volume and the choice between them does not depend on the
/// point, so the move is symmetric (log ratio 0); the sampler wraps λ. Stateless.</remarks>
public sealed class AntipodalSkyProposal : IProposal
{
    /// <summary>The mixture entry for this proposal.</summary>
    /// <param name="weight">Selection weight.</param>
    public static ProposalSpec Spec(double weight) => new("antipodal-sky", weight, static _ => new AntipodalSkyProposal());

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        current.CopyTo(candidate);
        candidate[SinLatitude] = -current[SinLatitude];
        candidate[Longitude] = random.NextDouble() < 0.5 ? current[Longitude] + Math.PI : current[Longitude];
        return 0.0;
    }
}
