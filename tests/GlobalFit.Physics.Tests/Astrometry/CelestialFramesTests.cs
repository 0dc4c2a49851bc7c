using GlobalFit.Physics.Astrometry;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.Tests.Astrometry;

public class CelestialFramesTests
{
    private static double Deg(double rad) => rad * 180 / Math.PI;

    // The Galactic centre (l = 0, b = 0) is at RA 266.405°, Dec −28.936° (J2000), and the north Galactic pole at
    // RA 192.859°, Dec +27.128° (ESA 1997, Hipparcos Vol. 1 §1.5.3 defining values; from memory). The printed
    // values carry three decimals: 2e-3° tolerance.
    [Fact]
    public void Galactic_centre_and_pole_land_at_their_equatorial_positions()
    {
        var (raCentre, decCentre) = CelestialFrames.Angles(CelestialFrames.GalacticToEquatorial(new Vector3D(1, 0, 0)));
        Assert.Equal(266.405, Deg(raCentre), 2e-3);
        Assert.Equal(-28.936, Deg(decCentre), 2e-3);
        var (raPole, decPole) = CelestialFrames.Angles(CelestialFrames.GalacticToEquatorial(new Vector3D(0, 0, 1)));
        Assert.Equal(192.859, Deg(raPole), 2e-3);
        Assert.Equal(27.128, Deg(decPole), 2e-3);
    }

    // The Galactic centre lies about 5.5° south of the ecliptic at ecliptic longitude ~266.8° (a value from
    // memory, consistent with the equatorial position above rotated by the J2000 obliquity): 0.05° tolerance.
    [Fact]
    public void Galactic_centre_is_a_few_degrees_south_of_the_ecliptic()
    {
        var (lambda, beta) = CelestialFrames.Angles(CelestialFrames.GalacticToEcliptic(new Vector3D(1, 0, 0)));
        Assert.Equal(266.84, Deg(lambda), 0.05);
        Assert.Equal(-5.54, Deg(beta), 0.05);
    }

    [Fact]
    public void Frame_rotations_preserve_lengths_and_angles()
    {
        var a = new Vector3D(0.3, -1.2, 2.0);
        var b = new Vector3D(-0.7, 0.1, 0.4);
        var ra = CelestialFrames.GalacticToEcliptic(a);
        var rb = CelestialFrames.GalacticToEcliptic(b);
        // The matrix rows carry 10 decimals, so orthonormality holds to ~1e-10.
        Assert.Equal(a.Length, ra.Length, 1e-9);
        Assert.Equal(a.Dot(b), ra.Dot(rb), 1e-9);
        Assert.Equal(a.Cross(b).Dot(new Vector3D(1, 2, 3)), ra.Cross(rb).Dot(CelestialFrames.GalacticToEcliptic(new Vector3D(1, 2, 3))), 1e-9); // proper rotation
    }

    // The celestial north pole has ecliptic latitude 90° − ε.
    [Fact]
    public void Equatorial_pole_sits_at_the_obliquity_from_the_ecliptic_pole()
    {
        var (_, beta) = CelestialFrames.Angles(CelestialFrames.EquatorialToEcliptic(new Vector3D(0, 0, 1)));
        Assert.Equal(Math.PI / 2 - CelestialFrames.ObliquityJ2000Rad, beta, 1e-14);
        Assert.Equal(23.4392794, Deg(CelestialFrames.ObliquityJ2000Rad), 1e-7);
    }

    [Fact]
    public void Angles_and_direction_are_inverse()
    {
        var (lon, lat) = CelestialFrames.Angles(CelestialFrames.Direction(4.0, -0.3));
        Assert.Equal(4.0, lon, 1e-14);
        Assert.Equal(-0.3, lat, 1e-14);
        Assert.Throws<ArgumentException>(() => CelestialFrames.Angles(new Vector3D(0, 0, 0)));
    }
}
