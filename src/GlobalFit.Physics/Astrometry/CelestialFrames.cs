using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.Astrometry;

/// <summary>Rotations between Galactic, equatorial (ICRS/J2000) and ecliptic (J2000) Cartesian frames, used to
/// place simulated Galactic sources on the ecliptic sky the detector works in.</summary>
/// <remarks>
/// Galactic ↔ equatorial: the rotation that defines Galactic coordinates in the Hipparcos catalogue
/// (ESA 1997, The Hipparcos and Tycho Catalogues, Vol. 1, §1.5.3; matrix values from memory, checked in the tests
/// against the known equatorial positions of the Galactic centre and north Galactic pole and for orthonormality).
/// Equatorial ↔ ecliptic: rotation about the x axis by the mean obliquity of J2000, 84381.406″
/// (IAU 2006 precession, Capitaine et al. 2003, A&amp;A 412, 567; value from memory).
/// </remarks>
public static class CelestialFrames
{
    /// <summary>Mean obliquity of the ecliptic at J2000.</summary>
    /// <value>rad (84381.406 arcsec).</value>
    public const double ObliquityJ2000Rad = 84381.406 / 3600.0 * Math.PI / 180.0;

    // Rows are the Galactic x (towards the centre), y (towards l = 90°) and z (north pole) axes in equatorial coordinates.
    private static readonly double[,] GalacticAxesInEquatorial =
    {
        { -0.0548755604, -0.8734370902, -0.4838350155 },
        { 0.4941094279, -0.4448296300, 0.7469822445 },
        { -0.8676661490, -0.1980763734, 0.4559837762 },
    };

    /// <summary>Equatorial Cartesian components of a Galactic Cartesian vector.</summary>
    public static Vector3D GalacticToEquatorial(Vector3D inGalaxyFrame)
    {
        var m = GalacticAxesInEquatorial;
        return new Vector3D(
            m[0, 0] * inGalaxyFrame.X + m[1, 0] * inGalaxyFrame.Y + m[2, 0] * inGalaxyFrame.Z,
            m[0, 1] * inGalaxyFrame.X + m[1, 1] * inGalaxyFrame.Y + m[2, 1] * inGalaxyFrame.Z,
            m[0, 2] * inGalaxyFrame.X + m[1, 2] * inGalaxyFrame.Y + m[2, 2] * inGalaxyFrame.Z);
    }

    /// <summary>Ecliptic Cartesian components of an equatorial Cartesian vector.</summary>
    public static Vector3D EquatorialToEcliptic(Vector3D equatorial)
    {
        double c = Math.Cos(ObliquityJ2000Rad), s = Math.Sin(ObliquityJ2000Rad);
        return new Vector3D(equatorial.X, c * equatorial.Y + s * equatorial.Z, -s * equatorial.Y + c * equatorial.Z);
    }

    /// <summary>Ecliptic Cartesian components of a Galactic Cartesian vector.</summary>
    public static Vector3D GalacticToEcliptic(Vector3D inGalaxyFrame) => EquatorialToEcliptic(GalacticToEquatorial(inGalaxyFrame));

    /// <summary>Longitude and latitude of a direction: <c>(atan2(y, x) in [0, 2π), asin(z/|v|))</c>.</summary>
    public static (double LongitudeRad, double LatitudeRad) Angles(Vector3D direction)
    {
        double length = direction.Length;
        if (!(length > 0)) throw new ArgumentException("a zero vector has no direction", nameof(direction));
        double longitude = Math.Atan2(direction.Y, direction.X);
        if (longitude < 0) longitude += 2 * Math.PI;
        return (longitude, Math.Asin(Math.Clamp(direction.Z / length, -1.0, 1.0)));
    }

    /// <summary>Unit vector of a direction given by longitude and latitude.</summary>
    public static Vector3D Direction(double longitudeRad, double latitudeRad) =>
        new(Math.Cos(latitudeRad) * Math.Cos(longitudeRad), Math.Cos(latitudeRad) * Math.Sin(longitudeRad), Math.Sin(latitudeRad));
}
