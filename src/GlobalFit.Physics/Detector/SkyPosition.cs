namespace GlobalFit.Physics.Detector;

/// <summary>Direction of a source on the sky in ecliptic coordinates.</summary>
/// <remarks>The default value is the point β = 0, λ = 0. Unit vectors follow
/// <see cref="PolarisationBasis"/>: the propagation direction of a source at (β, λ) is
/// <c>k = −(cos β cos λ, cos β sin λ, sin β)</c>.</remarks>
public readonly record struct SkyPosition
{
    /// <summary>Creates a sky position.</summary>
    /// <param name="eclipticLatitudeRad">β, in [−π/2, π/2].</param>
    /// <param name="eclipticLongitudeRad">λ, any finite value.</param>
    /// <exception cref="ArgumentOutOfRangeException">β lies outside [−π/2, π/2] or λ is not finite.</exception>
    public SkyPosition(double eclipticLatitudeRad, double eclipticLongitudeRad)
    {
        if (!(Math.Abs(eclipticLatitudeRad) <= 0.5 * Math.PI))
            throw new ArgumentOutOfRangeException(nameof(eclipticLatitudeRad), eclipticLatitudeRad, "ecliptic latitude must lie in [-pi/2, pi/2]");
        if (!double.IsFinite(eclipticLongitudeRad))
            throw new ArgumentOutOfRangeException(nameof(eclipticLongitudeRad), eclipticLongitudeRad, "ecliptic longitude must be finite");
        EclipticLatitudeRad = eclipticLatitudeRad;
        EclipticLongitudeRad = eclipticLongitudeRad;
    }

    /// <summary>Ecliptic latitude β.</summary>
    /// <value>rad.</value>
    public double EclipticLatitudeRad { get; }

    /// <summary>Ecliptic longitude λ.</summary>
    /// <value>rad.</value>
    public double EclipticLongitudeRad { get; }

    /// <summary>Unit vector from the Sun towards the source, <c>(cos β cos λ, cos β sin λ, sin β)</c>.</summary>
    public Vector3D TowardsSource
    {
        get
        {
            double cosBeta = Math.Cos(EclipticLatitudeRad);
            return new Vector3D(cosBeta * Math.Cos(EclipticLongitudeRad), cosBeta * Math.Sin(EclipticLongitudeRad), Math.Sin(EclipticLatitudeRad));
        }
    }

    /// <summary>Propagation direction of the wave, <c>k = −TowardsSource</c>.</summary>
    public Vector3D PropagationDirection => -TowardsSource;
}
