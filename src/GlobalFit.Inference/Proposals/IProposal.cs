using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Proposals;

/// <summary>A Metropolis–Hastings proposal: fills the caller's candidate buffer from the current point.</summary>
/// <remarks>
/// One instance serves one chain slot (one temperature, one replica), so an instance may keep per-chain
/// adaptation state. The sampler applies the parameter schema's boundary handling to the candidate
/// afterwards (see <see cref="Parameters.ParameterSchema.TryApplyBoundaries"/>). Must not allocate in steady state.
/// </remarks>
public interface IProposal
{
    /// <summary>Writes a candidate x′ given the current point x and returns ln q(x | x′) − ln q(x′ | x).</summary>
    /// <param name="current">The current point x.</param>
    /// <param name="candidate">Destination for x′ (same length as <paramref name="current"/>).</param>
    /// <param name="random">The chain's random stream.</param>
    /// <returns>The log proposal ratio; zero for symmetric proposals.</returns>
    double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random);
}
