using GlobalFit.Physics.Cosmology;

namespace GlobalFit.Physics.Tests.Cosmology;

public sealed class FlatLambdaCdmTests
{
    [Theory]
    [InlineData(0.01)]
    [InlineData(1.0)]
    [InlineData(10.0)]
    [InlineData(500.0)]
    public void Einstein_de_sitter_distance_matches_the_closed_form(double z)
    {
        // Derived: Ω_m = 1 gives D_C = 2 (c/H0)(1 − 1/√(1 + z)) (e.g. Hogg 1999, arXiv:astro-ph/9905116). 1e-10 relative.
        var cosmology = new FlatLambdaCdm(70, 1.0);
        double expected = 2 * cosmology.HubbleDistanceMpc * (1 - 1 / Math.Sqrt(1 + z));
        Assert.Equal(1.0, cosmology.ComovingDistanceMpc(z) / expected, 1e-10);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(20.0)]
    public void Pure_lambda_distance_is_the_hubble_law(double z)
    {
        // Derived: Ω_m = 0 gives E = 1, D_C = c z/H0 and D_L = (1 + z) c z/H0. 1e-12 relative.
        var cosmology = new FlatLambdaCdm(70, 0.0);
        Assert.Equal(1.0, cosmology.LuminosityDistanceMpc(z) / ((1 + z) * z * cosmology.HubbleDistanceMpc), 1e-12);
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(1.0)]
    [InlineData(3.0)]
    [InlineData(15.0)]
    public void Planck_distance_matches_an_independent_trapezoid_sum(double z)
    {
        // Independent quadrature: trapezoid rule in z with 200000 steps (error ~ h² f''/12, below 1e-9 relative here).
        var cosmology = FlatLambdaCdm.Planck2018;
        const int steps = 200_000;
        double h = z / steps, sum = 0;
        for (int i = 0; i <= steps; i++)
        {
            double zi = i * h;
            double value = 1 / Math.Sqrt(0.3153 * Math.Pow(1 + zi, 3) + 0.6847);
            sum += (i == 0 || i == steps ? 0.5 : 1.0) * value;
        }
        double expected = (1 + z) * 299792.458 / 67.36 * h * sum;
        Assert.Equal(1.0, cosmology.LuminosityDistanceMpc(z) / expected, 1e-8);
    }

    [Fact]
    public void Planck_luminosity_distance_at_redshift_one_is_about_6_8_gpc()
    {
        // Common practice figure: D_L(z = 1) ≈ 6.8 Gpc for the 2018 Planck parameters (derived: trapezoid sum as above gives
        // 6805.4 Mpc). 0.5 % covers the spread among the parameter columns of the 2018 Planck release.
        Assert.Equal(6805.4, FlatLambdaCdm.Planck2018.LuminosityDistanceMpc(1.0), 35.0);
    }

    [Theory]
    [InlineData(1e-4)]
    [InlineData(0.3)]
    [InlineData(2.0)]
    [InlineData(30.0)]
    [InlineData(900.0)]
    public void Redshift_inverts_the_luminosity_distance(double z)
    {
        var cosmology = FlatLambdaCdm.Planck2018;
        Assert.Equal(z, cosmology.Redshift(cosmology.LuminosityDistanceMpc(z)), 1e-10 * (1 + z));
    }

    [Fact]
    public void Low_redshift_distance_follows_the_hubble_law_with_deceleration()
    {
        // Derived: D_L ≈ (c z/H0)(1 + (1 − q0) z/2) with q0 = 3Ω_m/2 − 1; the next term is O(z²), ~1e-6 at z = 1e-3.
        var cosmology = FlatLambdaCdm.Planck2018;
        const double z = 1e-3;
        double q0 = 1.5 * 0.3153 - 1;
        double expected = cosmology.HubbleDistanceMpc * z * (1 + (1 - q0) * z / 2);
        Assert.Equal(1.0, cosmology.LuminosityDistanceMpc(z) / expected, 2e-6);
    }

    [Fact]
    public void Bad_arguments_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new FlatLambdaCdm(0, 0.3));
        Assert.Throws<ArgumentOutOfRangeException>(() => new FlatLambdaCdm(70, 1.2));
        Assert.Throws<ArgumentOutOfRangeException>(() => FlatLambdaCdm.Planck2018.LuminosityDistanceMpc(-0.1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FlatLambdaCdm.Planck2018.Redshift(-1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FlatLambdaCdm.Planck2018.Redshift(1e12));
    }
}
