using System.Numerics;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The four F-statistic amplitudes <c>a_1 … a_4</c> of a galactic binary and their conversion to and from
/// (A, cos ι, ψ, φ0).</summary>
/// <remarks>
/// <para>Jaranowski, Królak &amp; Schutz 1998 (PRD 58, 063001, arXiv:gr-qc/9804014) for the idea; the ordering, signs
/// and inversion are derived here for this project's waveform convention (derived: write the wave of
/// <see cref="GalacticBinaryParameters"/> as a combination of e+ cos φ(t), e× cos φ(t), e+ sin φ(t), e× sin φ(t) and
/// collect the coefficients; papers order and sign them differently):
/// <c>a_1 = A+ cos2ψ cosφ0 − A× sin2ψ sinφ0</c>, <c>a_2 = A+ sin2ψ cosφ0 + A× cos2ψ sinφ0</c>,
/// <c>a_3 = −A+ cos2ψ sinφ0 − A× sin2ψ cosφ0</c>, <c>a_4 = −A+ sin2ψ sinφ0 + A× cos2ψ cosφ0</c>, with
/// <c>A+ = A(1 + cos²ι)</c>, <c>A× = 2A cos ι</c>; complex form <c>P = a_1 − i a_3</c>, <c>Q = a_2 − i a_4</c>.</para>
/// <para>Inversion (derived: <c>P ± iQ = (A+ ± A×) e^{i(φ0 ± 2ψ)}</c>): <c>R± = |P ± iQ|</c>, <c>A = (√R+ + √R−)²/4</c>, <c>cos ι = (√R+ − √R−)/(√R+ + √R−)</c>,
/// <c>φ0 = [arg(P + iQ) + arg(P − iQ)]/2</c>, <c>ψ = [arg(P + iQ) − arg(P − iQ)]/4</c>. (ψ, φ0) and (ψ + π/2, φ0 + π)
/// give the same signal; <see cref="ToExtrinsics"/> returns the copy with ψ in [0, π/2) and φ0 in [0, 2π), which lies
/// in any prior range ψ ∈ [0, π). Every real 4-vector maps to a physical point.</para>
/// </remarks>
/// <param name="A1">a_1.</param>
/// <param name="A2">a_2.</param>
/// <param name="A3">a_3.</param>
/// <param name="A4">a_4.</param>
public readonly record struct FStatisticAmplitudes(double A1, double A2, double A3, double A4)
{
    /// <summary><c>P = a_1 − i a_3</c>, the coefficient of the e+ basis response.</summary>
    public Complex P => new(A1, -A3);

    /// <summary><c>Q = a_2 − i a_4</c>, the coefficient of the e× basis response.</summary>
    public Complex Q => new(A2, -A4);

    /// <summary>Amplitudes from the complex coefficients P and Q.</summary>
    public static FStatisticAmplitudes FromComplex(Complex p, Complex q) => new(p.Real, q.Real, -p.Imaginary, -q.Imaginary);

    /// <summary>Amplitudes from the polarisation amplitudes A+ and A× and the angles ψ, φ0.</summary>
    public static FStatisticAmplitudes FromPolarisationAmplitudes(double plusAmplitude, double crossAmplitude, double polarisationRad, double initialPhaseRad)
    {
        var (sin2Psi, cos2Psi) = Math.SinCos(2.0 * polarisationRad);
        var (sinPhi, cosPhi) = Math.SinCos(initialPhaseRad);
        return new FStatisticAmplitudes(
            plusAmplitude * cos2Psi * cosPhi - crossAmplitude * sin2Psi * sinPhi,
            plusAmplitude * sin2Psi * cosPhi + crossAmplitude * cos2Psi * sinPhi,
            -plusAmplitude * cos2Psi * sinPhi - crossAmplitude * sin2Psi * cosPhi,
            -plusAmplitude * sin2Psi * sinPhi + crossAmplitude * cos2Psi * cosPhi);
    }

    /// <summary>Amplitudes of a source with the given extrinsic parameters.</summary>
    public static FStatisticAmplitudes FromExtrinsics(in GalacticBinaryExtrinsics extrinsics)
    {
        double c = extrinsics.CosInclination;
        return FromPolarisationAmplitudes(extrinsics.Amplitude * (1.0 + c * c), 2.0 * extrinsics.Amplitude * c,
            extrinsics.PolarisationRad, extrinsics.InitialPhaseRad);
    }

    /// <summary>The physical parameters these amplitudes belong to (the inversion in the remarks), with ψ in [0, π/2) and φ0 in [0, 2π).</summary>
    public GalacticBinaryExtrinsics ToExtrinsics()
    {
        Complex i = Complex.ImaginaryOne;
        Complex sum = P + i * Q, difference = P - i * Q;
        double rootPlus = Math.Sqrt(sum.Magnitude), rootMinus = Math.Sqrt(difference.Magnitude);
        double total = rootPlus + rootMinus;
        if (total == 0) return default;
        double amplitude = 0.25 * total * total;
        double cosIota = (rootPlus - rootMinus) / total;
        // Face-on or face-off (R− or R+ = 0): only φ0 ± 2ψ is defined; the zero vector's arg (0) puts it all in φ0.
        double argSum = sum.Phase, argDifference = difference.Phase;
        double phi0 = 0.5 * (argSum + argDifference);
        double psi = 0.25 * (argSum - argDifference);
        // Reduce to ψ ∈ [0, π/2) using the symmetry (ψ + π/2, φ0 + π).
        double turns = Math.Floor(psi / (0.5 * Math.PI));
        psi -= turns * 0.5 * Math.PI;
        phi0 -= turns * Math.PI;
        phi0 -= 2.0 * Math.PI * Math.Floor(phi0 / (2.0 * Math.PI));
        if (psi >= 0.5 * Math.PI) psi = 0.0;
        if (phi0 >= 2.0 * Math.PI) phi0 = 0.0;
        return new GalacticBinaryExtrinsics(amplitude, cosIota, psi, phi0);
    }
}
