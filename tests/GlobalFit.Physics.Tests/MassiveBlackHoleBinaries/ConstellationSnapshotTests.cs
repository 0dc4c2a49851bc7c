using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class ConstellationSnapshotTests
{
    [Theory]
    [InlineData(0.0)]
    [InlineData(1.234e6)]
    [InlineData(2.9e7)]
    public void Shared_phase_positions_equal_those_of_the_rigid_orbits(double time)
    {
        // Same formula, rearranged: agreement to rounding of 1.5e11 m coordinates (1e-4 m).
        var orbits = new RigidOrbits(initialOrbitalPhaseRad: 0.7, initialOrientationRad: 2.2);
        new ConstellationSnapshot(orbits).Positions(time, out var x1, out var x2, out var x3);
        Assert.True((x1 - orbits.Position(1, time)).Length < 1e-4);
        Assert.True((x2 - orbits.Position(2, time)).Length < 1e-4);
        Assert.True((x3 - orbits.Position(3, time)).Length < 1e-4);
    }

    [Fact]
    public void Other_orbits_are_asked_directly()
    {
        var orbits = new EccentricOrbits();
        new ConstellationSnapshot(orbits).Positions(5e6, out var x1, out _, out var x3);
        Assert.Equal(orbits.Position(1, 5e6), x1);
        Assert.Equal(orbits.Position(3, 5e6), x3);
    }
}
