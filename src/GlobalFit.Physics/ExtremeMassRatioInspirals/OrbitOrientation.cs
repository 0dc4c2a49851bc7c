using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The precessing orbital plane of the analytic kludge: the orbital angular momentum direction L̂ turning
/// about the spin Ŝ at the fixed angle λ, and the in-plane frame in which the pericentre angle γ̃ is measured.</summary>
/// <remarks>
/// <para>Barack &amp; Cutler 2004 (arXiv:gr-qc/0310125), §II (form from memory, unverified):
/// <c>L̂ = Ŝ cos λ + sin λ (cos α ê₁ + sin α ê₂)</c> with <c>ê₁ = (ẑ − Ŝ cos θ_K)/sin θ_K</c>,
/// <c>ê₂ = (Ŝ × ẑ)/sin θ_K</c>, (ê₁, ê₂, Ŝ) right-handed, so increasing α is prograde (Lense–Thirring) precession.
/// γ̃ is measured in the orbital plane from the node direction <c>L̂ × Ŝ / |L̂ × Ŝ| = sin α ê₁ − cos α ê₂</c>, in the sense
/// of the orbital motion (right-handed about L̂); the second in-plane axis is <c>L̂ × node</c>. Writing the node
/// direction through α rather than by normalising L̂ × Ŝ keeps the frame defined when λ = 0.</para>
/// <para>A spin along the ecliptic pole (sin θ_K = 0) has no ê₁: ê₁ is then taken along x̂ (a relabelling of α).</para>
/// </remarks>
internal readonly struct OrbitOrientation
{
    private readonly Vector3D _e1, _e2;

    public OrbitOrientation(Vector3D spin, double cosLambda)
    {
        Spin = spin;
        CosLambda = cosLambda;
        SinLambda = Math.Sqrt(Math.Max(0, 1 - cosLambda * cosLambda));
        var z = new Vector3D(0, 0, 1);
        double cosTheta = spin.Z;
        double sinTheta = Math.Sqrt(Math.Max(0, 1 - cosTheta * cosTheta));
        if (sinTheta < 1e-12)
        {
            _e1 = new Vector3D(1, 0, 0);
            _e2 = spin.Cross(_e1);
        }
        else
        {
            _e1 = (z - cosTheta * spin) / sinTheta;
            _e2 = spin.Cross(z) / sinTheta;
        }
    }

    public Vector3D Spin { get; }

    public double CosLambda { get; }

    public double SinLambda { get; }

    /// <summary>L̂ at precession phase α.</summary>
    public Vector3D AngularMomentum(double alpha)
    {
        var (s, c) = Math.SinCos(alpha);
        return CosLambda * Spin + SinLambda * (c * _e1 + s * _e2);
    }

    /// <summary>Node direction (γ̃ = 0) and the in-plane axis 90° ahead of it, at precession phase α.</summary>
    public (Vector3D Node, Vector3D Ahead) PlaneAxes(double alpha)
    {
        var (s, c) = Math.SinCos(alpha);
        var node = s * _e1 - c * _e2;
        var l = CosLambda * Spin + SinLambda * (c * _e1 + s * _e2);
        return (node, l.Cross(node));
    }
}
