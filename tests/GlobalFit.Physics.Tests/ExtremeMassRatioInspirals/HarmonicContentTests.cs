using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public class HarmonicContentTests
{
    [Theory]
    // Source: Abramowitz & Stegun 1964, Table 9.1 (J0, J1, J2 at x = 1, 2, 5, 10; values from memory, 10 decimals
    // printed, so 1e-9) and Table 9.2 (J5(5), J10(10)).
    [InlineData(0, 1.0, 0.7651976866)]
    [InlineData(1, 1.0, 0.4400505857)]
    [InlineData(2, 1.0, 0.1149034849)]
    [InlineData(0, 2.0, 0.2238907791)]
    [InlineData(1, 2.0, 0.5767248078)]
    [InlineData(2, 2.0, 0.3528340286)]
    [InlineData(0, 5.0, -0.1775967713)]
    [InlineData(1, 5.0, -0.3275791376)]
    [InlineData(2, 5.0, 0.0465651163)]
    [InlineData(0, 10.0, -0.2459357645)]
    [InlineData(1, 10.0, 0.0434727462)]
    [InlineData(5, 5.0, 0.2611405461)]
    [InlineData(10, 10.0, 0.2074861066)]
    public void Bessel_functions_match_abramowitz_and_stegun(int n, double x, double expected)
    {
        Assert.Equal(expected, IntegerBessel.J(n, x), 1e-9);
    }

    [Fact]
    public void Bessel_series_agrees_with_mathnet_over_the_orbit_harmonic_range()
    {
        // Independent implementation (Amos routines in MathNet.Numerics 5.0); orders and arguments x = n e used by
        // orbits with e ≤ 0.8. The series loses at most ~6 digits to cancellation: 1e-10 absolute.
        for (int n = -2; n <= 60; n++)
            foreach (double e in new[] { 0.01, 0.1, 0.4, 0.8 })
            {
                double x = Math.Abs(n + 2) * e + 0.3;
                Assert.Equal(MathNet.Numerics.SpecialFunctions.BesselJ(n, x), IntegerBessel.J(n, x), 1e-10);
            }
        Assert.Equal(-IntegerBessel.J(3, 1.7), IntegerBessel.J(-3, 1.7), 1e-15);
        Assert.Equal(1.0, IntegerBessel.J(0, 0.0));
        Assert.Equal(0.0, IntegerBessel.J(4, 0.0));
    }

    [Theory]
    // Source: Peters & Mathews 1963, Eq. 17 and 20 evaluated for these values (derived: the formulas as printed in
    // the class remarks, 6 decimals kept, so 1e-6).
    [InlineData(1, 0.1, 0.001495)]
    [InlineData(2, 0.1, 0.950909)]
    [InlineData(3, 0.3, 0.655287)]
    [InlineData(4, 0.5, 0.978690)]
    [InlineData(6, 0.6, 1.371733)]
    [InlineData(9, 0.7, 2.207523)]
    [InlineData(10, 0.8, 2.728383)]
    [InlineData(2, 0.9, 0.051762)]
    public void Harmonic_power_matches_tabulated_values(int n, double e, double expected)
    {
        Assert.Equal(expected, PetersMathewsHarmonics.Power(n, e), 1e-6);
    }

    [Theory]
    [InlineData(0.1, 1.067348)]
    [InlineData(0.3, 1.776243)]
    [InlineData(0.5, 4.884312)]
    [InlineData(0.7, 27.265989)]
    [InlineData(0.9, 1243.113479)]
    public void Enhancement_function_matches_tabulated_values(double e, double expected)
    {
        // Peters & Mathews 1963, Eq. 17 (derived values, 6 decimals).
        Assert.Equal(expected, PetersMathewsHarmonics.Enhancement(e), Math.Max(1e-6, expected * 1e-9));
    }

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.2)]
    [InlineData(0.4)]
    [InlineData(0.6)]
    [InlineData(0.8)]
    public void Power_summed_over_harmonics_equals_the_peters_mathews_total(double e)
    {
        // Energy bookkeeping: Σ_n g(n, e) = f(e) (Peters & Mathews 1963). Truncated at n = 2000, where the tail
        // is far below 1e-9 of the total for e ≤ 0.8.
        double sum = 0;
        for (int n = 1; n <= 2000; n++) sum += PetersMathewsHarmonics.Power(n, e);
        Assert.Equal(PetersMathewsHarmonics.Enhancement(e), sum, PetersMathewsHarmonics.Enhancement(e) * 1e-9);
    }

    [Fact]
    public void Circular_orbit_radiates_only_the_second_harmonic()
    {
        Assert.Equal(1.0, PetersMathewsHarmonics.Power(2, 0.0), 1e-15);
        Assert.Equal(0.0, PetersMathewsHarmonics.Power(1, 0.0), 1e-15);
        Assert.Equal(0.0, PetersMathewsHarmonics.Power(3, 0.0), 1e-15);
    }

    [Theory]
    // Derived: smallest N whose harmonics carry 99.9 % of Σ g(n, e) (running sum of Eq. 20).
    [InlineData(0.0, 2)]
    [InlineData(0.1, 4)]
    [InlineData(0.3, 8)]
    [InlineData(0.4, 11)]
    [InlineData(0.5, 15)]
    [InlineData(0.7, 37)]
    public void Harmonic_count_keeps_the_requested_power(double e, int expected)
    {
        Assert.Equal(expected, PetersMathewsHarmonics.HarmonicCount(e));
    }

    [Fact]
    public void Bad_arguments_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => PetersMathewsHarmonics.Enhancement(1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => PetersMathewsHarmonics.Power(0, 0.1));
        Assert.Throws<ArgumentOutOfRangeException>(() => PetersMathewsHarmonics.HarmonicCount(0.99));
        Assert.Throws<ArgumentOutOfRangeException>(() => PetersMathewsHarmonics.HarmonicCount(0.3, 0));
    }
}
