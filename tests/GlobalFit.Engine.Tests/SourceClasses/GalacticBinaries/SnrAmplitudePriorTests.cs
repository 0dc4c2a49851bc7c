using GlobalFit.Engine.SourceClasses.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

// The prior p(ρ) = 3ρ/(4ρ*²)(1 + ρ/(4ρ*))^−5 of Littenberg, Cornish et al. 2020 (PRD 101, 123021, arXiv:2004.08464),
// from memory: these tests check the identities that must hold whatever the paper's exact typesetting.
public class SnrAmplitudePriorTests
{
    private static double Integrate(Func<double, double> f, double a, double b, int n)
    {
        // Composite Simpson rule; with n = 200 000 on these smooth integrands the error is far below 1e-9.
        double h = (b - a) / n, sum = f(a) + f(b);
        for (int i = 1; i < n; i++) sum += (i % 2 == 1 ? 4 : 2) * f(a + i * h);
        return sum * h / 3;
    }

    [Fact]
    public void The_density_integrates_to_one_over_its_support()
    {
        var prior = new SnrAmplitudePrior(10, 1000);
        Assert.Equal(1.0, Integrate(r => Math.Exp(prior.LogDensity(r)), 1e-12, 1000, 200_000), 1e-8);
    }

    [Fact]
    public void The_cumulative_distribution_matches_the_integral_of_the_density()
    {
        var prior = new SnrAmplitudePrior(10, 1000);
        foreach (double snr in new[] { 1.0, 10.0, 37.0, 200.0 })
            Assert.Equal(Integrate(r => Math.Exp(prior.LogDensity(r)), 1e-12, snr, 200_000), prior.Cumulative(snr), 1e-8);
    }

    // d/dρ [ρ(1 + ρ/4ρ*)^−5] = 0 at ρ = ρ*: the density peaks at ρ*, and vanishes at ρ = 0 (no pull towards no signal).
    [Fact]
    public void The_density_peaks_at_the_peak_snr_and_vanishes_at_zero()
    {
        var prior = new SnrAmplitudePrior(10, 1000);
        Assert.True(prior.LogDensity(10) > prior.LogDensity(9.99));
        Assert.True(prior.LogDensity(10) > prior.LogDensity(10.01));
        Assert.Equal(double.NegativeInfinity, prior.LogDensity(0));
        Assert.True(prior.LogDensity(1e-6) < prior.LogDensity(1) - 10);
        Assert.Equal(double.NegativeInfinity, prior.LogDensity(1000.5));
    }

    [Fact]
    public void The_quantile_inverts_the_cumulative_distribution()
    {
        var prior = new SnrAmplitudePrior(10, 1000);
        foreach (double u in new[] { 0.001, 0.1, 0.5, 0.9, 0.999 })
            Assert.Equal(u, prior.Cumulative(prior.Quantile(u)), 1e-9);
    }

    [Fact]
    public void A_peak_that_is_not_below_the_maximum_is_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new SnrAmplitudePrior(10, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SnrAmplitudePrior(0, 10));
    }
}
