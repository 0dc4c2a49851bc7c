using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>Unscaled in-place complex DFT of any length: <see cref="FftPlan"/> for powers of two,
/// <see cref="BluesteinPlan"/> otherwise.</summary>
public static class ComplexDft
{
    /// <summary><c>X_k = Σ_n x_n e^{−2πikn/N}</c> in place.</summary>
    public static void Forward(Span<Complex> data)
    {
        if (BitOperations.IsPow2(data.Length)) FftPlan.ForLength(data.Length).Forward(data);
        else BluesteinPlan.ForLength(data.Length).Forward(data);
    }

    /// <summary><c>x_n = Σ_k X_k e^{+2πikn/N}</c> in place (no 1/N).</summary>
    public static void Inverse(Span<Complex> data)
    {
        if (BitOperations.IsPow2(data.Length)) FftPlan.ForLength(data.Length).Inverse(data);
        else BluesteinPlan.ForLength(data.Length).Inverse(data);
    }
}
