using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class RigidOrbitsTests
{
    private static readonly RigidOrbits CheckOrbits = new(armLengthM: 2.5e9, orbitRadiusM: PhysicalConstants.AstronomicalUnitM);

    // Source: derived: the orbit formula of Cornish & Rubbo 2003 (arXiv:gr-qc/0209011; formula from memory, its
    // rigid-triangle properties tested below) evaluated independently at t = 0 for L = 2.5e9 m, R = 1 au,
    // kappa = lambda0 = 0, printed to 11 figures, so 1e-9 relative.
    [Theory]
    [InlineData(1, 1.4887618286e11, 0.0, -1.25e9)]
    [InlineData(2, 1.4995871462e11, -1.25e9, 6.25e8)]
    [InlineData(3, 1.4995871462e11, 1.25e9, 6.25e8)]
    public void Positions_at_the_epoch_match_the_check_values(int spacecraft, double x, double y, double z)
    {
        var p = CheckOrbits.Position(spacecraft, 0.0);
        AssertClose(x, p.X, 1e-9 * PhysicalConstants.AstronomicalUnitM);
        AssertClose(y, p.Y, 1e-9 * PhysicalConstants.AstronomicalUnitM);
        AssertClose(z, p.Z, 1e-9 * PhysicalConstants.AstronomicalUnitM);
    }

    [Fact]
    public void Position_of_spacecraft_1_a_quarter_period_later_matches_the_check_values()
    {
        // Source: derived: the same formula evaluated at t = T_orb/4 (x = -L/sqrt 3 exactly); 1e-9 relative
        // per component (x = -L/sqrt 3 exactly; z is ~0, checked to 1e-9 of an au).
        var p = CheckOrbits.Position(1, 0.25 * CheckOrbits.PeriodSeconds);
        Assert.Equal(-1.4433756730e9, p.X, 1e-9 * 1.4433756730e9);
        Assert.Equal(1.4959787070e11, p.Y, 1e-9 * 1.4959787070e11);
        Assert.Equal(0.0, p.Z, 1e-9 * PhysicalConstants.AstronomicalUnitM);
    }

    [Fact]
    public void Eccentricity_matches_the_check_value()
    {
        // Source: Cornish & Rubbo 2003 (arXiv:gr-qc/0209011), e = L/(2 sqrt(3) R); derived: 4.824185218e-3 for
        // L = 2.5e9 m, R = 1 au (10 figures).
        Assert.Equal(4.824185218e-3, CheckOrbits.Eccentricity, 1e-9 * 4.824185218e-3);
    }

    [Fact]
    public void Arm_length_of_rigid_orbits_stays_constant_over_a_year()
    {
        // Source: Cornish & Rubbo 2003 (arXiv:gr-qc/0209011), rigid equilateral triangle (derived: an independent
        // numerical check finds the arms constant to 1e-14). Asserted to 1e-12 relative at 500 times and
        // several orbit phases; coordinates of 1.5e11 m carry ~3e-5 m of rounding, 1e-14 of an arm.
        var orbits = new RigidOrbits(initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);
        double worst = 0;
        for (int n = 0; n <= 500; n++)
        {
            double t = n * orbits.PeriodSeconds / 500.0;
            foreach (var (i, j) in new[] { (1, 2), (2, 3), (3, 1) })
                worst = Math.Max(worst, Math.Abs(LinkGeometry.ArmLengthM(orbits, i, j, t) / 2.5e9 - 1.0));
        }
        Assert.True(worst < 1e-12, $"largest relative arm-length deviation {worst:E2}");
    }

    [Fact]
    public void Constellation_plane_is_tilted_sixty_degrees_to_the_ecliptic_and_its_centroid_stays_one_au_from_the_Sun()
    {
        // Source: Cornish & Rubbo 2003 (arXiv:gr-qc/0209011): constellation plane tilted by 60 deg to the ecliptic
        // (derived: numerical check of the formula). Tolerances: 1e-9 rad and 1e-9 relative, far above rounding.
        var orbits = new RigidOrbits(initialOrbitalPhaseRad: 1.1, initialOrientationRad: -0.4);
        for (int n = 0; n < 24; n++)
        {
            double t = n * orbits.PeriodSeconds / 24.0;
            var (p1, p2, p3) = (orbits.Position(1, t), orbits.Position(2, t), orbits.Position(3, t));
            var normal = (p2 - p1).Cross(p3 - p1).Normalized();
            double tiltDeg = Math.Acos(Math.Abs(normal.Z)) * 180.0 / Math.PI;
            Assert.Equal(60.0, tiltDeg, 1e-7);
            var centroid = (p1 + p2 + p3) / 3.0;
            Assert.Equal(1.0, centroid.Length / PhysicalConstants.AstronomicalUnitM, 1e-9);
        }
    }

    [Fact]
    public void Triangle_turns_once_per_year_in_its_plane_against_the_orbital_sense()
    {
        // Source: Cornish & Rubbo 2003 (arXiv:gr-qc/0209011) "cartwheel" motion; derived from the formula: -30 deg
        // per month.
        // Seen from the frame that co-rotates with the guiding centre (radial, along-track, ecliptic north), the
        // offset of SC1 from the centroid turns about the plane's north-pointing normal by -360 deg/12 each twelfth
        // of a period. Tolerance 1e-7 deg, rounding level for these angles.
        var orbits = new RigidOrbits(initialOrbitalPhaseRad: 0.2, initialOrientationRad: 0.5);
        for (int month = 0; month < 12; month++)
        {
            double t0 = month * orbits.PeriodSeconds / 12.0, t1 = t0 + orbits.PeriodSeconds / 12.0;
            var (before, normalBefore) = CoRotatingOffsetAndNorthNormal(orbits, t0);
            var (after, _) = CoRotatingOffsetAndNorthNormal(orbits, t1);
            double turnDeg = Math.Atan2(normalBefore.Dot(before.Cross(after)), before.Dot(after)) * 180.0 / Math.PI;
            Assert.Equal(-30.0, turnDeg, 1e-7);
        }
    }

    [Fact]
    public void Light_time_is_the_arm_length_over_c()
    {
        // Source: derived: L/c = 2.5e9 m / 299792458 m/s = 8.339102380 s (SI exact c); 10 figures, so 1e-9 relative.
        foreach (var (i, j) in new[] { (1, 2), (2, 1), (2, 3), (3, 2), (3, 1), (1, 3) })
            Assert.Equal(8.339102380, CheckOrbits.LightTimeSeconds(i, j, 1.2345e6), 1e-9 * 8.339102380);
    }

    [Fact]
    public void Bad_parameters_and_spacecraft_labels_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(armLengthM: -1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(armLengthM: double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(orbitRadiusM: 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(armLengthM: 2e10, orbitRadiusM: 1e11));
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(periodSeconds: double.PositiveInfinity));
        Assert.Throws<ArgumentOutOfRangeException>(() => new RigidOrbits(initialOrientationRad: double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => CheckOrbits.Position(0, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => CheckOrbits.Position(4, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => CheckOrbits.LightTimeSeconds(2, 2, 0.0));
    }

    private static (Vector3D Offset, Vector3D NorthNormal) CoRotatingOffsetAndNorthNormal(RigidOrbits orbits, double t)
    {
        var (p1, p2, p3) = (orbits.Position(1, t), orbits.Position(2, t), orbits.Position(3, t));
        var centroid = (p1 + p2 + p3) / 3.0;
        var radial = new Vector3D(centroid.X, centroid.Y, 0.0).Normalized();
        var north = new Vector3D(0, 0, 1);
        var alongTrack = north.Cross(radial);
        Vector3D ToCoRotating(Vector3D v) => new(v.Dot(radial), v.Dot(alongTrack), v.Dot(north));
        var normal = ToCoRotating((p2 - p1).Cross(p3 - p1).Normalized());
        if (normal.Z < 0) normal = -normal;
        return (ToCoRotating(p1 - centroid), normal);
    }

    private static void AssertClose(double expected, double actual, double tolerance) =>
        Assert.True(Math.Abs(expected - actual) <= tolerance, $"expected {expected:R}, got {actual:R} (tolerance {tolerance:E2})");
}
