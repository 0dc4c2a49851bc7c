namespace GlobalFit.Physics.Detector;

/// <summary>The transverse frame of a plane wave and its polarisation tensors ε+(ψ), ε×(ψ).</summary>
/// <remarks>
/// The usual transverse-traceless polarisation tensors, in our convention for the triad and the angle ψ (papers
/// differ in signs; derived: (u, v, k) is right-handed and orthonormal, checked in the tests): with the triad
/// <c>u = (sin β cos λ, sin β sin λ, −cos β)</c>, <c>v = (sin λ, −cos λ, 0)</c>, <c>k = −(cos β cos λ, cos β sin λ, sin β)</c>,
/// <c>e+ = uu − vv</c>, <c>e× = uv + vu</c>, <c>ε+(ψ) = cos 2ψ e+ + sin 2ψ e×</c>, <c>ε×(ψ) = −sin 2ψ e+ + cos 2ψ e×</c>.
/// The tensors are never stored: contractions with vectors need only the projections on u and v.
/// Immutable and thread-safe. The default value has zero vectors and gives zero for every contraction.
/// </remarks>
public readonly struct PolarisationBasis
{
    private readonly double _cos2Psi;
    private readonly double _sin2Psi;

    /// <summary>Builds the frame for a source at <paramref name="sky"/> with polarisation angle <paramref name="polarisationRad"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The polarisation angle is not finite.</exception>
    public PolarisationBasis(SkyPosition sky, double polarisationRad)
    {
        if (!double.IsFinite(polarisationRad))
            throw new ArgumentOutOfRangeException(nameof(polarisationRad), polarisationRad, "polarisation angle must be finite");
        double sinBeta = Math.Sin(sky.EclipticLatitudeRad), cosBeta = Math.Cos(sky.EclipticLatitudeRad);
        double sinLambda = Math.Sin(sky.EclipticLongitudeRad), cosLambda = Math.Cos(sky.EclipticLongitudeRad);
        U = new Vector3D(sinBeta * cosLambda, sinBeta * sinLambda, -cosBeta);
        V = new Vector3D(sinLambda, -cosLambda, 0.0);
        K = new Vector3D(-cosBeta * cosLambda, -cosBeta * sinLambda, -sinBeta);
        PolarisationRad = polarisationRad;
        _cos2Psi = Math.Cos(2.0 * polarisationRad);
        _sin2Psi = Math.Sin(2.0 * polarisationRad);
    }

    /// <summary>First transverse unit vector u.</summary>
    public Vector3D U { get; }

    /// <summary>Second transverse unit vector v.</summary>
    public Vector3D V { get; }

    /// <summary>Propagation direction k = u × v.</summary>
    public Vector3D K { get; }

    /// <summary>Polarisation angle ψ.</summary>
    /// <value>rad.</value>
    public double PolarisationRad { get; }

    /// <summary><c>a · ε+(ψ) · b</c>.</summary>
    public double PlusContraction(Vector3D a, Vector3D b)
    {
        var (plus, cross) = UnrotatedContractions(a, b);
        return _cos2Psi * plus + _sin2Psi * cross;
    }

    /// <summary><c>a · ε×(ψ) · b</c>.</summary>
    public double CrossContraction(Vector3D a, Vector3D b)
    {
        var (plus, cross) = UnrotatedContractions(a, b);
        return -_sin2Psi * plus + _cos2Psi * cross;
    }

    /// <summary>Antenna factors of a link along <paramref name="n"/>: <c>(n·ε+·n, n·ε×·n)</c>.</summary>
    public (double Plus, double Cross) LinkPattern(Vector3D n)
    {
        double nu = n.Dot(U), nv = n.Dot(V);
        double plus = nu * nu - nv * nv;
        double cross = 2.0 * nu * nv;
        return (_cos2Psi * plus + _sin2Psi * cross, -_sin2Psi * plus + _cos2Psi * cross);
    }

    private (double Plus, double Cross) UnrotatedContractions(Vector3D a, Vector3D b)
    {
        double au = a.Dot(U), av = a.Dot(V), bu = b.Dot(U), bv = b.Dot(V);
        return (au * bu - av * bv, au * bv + av * bu);
    }
}
