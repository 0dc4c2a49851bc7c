using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public sealed class BirthDensityJumpProposalTests
{
    // A one-dimensional exponential density b(x) = e^{−x} on x ≥ 0, drawn by inversion.
    private sealed class ExponentialBirth : IBirthDensity
    {
        public double Draw(Span<double> source, ref RandomStream random)
        {
            source[0] = -Math.Log(random.NextDoubleNonZero());
            return LogDensity(source);
        }

        public double LogDensity(ReadOnlySpan<double> source) => source[0] >= 0 ? -source[0] : double.NegativeInfinity;
    }

    // Independence Metropolis–Hastings (Tierney 1994, Ann. Statist. 22, 1701): the log ratio must be ln b(x) − ln b(x′).
    // Exact up to the rounding of one logarithm; tolerance 1e-12.
    [Fact]
    public void The_proposal_ratio_is_the_birth_density_at_the_current_point_over_that_at_the_candidate()
    {
        var proposal = new BirthDensityJumpProposal(new ExponentialBirth());
        var random = RandomStream.FromSeed(5);
        double[] current = [0.7];
        var candidate = new double[1];
        for (int i = 0; i < 100; i++)
        {
            double logRatio = proposal.Propose(current, candidate, ref random);
            Assert.Equal(-current[0] + candidate[0], logRatio, 1e-12);
        }
    }
}
