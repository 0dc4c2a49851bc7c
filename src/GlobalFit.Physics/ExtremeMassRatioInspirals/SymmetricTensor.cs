using System.Numerics;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>A real symmetric 3×3 tensor stored by its six independent components.</summary>
internal readonly record struct SymmetricTensor(double Xx, double Yy, double Zz, double Xy, double Xz, double Yz)
{
    /// <summary><c>a ⊗ b + b ⊗ a</c> halved: the symmetric part of the outer product.</summary>
    public static SymmetricTensor Outer(Vector3D a, Vector3D b) => new(
        a.X * b.X, a.Y * b.Y, a.Z * b.Z,
        0.5 * (a.X * b.Y + a.Y * b.X), 0.5 * (a.X * b.Z + a.Z * b.X), 0.5 * (a.Y * b.Z + a.Z * b.Y));

    public static SymmetricTensor operator +(SymmetricTensor a, SymmetricTensor b) =>
        new(a.Xx + b.Xx, a.Yy + b.Yy, a.Zz + b.Zz, a.Xy + b.Xy, a.Xz + b.Xz, a.Yz + b.Yz);

    public static SymmetricTensor operator -(SymmetricTensor a, SymmetricTensor b) =>
        new(a.Xx - b.Xx, a.Yy - b.Yy, a.Zz - b.Zz, a.Xy - b.Xy, a.Xz - b.Xz, a.Yz - b.Yz);

    public static SymmetricTensor operator *(double s, SymmetricTensor a) =>
        new(s * a.Xx, s * a.Yy, s * a.Zz, s * a.Xy, s * a.Xz, s * a.Yz);

    /// <summary>Full contraction <c>A_ij B_ij</c>.</summary>
    public double Contract(SymmetricTensor b) =>
        Xx * b.Xx + Yy * b.Yy + Zz * b.Zz + 2 * (Xy * b.Xy + Xz * b.Xz + Yz * b.Yz);

    /// <summary>Full contraction with a complex symmetric tensor.</summary>
    public Complex Contract(ComplexSymmetricTensor b) =>
        Xx * b.Xx + Yy * b.Yy + Zz * b.Zz + 2 * (Xy * b.Xy + Xz * b.Xz + Yz * b.Yz);

    /// <summary><c>v·T·v</c>.</summary>
    public double Quadratic(Vector3D v) =>
        Xx * v.X * v.X + Yy * v.Y * v.Y + Zz * v.Z * v.Z + 2 * (Xy * v.X * v.Y + Xz * v.X * v.Z + Yz * v.Y * v.Z);

    /// <summary>Transverse-traceless part with respect to the direction <paramref name="n"/> (unit vector):
    /// <c>P T P − ½ P tr(P T)</c>, <c>P = 1 − n n</c> (Misner, Thorne &amp; Wheeler 1973, Box 35.1; box number from memory).</summary>
    public SymmetricTensor TransverseTraceless(Vector3D n)
    {
        // (P T P)_ij = T_ij − n_i (Tn)_j − (Tn)_i n_j + n_i n_j (nTn); tr(P T) = tr T − nTn.
        var tn = new Vector3D(Xx * n.X + Xy * n.Y + Xz * n.Z, Xy * n.X + Yy * n.Y + Yz * n.Z, Xz * n.X + Yz * n.Y + Zz * n.Z);
        double ntn = n.Dot(tn);
        double trace = Xx + Yy + Zz - ntn;
        var ptp = this - 2.0 * Outer(n, tn) + ntn * Outer(n, n);
        var p = new SymmetricTensor(1 - n.X * n.X, 1 - n.Y * n.Y, 1 - n.Z * n.Z, -n.X * n.Y, -n.X * n.Z, -n.Y * n.Z);
        return ptp - 0.5 * trace * p;
    }
}

/// <summary>A complex symmetric 3×3 tensor stored by its six independent components.</summary>
internal readonly record struct ComplexSymmetricTensor(Complex Xx, Complex Yy, Complex Zz, Complex Xy, Complex Xz, Complex Yz)
{
    /// <summary>Symmetrised outer product of complex vectors given by real and imaginary parts.</summary>
    public static ComplexSymmetricTensor Outer(Vector3D aRe, Vector3D aIm, Vector3D bRe, Vector3D bIm)
    {
        Complex ax = new(aRe.X, aIm.X), ay = new(aRe.Y, aIm.Y), az = new(aRe.Z, aIm.Z);
        Complex bx = new(bRe.X, bIm.X), by = new(bRe.Y, bIm.Y), bz = new(bRe.Z, bIm.Z);
        return new(ax * bx, ay * by, az * bz, 0.5 * (ax * by + ay * bx), 0.5 * (ax * bz + az * bx), 0.5 * (ay * bz + az * by));
    }

    public static ComplexSymmetricTensor operator +(ComplexSymmetricTensor a, ComplexSymmetricTensor b) =>
        new(a.Xx + b.Xx, a.Yy + b.Yy, a.Zz + b.Zz, a.Xy + b.Xy, a.Xz + b.Xz, a.Yz + b.Yz);

    public static ComplexSymmetricTensor operator *(Complex s, ComplexSymmetricTensor a) =>
        new(s * a.Xx, s * a.Yy, s * a.Zz, s * a.Xy, s * a.Xz, s * a.Yz);

    /// <summary>Complex conjugate.</summary>
    public ComplexSymmetricTensor Conjugate() => new(
        Complex.Conjugate(Xx), Complex.Conjugate(Yy), Complex.Conjugate(Zz),
        Complex.Conjugate(Xy), Complex.Conjugate(Xz), Complex.Conjugate(Yz));

    /// <summary>Transverse-traceless part with respect to <paramref name="n"/>, real and imaginary parts separately.</summary>
    public ComplexSymmetricTensor TransverseTraceless(Vector3D n)
    {
        var re = new SymmetricTensor(Xx.Real, Yy.Real, Zz.Real, Xy.Real, Xz.Real, Yz.Real).TransverseTraceless(n);
        var im = new SymmetricTensor(Xx.Imaginary, Yy.Imaginary, Zz.Imaginary, Xy.Imaginary, Xz.Imaginary, Yz.Imaginary).TransverseTraceless(n);
        return new(new(re.Xx, im.Xx), new(re.Yy, im.Yy), new(re.Zz, im.Zz), new(re.Xy, im.Xy), new(re.Xz, im.Xz), new(re.Yz, im.Yz));
    }
}
