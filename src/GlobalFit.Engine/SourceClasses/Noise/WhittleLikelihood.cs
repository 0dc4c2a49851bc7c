using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The Whittle log likelihood of a PSD that is a linear combination of fixed per-bin shapes, and its score:
/// the hot kernels of the noise fit.</summary>
/// <remarks>
/// <para>For one-sided bins in the continuous-transform convention (E|ñ_k|² = (T/2) S_k), each complex bin of each
/// channel has independent real and imaginary parts of variance T S_k / 4, so
/// <c>ln L = −Σ_k Σ_ch [2Δf |r̃_k|² / S_k + ln S_k]</c> + const (Whittle 1957, J. R. Stat. Soc. B 19, 38; the
/// quadratic term is −½ (r|r) with the inner product of Cutler &amp; Flanagan 1994, PRD 49, 2658, as in
/// <see cref="Physics.Series.InnerProduct"/>). Channels sharing one PSD (A and E) are folded into one power per bin,
/// <c>p_k = 2Δf Σ_ch |r̃_k|²</c> with log weight w = number of channels, so the kernels compute
/// <c>−Σ_k [p_k / S_k + w ln S_k]</c> with <c>S_k = Σ_j c_j x_jk</c>.</para>
/// <para>Callers normalise p and the shapes by a reference PSD so that S ≈ 1: the sums then stay small and the
/// rounding error of a million terms is far below the ln L differences the sampler uses.</para>
/// <para>Allocation-free; vectorised with <see cref="Vector256"/>, one log per 8 bins per lane (of the product of their
/// S) and two quotient accumulators to hide the divide latency; lanes are summed in a fixed order, so results are
/// reproducible on one machine. A non-positive S
/// gives −∞.</para>
/// </remarks>
public static class WhittleLikelihood
{
    // Bins per block: each lane multiplies the S of 8 bins and takes one log of the product, since Σ ln S = ln Π S.
    // Callers normalise S to ≈ 1 (within the prior's 1e-4 … 1e4 per bin), so a product of 8 stays far inside the
    // double range (1e±32 at worst), and its rounding (8 ulp) is negligible; the log, not the divide, was the cost.
    private const int BlockBins = 32;

    /// <summary><c>−Σ_k [p_k / S_k + w ln S_k]</c> with <c>S_k = c₁ x_k + c₂ y_k</c>.</summary>
    /// <param name="power">p_k.</param>
    /// <param name="first">x_k.</param>
    /// <param name="second">y_k.</param>
    /// <param name="firstCoefficient">c₁.</param>
    /// <param name="secondCoefficient">c₂.</param>
    /// <param name="logWeight">w.</param>
    /// <returns>The log likelihood, or −∞ when some S_k ≤ 0.</returns>
    public static double LogLikelihood(ReadOnlySpan<double> power, ReadOnlySpan<double> first, ReadOnlySpan<double> second,
        double firstCoefficient, double secondCoefficient, double logWeight)
    {
        if (first.Length != power.Length || second.Length != power.Length) throw new ArgumentException("shape and power lengths differ");
        return Kernel(power, new TwoShapes(first, second, firstCoefficient, secondCoefficient), logWeight);
    }

    /// <summary><c>−Σ_k [p_k / S_k + w ln S_k]</c> with <c>S_k = c₁ x_k + c₂ y_k + c₃ z_k</c>.</summary>
    /// <param name="power">p_k.</param>
    /// <param name="first">x_k.</param>
    /// <param name="second">y_k.</param>
    /// <param name="third">z_k.</param>
    /// <param name="firstCoefficient">c₁.</param>
    /// <param name="secondCoefficient">c₂.</param>
    /// <param name="thirdCoefficient">c₃.</param>
    /// <param name="logWeight">w.</param>
    /// <returns>The log likelihood, or −∞ when some S_k ≤ 0.</returns>
    public static double LogLikelihood(ReadOnlySpan<double> power, ReadOnlySpan<double> first, ReadOnlySpan<double> second,
        ReadOnlySpan<double> third, double firstCoefficient, double secondCoefficient, double thirdCoefficient, double logWeight)
    {
        if (first.Length != power.Length || second.Length != power.Length || third.Length != power.Length)
            throw new ArgumentException("shape and power lengths differ");
        return Kernel(power, new ThreeShapes(first, second, third, firstCoefficient, secondCoefficient, thirdCoefficient), logWeight);
    }

    // One kernel for any number of shapes: TShapes is a struct, so the JIT compiles a copy per shape count with the
    // PSD sum inlined, as fast as a hand-written copy.
    private static double Kernel<TShapes>(ReadOnlySpan<double> power, TShapes shapes, double logWeight)
        where TShapes : IShapeSum, allows ref struct
    {
        int n = power.Length;
        ref double p = ref MemoryMarshal.GetReference(power);
        double sum = 0;
        int i = 0;
        // Unchecked: i + BlockBins ≤ n is guaranteed by the loop bound.
        unchecked
        {
            if (Vector256.IsHardwareAccelerated)
            {
                var quotients0 = Vector256<double>.Zero;
                var quotients1 = Vector256<double>.Zero;
                var logs = Vector256<double>.Zero;
                // A product of negative S could be positive, so the smallest S is tracked to reject them.
                var smallest = Vector256.Create(double.PositiveInfinity);
                for (; i <= n - BlockBins; i += BlockBins)
                {
                    var product = Vector256<double>.One;
                    for (int v = 0; v < BlockBins; v += 8)
                    {
                        nuint at = (nuint)(i + v);
                        var s0 = shapes.At(at);
                        var s1 = shapes.At(at + 4);
                        quotients0 += Vector256.LoadUnsafe(ref p, at) / s0;
                        quotients1 += Vector256.LoadUnsafe(ref p, at + 4) / s1;
                        product *= s0 * s1;
                        smallest = Vector256.Min(smallest, Vector256.Min(s0, s1));
                    }
                    logs += Vector256.Log(product);
                }
                sum = Vector256.Sum(quotients0 + quotients1) + logWeight * Vector256.Sum(logs);
                if (!Vector256.GreaterThanAll(smallest, Vector256<double>.Zero)) return double.NegativeInfinity;
            }
            for (; i < n; i++)
            {
                double s = shapes.At(i);
                if (!(s > 0)) return double.NegativeInfinity;
                sum += power[i] / s + logWeight * Math.Log(s);
            }
        }
        return double.IsNaN(sum) || sum == double.PositiveInfinity ? double.NegativeInfinity : -sum;
    }

    private interface IShapeSum
    {
        /// <summary>S at bins at … at + 3.</summary>
        Vector256<double> At(nuint at);

        /// <summary>S at bin i.</summary>
        double At(int i);
    }

    private readonly ref struct TwoShapes(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double c1, double c2) : IShapeSum
    {
        private readonly ReadOnlySpan<double> _x = x, _y = y;

        public Vector256<double> At(nuint at) =>
            Vector256.Create(c1) * Vector256.LoadUnsafe(ref MemoryMarshal.GetReference(_x), at)
            + Vector256.Create(c2) * Vector256.LoadUnsafe(ref MemoryMarshal.GetReference(_y), at);

        public double At(int i) => c1 * _x[i] + c2 * _y[i];
    }

    private readonly ref struct ThreeShapes(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z, double c1, double c2, double c3) : IShapeSum
    {
        private readonly ReadOnlySpan<double> _x = x, _y = y, _z = z;

        public Vector256<double> At(nuint at) =>
            Vector256.Create(c1) * Vector256.LoadUnsafe(ref MemoryMarshal.GetReference(_x), at)
            + Vector256.Create(c2) * Vector256.LoadUnsafe(ref MemoryMarshal.GetReference(_y), at)
            + Vector256.Create(c3) * Vector256.LoadUnsafe(ref MemoryMarshal.GetReference(_z), at);

        public double At(int i) => c1 * _x[i] + c2 * _y[i] + c3 * _z[i];
    }

    /// <summary>Adds the score and the expected (Fisher) information of the coefficients: with
    /// <c>S_k = Σ_j c_j shape_jk</c>, <c>∂ ln L/∂c_j = Σ_k (p_k/S_k² − w/S_k) shape_jk</c> and
    /// <c>F_jl = Σ_k w shape_jk shape_lk / S_k²</c> (E[p_k] = w S_k).</summary>
    /// <param name="power">p_k.</param>
    /// <param name="shapes">The m shapes (2 or 3), each as long as <paramref name="power"/>.</param>
    /// <param name="coefficients">c_j, m values.</param>
    /// <param name="logWeight">w.</param>
    /// <param name="gradient">Receives (adds) the m score components.</param>
    /// <param name="fisher">Receives (adds) the m×m information, row-major.</param>
    /// <remarks>Runs a few times per update (mode finding), not per sampler step, so it is left scalar.</remarks>
    public static void AccumulateScore(ReadOnlySpan<double> power, ReadOnlySpan<double[]> shapes, ReadOnlySpan<double> coefficients,
        double logWeight, Span<double> gradient, Span<double> fisher)
    {
        int m = shapes.Length;
        if (m is < 1 or > 3 || coefficients.Length != m || gradient.Length != m || fisher.Length != m * m)
            throw new ArgumentException("score buffers must match 1 to 3 shapes");
        Span<double> values = stackalloc double[3];
        for (int k = 0; k < power.Length; k++)
        {
            double s = 0;
            for (int j = 0; j < m; j++)
            {
                values[j] = shapes[j][k];
                s += coefficients[j] * values[j];
            }
            double inverse = 1.0 / s;
            double slope = (power[k] * inverse - logWeight) * inverse;
            double curvature = logWeight * inverse * inverse;
            for (int j = 0; j < m; j++)
            {
                gradient[j] += slope * values[j];
                for (int l = 0; l < m; l++) fisher[j * m + l] += curvature * values[j] * values[l];
            }
        }
    }
}
