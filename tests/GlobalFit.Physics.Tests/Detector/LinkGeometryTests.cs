using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class LinkGeometryTests
{
    private static readonly RigidOrbits CheckOrbits = new();

    [Fact]
    public void Unit_vector_from_spacecraft_1_to_2_matches_the_check_values()
    {
        // Source: derived: the orbits of Cornish & Rubbo 2003 (arXiv:gr-qc/0209011) at t = 0, kappa = lambda0 = 0
        // give the unit vector SC1 -> SC2 = (sqrt 3/4, -1/2, 3/4) exactly. The beam from SC1 to SC2 is link 21
        // (receiver 2, sender 1). 1e-12 absolute.
        var n = LinkGeometry.UnitVector(CheckOrbits, receiver: 2, sender: 1, 0.0);
        Assert.Equal(Math.Sqrt(3.0) / 4.0, n.X, 1e-12);
        Assert.Equal(-0.5, n.Y, 1e-12);
        Assert.Equal(0.75, n.Z, 1e-12);
        Assert.Equal(-n, LinkGeometry.UnitVector(CheckOrbits, receiver: 1, sender: 2, 0.0));
    }

    [Fact]
    public void Midpoint_lies_halfway_between_the_spacecraft()
    {
        // Source: SC1 and SC2 positions at t = 0 (RigidOrbitsTests, derived from Cornish & Rubbo 2003); the midpoint
        // is their mean. 1e-9 relative.
        var mid = LinkGeometry.Midpoint(CheckOrbits, 1, 2, 0.0);
        Assert.Equal(0.5 * (1.4887618286e11 + 1.4995871462e11), mid.X, 1e-9 * 1.5e11);
        Assert.Equal(-6.25e8, mid.Y, 1e-9 * 1.5e11);
        Assert.Equal(0.5 * (-1.25e9 + 6.25e8), mid.Z, 1e-9 * 1.5e11);
    }

    [Fact]
    public void Iterative_light_time_of_rigid_orbits_differs_from_L_over_c_only_by_the_motion_of_the_sender()
    {
        // Source: Cornish & Rubbo 2003 (arXiv:gr-qc/0209011): the rigid model ignores point-ahead and Sagnac
        // corrections of relative order v/c (derived: orbital speed over c = 2 pi au/(sidereal yr c) = 9.935e-5).
        // The solved light time must differ from L/c by less
        // than that fraction, and must not equal it (the sender moves).
        double nominal = 2.5e9 / PhysicalConstants.SpeedOfLightMS;
        double solved = LinkGeometry.SolveLightTimeSeconds(CheckOrbits, 1, 2, 3.0e6);
        double relative = Math.Abs(solved / nominal - 1.0);
        Assert.InRange(relative, 1e-9, 9.935e-5);
    }

    [Fact]
    public void Links_must_join_two_different_valid_spacecraft()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => LinkGeometry.UnitVector(CheckOrbits, 1, 1, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => LinkGeometry.Midpoint(CheckOrbits, 0, 1, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => LinkGeometry.ArmLengthM(CheckOrbits, 1, 4, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => LinkGeometry.SolveLightTimeSeconds(CheckOrbits, 3, 3, 0.0));
    }
}
