using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Random;

namespace GlobalFit.Engine.Tests.Fitting;

public sealed class SourceConvergenceTests
{
    // 2000 independent normals: R-hat within 1.01 of 1 and bulk ESS near 2000 (Vehtari et al. 2021, arXiv:1903.08008: R-hat
    // of well-mixed chains stays below 1.01; fixed seed, the bounds hold with wide margin for this stream).
    [Fact]
    public void Independent_draws_give_r_hat_near_one_and_a_large_ess()
    {
        var random = RandomStream.FromSeed(3);
        var draws = Enumerable.Range(0, 2000).Select(_ => random.NextGaussian()).ToList();
        var (rhat, ess) = SourceConvergence.Of(draws);
        Assert.InRange(rhat, 0.99, 1.01);
        Assert.InRange(ess, 1200, 3000);
    }

    // A chain held in one mode for its first half and another (3 σ away) for its second: the halves disagree and R-hat is
    // far above 1 (derived: between-half variance 2.25 against within 1 gives R-hat ≈ √(1 + 2.25) ≈ 1.8).
    [Fact]
    public void A_chain_that_changes_mode_half_way_has_a_large_r_hat()
    {
        var random = RandomStream.FromSeed(4);
        var draws = Enumerable.Range(0, 1000).Select(i => random.NextGaussian() + (i < 500 ? 0 : 3)).ToList();
        Assert.True(SourceConvergence.Of(draws).SplitRhat > 1.5);
    }

    [Fact]
    public void A_parameter_held_fixed_or_a_short_chain_has_no_r_hat()
    {
        Assert.True(double.IsNaN(SourceConvergence.Of(Enumerable.Repeat(0.0, 100).ToList()).SplitRhat));
        Assert.True(double.IsNaN(SourceConvergence.Of([1.0, 2, 3, 4, 5, 6, 7]).EffectiveSampleSize));
        Assert.Throws<ArgumentNullException>(() => SourceConvergence.Of(null!));
    }
}
