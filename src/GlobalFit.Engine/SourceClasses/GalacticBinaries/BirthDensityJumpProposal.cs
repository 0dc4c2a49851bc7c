using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Moves one source to a fresh draw of the birth density (the F-statistic of the window's residual): an
/// independence proposal that lets a source caught in a local mode jump to where the data put the signal.</summary>
/// <remarks>
/// <para>Over a month of data the Doppler shift ties f0 to the sky position, so a loud source fitted with the wrong sky
/// sits a fraction of a bin off in f0, in a local mode that Gaussian and sky-reflection moves rarely leave, and a
/// nearby companion source patches what it misses. The residual a worker samples against keeps the worker's own
/// sources, so its F-statistic peaks where the signal really is, whatever the chain holds; a draw from it proposes the
/// source there, with extrinsic parameters from their exact conditional Gaussian. The companion, no longer needed,
/// then goes by a death or merge.</para>
/// <para>Independence Metropolis–Hastings (Tierney 1994, Ann. Statist. 22, 1701, §2.3.3): q(θ′ | θ) = b(θ′), so the
/// log proposal ratio is ln b(θ) − ln b(θ′). The density must stay fixed while the sampler runs, which
/// <see cref="IBirthDensity"/> already requires. Stateless apart from the density's scratch space; not thread-safe.</para>
/// </remarks>
public sealed class BirthDensityJumpProposal : IProposal
{
    private readonly IBirthDensity _birth;

    /// <summary>Creates the proposal.</summary>
    /// <param name="birth">The birth density of the current update.</param>
    public BirthDensityJumpProposal(IBirthDensity birth)
    {
        _birth = birth ?? throw new ArgumentNullException(nameof(birth));
    }

    /// <summary>The mixture entry for this proposal.</summary>
    /// <param name="weight">Selection weight.</param>
    /// <param name="birth">The birth density of the current update.</param>
    public static ProposalSpec Spec(double weight, IBirthDensity birth) =>
        new("birth-density-jump", weight, _ => new BirthDensityJumpProposal(birth));

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        double logForward = _birth.Draw(candidate, ref random);
        if (!(logForward > double.NegativeInfinity))
        {
            current.CopyTo(candidate);
            return double.NegativeInfinity;
        }
        return _birth.LogDensity(current) - logForward;
    }
}
