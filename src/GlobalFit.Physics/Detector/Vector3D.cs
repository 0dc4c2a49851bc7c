namespace GlobalFit.Physics.Detector;

/// <summary>A Cartesian 3-vector in the heliocentric ecliptic frame (positions in metres, directions unitless).</summary>
/// <remarks>Our own small value type rather than <c>System.Numerics.Vector3</c>, which holds single precision:
/// spacecraft positions of 1.5e11 m need double precision to resolve arm lengths to the metre.
/// The default value is the zero vector.</remarks>
/// <param name="X">First component (towards the vernal equinox).</param>
/// <param name="Y">Second component (in the ecliptic, 90° east of X).</param>
/// <param name="Z">Third component (ecliptic north).</param>
public readonly record struct Vector3D(double X, double Y, double Z)
{
    /// <summary>Euclidean length.</summary>
    public double Length => Math.Sqrt(X * X + Y * Y + Z * Z);

    /// <summary>Scalar product.</summary>
    public double Dot(Vector3D other) => X * other.X + Y * other.Y + Z * other.Z;

    /// <summary>Vector product <c>this × other</c>.</summary>
    public Vector3D Cross(Vector3D other) =>
        new(Y * other.Z - Z * other.Y, Z * other.X - X * other.Z, X * other.Y - Y * other.X);

    /// <summary>This vector divided by its length.</summary>
    /// <exception cref="InvalidOperationException">The vector is zero, so it has no direction.</exception>
    public Vector3D Normalized()
    {
        double length = Length;
        if (!(length > 0))
            throw new InvalidOperationException("the zero vector has no direction");
        return this / length;
    }

    /// <summary>Component-wise sum.</summary>
    public static Vector3D operator +(Vector3D a, Vector3D b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);

    /// <summary>Component-wise difference.</summary>
    public static Vector3D operator -(Vector3D a, Vector3D b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);

    /// <summary>Negation.</summary>
    public static Vector3D operator -(Vector3D a) => new(-a.X, -a.Y, -a.Z);

    /// <summary>Scaling by a number.</summary>
    public static Vector3D operator *(double s, Vector3D a) => new(s * a.X, s * a.Y, s * a.Z);

    /// <summary>Division by a number.</summary>
    public static Vector3D operator /(Vector3D a, double s) => new(a.X / s, a.Y / s, a.Z / s);
}
