namespace GlobalFit.Physics.Series;

/// <summary>The linear map from Michelson X, Y, Z to the noise-orthogonal A, E, T.</summary>
/// <remarks>The coefficient pattern of Prince, Tinto, Larson &amp; Armstrong 2002 (PRD 66, 122002, arXiv:gr-qc/0209039),
/// applied to Michelson X, Y, Z as is common practice (the exact coefficients from memory; which of the two is "A"
/// varies between papers): with equal arms and identical link noises the A, E and T noises are uncorrelated (derived:
/// numerical transfer-matrix check).</remarks>
public static class TdiCombination
{
    private static readonly double InvSqrt2 = 1.0 / Math.Sqrt(2.0);
    private static readonly double InvSqrt6 = 1.0 / Math.Sqrt(6.0);
    private static readonly double InvSqrt3 = 1.0 / Math.Sqrt(3.0);

    /// <summary>A, E, T of one sample (or one complex bin, applied to real and imaginary parts alike).</summary>
    public static (double A, double E, double T) AetFromXyz(double x, double y, double z) =>
        ((z - x) * InvSqrt2, (x - 2.0 * y + z) * InvSqrt6, (x + y + z) * InvSqrt3);
}
