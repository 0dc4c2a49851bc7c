using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class BinaryMassesTests
{
    [Theory]
    [InlineData(1e6, 1e6)]
    [InlineData(8e5, 2e5)]
    [InlineData(3e4, 3e6)]
    public void Chirp_mass_and_mass_ratio_round_trip_through_component_masses(double m1, double m2)
    {
        var (chirp, q) = BinaryMasses.FromComponents(m1, m2);
        var (heavy, light) = BinaryMasses.ComponentMasses(chirp, q);
        Assert.Equal(Math.Max(m1, m2), heavy, 1e-9 * heavy);
        Assert.Equal(Math.Min(m1, m2), light, 1e-9 * light);
        Assert.Equal(m1 + m2, BinaryMasses.TotalMass(chirp, q), 1e-9 * (m1 + m2));
    }

    [Fact]
    public void Equal_masses_have_chirp_mass_two_to_the_minus_one_fifth_of_one_mass_times_two()
    {
        // Derived: m1 = m2 = m gives 𝓜 = m² ^{3/5} (2m)^{−1/5} = 2^{−1/5} m and η = 1/4.
        var (chirp, q) = BinaryMasses.FromComponents(5e5, 5e5);
        Assert.Equal(Math.Pow(2, -0.2) * 5e5, chirp, 1e-6);
        Assert.Equal(1.0, q);
        Assert.Equal(0.25, BinaryMasses.SymmetricMassRatio(1.0));
    }

    [Fact]
    public void Source_frame_mass_is_the_detector_frame_mass_over_one_plus_z()
    {
        Assert.Equal(4e5, BinaryMasses.SourceFrame(1.2e6, 2.0), 1e-6);
        Assert.Equal(1.2e6, BinaryMasses.DetectorFrame(4e5, 2.0), 1e-6);
    }

    [Fact]
    public void Source_frame_total_mass_uses_the_redshift_of_the_distance()
    {
        // D_L of z = 1 in the cosmology of the 2018 Planck release, so the source-frame mass is half the detector-frame one.
        double distance = GlobalFit.Physics.Cosmology.FlatLambdaCdm.Planck2018.LuminosityDistanceMpc(1.0);
        var p = new MassiveBlackHoleBinaryParameters(4e5, 2, 0, 0, 0, distance, 0, 0, 0, 0, 0);
        Assert.Equal(1.0, p.Redshift(), 1e-9);
        Assert.Equal(p.TotalMassMsun / 2, p.SourceFrameTotalMassMsun(), 1e-6 * p.TotalMassMsun);
    }

    [Fact]
    public void Bad_arguments_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => BinaryMasses.SymmetricMassRatio(0.9));
        Assert.Throws<ArgumentOutOfRangeException>(() => BinaryMasses.TotalMass(-1, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => BinaryMasses.FromComponents(0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => BinaryMasses.SourceFrame(1, -0.5));
    }

    [Fact]
    public void Parameters_validate_their_ranges_by_column_name()
    {
        var good = new MassiveBlackHoleBinaryParameters(4e5, 2, 0.3, -0.2, 1e6, 3e4, 0.2, 1.0, 0.5, 0.3, 0.1);
        good.Validate();
        Assert.Equal(good, MassiveBlackHoleBinaryParameters.FromSpan(good.ToArray()));
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => (good with { MassRatio = 0.5 }).Validate());
        Assert.Equal("mass_ratio", error.ParamName);
        error = Assert.Throws<ArgumentOutOfRangeException>(() => (good with { EclipticLatitudeRad = 2 }).Validate());
        Assert.Equal("beta_rad", error.ParamName);
    }
}
