using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The A and E channels of the constellation in the long-wavelength approximation: detector tensors at a
/// time, the barycentric delay of the constellation centre, and the frequency-domain transfer factor of the Michelson
/// combinations.</summary>
/// <remarks>
/// <para>Barack &amp; Cutler 2004 (arXiv:gr-qc/0310125, §IV, after Cutler 1998, Phys. Rev. D 57, 7089, arXiv:gr-qc/9703068; section and journal
/// reference from memory) use two
/// Michelson-like strain channels <c>(√3/2)(F+ A+ + F× A×)</c> of a rigidly rotating triangle. Here the same
/// long-wavelength antenna pattern is computed from the constellation's own spacecraft positions: vertex tensors
/// <c>D_X = ½(n₁₂n₁₂ − n₁₃n₁₃)</c>, D_Y, D_Z by cyclic relabelling, and
/// <c>D_A = (D_Z − D_X)/√2</c>, <c>D_E = (D_X − 2D_Y + D_Z)/√6</c> (the A, E of the project's TDI convention). In this
/// limit <c>D_X + D_Y + D_Z</c> contracts to zero with any transverse-traceless strain, so T receives nothing.</para>
/// <para>The data are first-generation Michelson TDI in fractional frequency. With equal, static arms and the link
/// signal <c>y ≈ ½ n·[h(t − L/c) − h(t)]·n</c>, <c>X = (1 − D²)(r₁₂ − r₁₃)</c> gives, in the Fourier domain,
/// <c>X̃(f) = 4 sin²(x) e^{−2ix} D_X : h̃(f)</c>, <c>x = 2πfL/c</c> (derived; → 4x² D_X:h̃ at low frequency). That factor
/// multiplies every channel. The direction-dependent finite-arm terms are dropped; the tests measure the resulting
/// agreement with the exact link response. Above about c/(2πL) (19 mHz for 2.5 Gm) the approximation fails.</para>
/// <para>Doppler: the wave reaches the constellation centre x_c(t) at barycentric time <c>t + N̂·x_c(t)/c</c>; the
/// source is evaluated there (Barack &amp; Cutler apply the same delay to the orbital phase only).</para>
/// </remarks>
internal readonly struct LongWavelengthResponse
{
    private readonly IConstellationOrbits _orbits;

    public LongWavelengthResponse(IConstellationOrbits orbits)
    {
        _orbits = orbits;
        LightTimeSeconds = orbits.ArmLengthM / PhysicalConstants.SpeedOfLightMS;
    }

    /// <summary>L/c.</summary>
    public double LightTimeSeconds { get; }

    /// <summary>Constellation centre (m) and the A, E detector tensors at <paramref name="timeSeconds"/>.</summary>
    public (Vector3D Centre, SymmetricTensor A, SymmetricTensor E) At(double timeSeconds)
    {
        var x1 = _orbits.Position(1, timeSeconds);
        var x2 = _orbits.Position(2, timeSeconds);
        var x3 = _orbits.Position(3, timeSeconds);
        var n12 = (x2 - x1).Normalized();
        var n23 = (x3 - x2).Normalized();
        var n31 = (x1 - x3).Normalized();
        var nn12 = SymmetricTensor.Outer(n12, n12);
        var nn23 = SymmetricTensor.Outer(n23, n23);
        var nn31 = SymmetricTensor.Outer(n31, n31);
        var dx = 0.5 * (nn12 - nn31);
        var dy = 0.5 * (nn23 - nn12);
        var dz = 0.5 * (nn31 - nn23);
        var a = (1 / Math.Sqrt(2)) * (dz - dx);
        var e = (1 / Math.Sqrt(6)) * (dx - 2.0 * dy + dz);
        return ((1.0 / 3.0) * (x1 + x2 + x3), a, e);
    }

    /// <summary>Barycentric arrival delay <c>N̂·x_c(t)/c</c> of the constellation centre.</summary>
    /// <value>s.</value>
    public double DelaySeconds(Vector3D towardsSource, double timeSeconds)
    {
        var centre = (1.0 / 3.0) * (_orbits.Position(1, timeSeconds) + _orbits.Position(2, timeSeconds) + _orbits.Position(3, timeSeconds));
        return towardsSource.Dot(centre) / PhysicalConstants.SpeedOfLightMS;
    }

    /// <summary><c>4 sin²(x) e^{−2ix}</c>, x = 2πfL/c.</summary>
    public Complex Transfer(double frequencyHz)
    {
        double x = 2 * Math.PI * frequencyHz * LightTimeSeconds;
        double s = Math.Sin(x);
        var (s2, c2) = Math.SinCos(2 * x);
        return 4 * s * s * new Complex(c2, -s2);
    }
}
