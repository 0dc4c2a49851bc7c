using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>Independence proposal centred on the update's Laplace approximation: a multivariate Student t with
/// <see cref="DegreesOfFreedom"/> degrees of freedom, location μ and scale matrix P⁻¹/β.</summary>
/// <remarks>
/// <para>With millions of bins the posterior of a few noise levels is very narrow (relative widths ~1e-3), so a
/// random walk started at the configured levels would need tens of thousands of steps to cross the ~100σ to the
/// truth; the independence move lands near the mode at once and then gives nearly uncorrelated draws. It is exact
/// Metropolis–Hastings for any fixed q: the ratio is ln q(x) − ln q(x′) (Tierney 1994, Ann. Statist. 22, 1701,
/// §2.3.3).</para>
/// <para>Why a t and not the Gaussian itself: an independence chain sticks wherever π/q is large, and far from the
/// mode the likelihood falls much more slowly than a Gaussian fitted at the mode (it is not quadratic in the levels).
/// With Gaussian tails a chain at the starting levels 100σ out was never able to leave (observed in development);
/// the t's polynomial tails make q there only a few dozen e-folds below its peak, far less than the likelihood
/// gained by jumping to the mode (Robert &amp; Casella, Monte Carlo Statistical Methods, 2nd ed., §7.4: the
/// independence sampler is uniformly ergodic when π/q is bounded).</para>
/// </remarks>
internal sealed class LaplaceIndependenceProposal(LaplaceApproximation approximation, ChainTemperature temperature) : IProposal
{
    /// <summary>Name in the acceptance statistics.</summary>
    public const string Name = "laplace-independence";

    /// <summary>ν: heavy enough tails to escape from far starts, light enough to accept most proposals near the mode.</summary>
    public const int DegreesOfFreedom = 5;

    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        double beta = Math.Max(temperature.InverseTemperature, 1e-6);
        double chiSquared = 0;
        for (int i = 0; i < DegreesOfFreedom; i++)
        {
            double g = random.NextGaussian();
            chiSquared += g * g;
        }
        approximation.DrawOffset(candidate, Math.Sqrt(DegreesOfFreedom / (chiSquared * beta)), ref random);
        for (int i = 0; i < candidate.Length; i++) candidate[i] += approximation.Mean[i];
        return LogDensity(current, beta) - LogDensity(candidate, beta);
    }

    // ln q up to a constant: −(ν + d)/2 ln(1 + β Q(x)/ν).
    private double LogDensity(ReadOnlySpan<double> x, double beta) =>
        -0.5 * (DegreesOfFreedom + approximation.Dimension) * Math.Log(1.0 + beta * approximation.Quadratic(x) / DegreesOfFreedom);
}
