using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>
/// Overlap and match between two multi-channel signals given on the same bin window.
/// </summary>
/// <remarks>
/// Overlap: <c>(a|b)/√((a|a)(b|b))</c>. Match: the overlap maximised over a common time shift τ and phase φ,
/// <c>max_τ |Σ_c 4Δf Σ_k a_ck b_ck* w_ck e^{2πi f_k τ}| / √((a|a)(b|b))</c>, the usual definition
/// (e.g. Owen 1996, PRD 53, 6749, for the ambiguity function). The τ grid is the inverse FFT of the
/// window zero-padded to four times its length, refined by a parabola through the three highest points.
/// </remarks>
public static class Match
{
    /// <summary>Normalised inner product over channels, with no maximisation. 0 when either signal is zero.</summary>
    /// <param name="a">Per-channel spectra of the first signal.</param>
    /// <param name="b">Per-channel spectra of the second signal (same shapes).</param>
    /// <param name="inversePsd">Per-channel inverse PSDs.</param>
    /// <param name="dfHz">Bin spacing.</param>
    public static double Overlap(IReadOnlyList<Complex[]> a, IReadOnlyList<Complex[]> b, IReadOnlyList<double[]> inversePsd, double dfHz)
    {
        CheckChannels(a, b, inversePsd);
        double ab = 0, aa = 0, bb = 0;
        for (int c = 0; c < a.Count; c++)
        {
            ab += InnerProduct.Real(a[c], b[c], inversePsd[c], dfHz);
            aa += InnerProduct.SquaredNorm(a[c], inversePsd[c], dfHz);
            bb += InnerProduct.SquaredNorm(b[c], inversePsd[c], dfHz);
        }
        return aa > 0 && bb > 0 ? ab / Math.Sqrt(aa * bb) : 0.0;
    }

    /// <summary>Overlap maximised over a common time shift and phase. 0 when either signal is zero.</summary>
    /// <param name="a">Per-channel spectra of the first signal on bins <c>firstBin …</c>.</param>
    /// <param name="b">Per-channel spectra of the second signal (same shapes).</param>
    /// <param name="inversePsd">Per-channel inverse PSDs.</param>
    /// <param name="dfHz">Bin spacing.</param>
    public static double MaximisedOverTimeAndPhase(IReadOnlyList<Complex[]> a, IReadOnlyList<Complex[]> b, IReadOnlyList<double[]> inversePsd, double dfHz)
    {
        CheckChannels(a, b, inversePsd);
        int count = a[0].Length;
        int padded = (int)BitOperations.RoundUpToPowerOf2((uint)Math.Max(2, 4 * count));
        var series = new Complex[padded];
        double aa = 0, bb = 0;
        for (int c = 0; c < a.Count; c++)
        {
            for (int k = 0; k < count; k++)
                series[k] += a[c][k] * Complex.Conjugate(b[c][k]) * inversePsd[c][k];
            aa += InnerProduct.SquaredNorm(a[c], inversePsd[c], dfHz);
            bb += InnerProduct.SquaredNorm(b[c], inversePsd[c], dfHz);
        }
        if (!(aa > 0 && bb > 0)) return 0.0;
        // Σ_k z_k e^{+2πi k j/P} is the correlation at τ_j = j/(P Δf); the window's first-bin offset
        // only multiplies it by a phase, which the modulus removes.
        FftPlan.ForLength(padded).Inverse(series);
        int best = 0;
        double bestValue = -1;
        for (int j = 0; j < padded; j++)
        {
            double m = series[j].Magnitude;
            if (m > bestValue) { bestValue = m; best = j; }
        }
        double left = series[(best - 1 + padded) % padded].Magnitude;
        double right = series[(best + 1) % padded].Magnitude;
        double peak = RefinePeak(left, bestValue, right);
        return Math.Min(1.0, 4.0 * dfHz * peak / Math.Sqrt(aa * bb));
    }

    // Vertex of the parabola through three equally spaced points; falls back to the centre value when flat.
    private static double RefinePeak(double left, double centre, double right)
    {
        double curvature = left - 2 * centre + right;
        if (curvature >= 0) return centre;
        double offset = 0.5 * (left - right) / curvature;
        return centre - 0.25 * (left - right) * offset;
    }

    private static void CheckChannels(IReadOnlyList<Complex[]> a, IReadOnlyList<Complex[]> b, IReadOnlyList<double[]> w)
    {
        if (a.Count == 0 || a.Count != b.Count || a.Count != w.Count)
            throw new ArgumentException($"match needs the same non-zero number of channels, got {a.Count}, {b.Count} and {w.Count}");
        int n = a[0].Length;
        for (int c = 0; c < a.Count; c++)
            if (a[c].Length != n || b[c].Length != n || w[c].Length != n)
                throw new ArgumentException($"channel {c} lengths differ from {n} bins");
    }
}
