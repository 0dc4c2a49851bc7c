using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>
/// The noise-weighted inner product of one-sided spectra, <c>(a|b) = 4 Re Σ_k a_k b_k* / S_k Δf</c>,
/// over equal-length bin windows. Channels with independent noise add.
/// </summary>
/// <remarks>
/// Standard definition (Cutler &amp; Flanagan 1994, PRD 49, 2658, arXiv:gr-qc/9402014; their notation from memory),
/// discretised with <c>Δf = 1/T</c>. Kernels take the inverse PSD <c>1/S_k</c> so a caller that
/// evaluates many inner products against one noise model divides once, not per product. They allocate
/// nothing and are safe to call concurrently on distinct buffers.
/// </remarks>
public static class InnerProduct
{
    /// <summary><c>4 Δf Re Σ a_k b_k* w_k</c> with <c>w_k = 1/S_k</c>.</summary>
    public static double Real(ReadOnlySpan<Complex> a, ReadOnlySpan<Complex> b, ReadOnlySpan<double> inversePsd, double dfHz)
    {
        CheckLengths(a.Length, b.Length, inversePsd.Length);
        // Two accumulators break the add dependency chain; the loop is memory-bound beyond L2.
        double s0 = 0, s1 = 0;
        int k = 0;
        for (; k + 1 < a.Length; k += 2)
        {
            s0 += (a[k].Real * b[k].Real + a[k].Imaginary * b[k].Imaginary) * inversePsd[k];
            s1 += (a[k + 1].Real * b[k + 1].Real + a[k + 1].Imaginary * b[k + 1].Imaginary) * inversePsd[k + 1];
        }
        if (k < a.Length)
            s0 += (a[k].Real * b[k].Real + a[k].Imaginary * b[k].Imaginary) * inversePsd[k];
        return 4.0 * dfHz * (s0 + s1);
    }

    /// <summary><c>4 Δf Σ a_k b_k* w_k</c>: the complex inner product whose real part is <see cref="Real"/>
    /// and whose modulus is the inner product maximised over a constant phase.</summary>
    public static Complex ComplexProduct(ReadOnlySpan<Complex> a, ReadOnlySpan<Complex> b, ReadOnlySpan<double> inversePsd, double dfHz)
    {
        CheckLengths(a.Length, b.Length, inversePsd.Length);
        double re = 0, im = 0;
        for (int k = 0; k < a.Length; k++)
        {
            double w = inversePsd[k];
            re += (a[k].Real * b[k].Real + a[k].Imaginary * b[k].Imaginary) * w;
            im += (a[k].Imaginary * b[k].Real - a[k].Real * b[k].Imaginary) * w;
        }
        return new Complex(4.0 * dfHz * re, 4.0 * dfHz * im);
    }

    /// <summary><c>(a|a)</c>, the squared noise-weighted norm.</summary>
    public static double SquaredNorm(ReadOnlySpan<Complex> a, ReadOnlySpan<double> inversePsd, double dfHz) =>
        Real(a, a, inversePsd, dfHz);

    /// <summary>Fills <paramref name="inversePsd"/> with <c>1/S_k</c>; bins with a zero or non-finite PSD get weight 0
    /// so that excluded bins (DC, notches) drop out of every product.</summary>
    public static void InvertPsd(ReadOnlySpan<double> psd, Span<double> inversePsd)
    {
        CheckLengths(psd.Length, psd.Length, inversePsd.Length);
        for (int k = 0; k < psd.Length; k++)
            inversePsd[k] = psd[k] > 0 && double.IsFinite(psd[k]) ? 1.0 / psd[k] : 0.0;
    }

    private static void CheckLengths(int a, int b, int w)
    {
        if (a != b || a != w)
            throw new ArgumentException($"inner product needs equal lengths, got {a}, {b} and {w} bins");
    }
}
