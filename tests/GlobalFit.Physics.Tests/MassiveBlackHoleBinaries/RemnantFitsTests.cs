using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class RemnantFitsTests
{
    [Fact]
    public void Final_spin_of_equal_mass_merger_matches_numerical_relativity()
    {
        // Source: Scheel et al. 2009, PRD 79, 024003 (arXiv:0810.1767), abstract: equal-mass non-spinning merger leaves
        // a_f = 0.68646 ± 0.00004. The Husa et al. 2016 fit (arXiv:1508.07250) is not exact: its residuals against
        // numerical relativity are of order 1e-3 (from memory), so we allow 5e-4.
        Assert.Equal(0.68646, RemnantFits.FinalSpin(0.25, 0, 0), 5e-4);
    }

    [Fact]
    public void Final_mass_of_equal_mass_merger_matches_numerical_relativity()
    {
        // Source: Scheel et al. 2009 (arXiv:0810.1767), abstract: M_f/M = 0.95162 ± 0.00002; fit residuals ~1e-3 of the
        // radiated energy, so 2e-4 in M_f.
        Assert.Equal(0.95162, RemnantFits.FinalMass(0.25, 0, 0), 2e-4);
    }

    [Fact]
    public void Radiated_energy_of_equal_mass_aligned_spin_merger_matches_numerical_relativity()
    {
        // Source: Lovelace et al. 2012 (arXiv:1110.2229), abstract: 10.952 % of the mass radiated for equal masses with
        // nearly extremal aligned spins (the spin value 0.97 is from memory). 0.2 percentage points covers the fit error.
        Assert.Equal(0.10952, RemnantFits.RadiatedEnergy(0.25, 0.97, 0.97), 2e-3);
    }

    [Theory]
    [InlineData(0.9)]
    [InlineData(-0.5)]
    [InlineData(0.0)]
    public void Final_spin_tends_to_the_large_body_spin_in_the_test_particle_limit(double spin)
    {
        // Derived: as η → 0 the small body changes nothing, a_f → χ1; the η terms are O(η), here η ≈ 1e-5.
        const double q = 1e5;
        double eta = q / ((1 + q) * (1 + q));
        Assert.Equal(spin, RemnantFits.FinalSpin(eta, spin, 0.3), 1e-4);
        Assert.Equal(0.0, RemnantFits.RadiatedEnergy(eta, spin, 0.3), 1e-5);
    }

    [Theory]
    [InlineData(0.0, 0.0, 0.0)]
    [InlineData(0.3, 0.0, 0.0)]
    [InlineData(0.2, 2.0, 0.0)]
    [InlineData(0.2, 0.0, -1.5)]
    public void Out_of_range_arguments_are_refused(double eta, double spin1, double spin2)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => RemnantFits.FinalSpin(eta, spin1, spin2));
        Assert.Throws<ArgumentOutOfRangeException>(() => RemnantFits.RadiatedEnergy(eta, spin1, spin2));
    }
}
