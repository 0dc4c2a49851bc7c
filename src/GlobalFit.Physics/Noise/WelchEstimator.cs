using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Noise;

/// <summary>
/// Welch's averaged-periodogram estimate of a PSD or CSD: Hann-windowed segments of length L with 50 %
/// overlap, one-sided, normalised so that white noise of variance σ² gives <c>2σ²Δt</c>.
/// </summary>
/// <remarks>
/// <para>Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70. Segment s covers samples
/// <c>[s L/2, s L/2 + L)</c>, for <c>K = ⌊(N − L)/(L/2)⌋ + 1</c> segments; trailing samples that do not fill a
/// segment are not used. The window is <see cref="TukeyWindow"/> with alpha = 1 (symmetric Hann). For each segment
/// <c>x̃_k = Δt DFT(w x)</c> (the <see cref="FourierTransform"/> convention), and
/// <c>P_k = c_k Σ_s |x̃_k|² / (K L Δt ⟨w²⟩)</c> with <c>c_k = 2</c> for <c>0 &lt; k &lt; L/2</c> and 1 at DC and
/// Nyquist, so that <c>Σ_k P_k Δf</c> is the mean windowed power. No mean or trend is removed.</para>
/// <para>Statistics: for Gaussian noise each bin is close to <c>S χ²_{2K'}/(2K')</c> with
/// <c>K' ≈ K/(1 + 2ρ²)</c>, where <c>ρ = Σ_n w_n w_{n+L/2}/Σ_n w_n² = 1/6</c> (the product is non-zero only on the
/// overlapping half: mean sin²cos² = 1/8 over L/2 samples against mean sin⁴ = 3/8 over L) is the Hann correlation of neighbouring
/// half-overlapped segments (Welch 1967); see <see cref="EffectiveSegmentCount"/>. The estimate is the PSD
/// convolved with the window's spectral kernel (second moment 1/3 bin²), so it is biased where the PSD curves
/// strongly on the scale of a bin.</para>
/// </remarks>
public static class WelchEstimator
{
    /// <summary>Number of 50 %-overlapping segments of <paramref name="segmentLength"/> in <paramref name="sampleCount"/> samples.</summary>
    /// <exception cref="ArgumentException">The segment length is odd, below 4, or longer than the series.</exception>
    public static int SegmentCount(int sampleCount, int segmentLength)
    {
        if (segmentLength < 4 || segmentLength % 2 != 0)
            throw new ArgumentException($"segment length must be even and at least 4, got {segmentLength}", nameof(segmentLength));
        if (segmentLength > sampleCount)
            throw new ArgumentException($"segment length {segmentLength} exceeds the {sampleCount} samples", nameof(segmentLength));
        return (sampleCount - segmentLength) / (segmentLength / 2) + 1;
    }

    /// <summary>Effective number of independent segments <c>K/(1 + 2ρ²)</c> with <c>ρ = 1/6</c> for the Hann window
    /// at 50 % overlap (Welch 1967's variance formula, neglecting the <c>1/K</c> end correction and segments two apart,
    /// which do not overlap).</summary>
    public static double EffectiveSegmentCount(int segmentCount) => segmentCount / (1.0 + 2.0 / 36.0);

    /// <summary>Welch PSD estimate of <paramref name="samples"/>.</summary>
    /// <param name="samples">The time series.</param>
    /// <param name="dtSeconds">Sampling interval.</param>
    /// <param name="segmentLength">Segment length L (even, ≥ 4, ≤ N); a power of two is fastest.</param>
    public static WelchSpectrum Psd(ReadOnlySpan<double> samples, double dtSeconds, int segmentLength)
    {
        var (segments, window, scale) = Prepare(samples.Length, dtSeconds, segmentLength);
        int bins = FourierTransform.OneSidedLength(segmentLength);
        var psd = new double[bins];
        var work = new double[segmentLength];
        var spectrum = new Complex[bins];
        for (int s = 0; s < segments; s++)
        {
            Transform(samples.Slice(s * (segmentLength / 2), segmentLength), window, dtSeconds, work, spectrum);
            for (int k = 0; k < bins; k++)
                psd[k] += spectrum[k].Real * spectrum[k].Real + spectrum[k].Imaginary * spectrum[k].Imaginary;
        }
        for (int k = 0; k < bins; k++)
            psd[k] *= OneSidedFactor(k, segmentLength) * scale / segments;
        return new WelchSpectrum(1.0 / (segmentLength * dtSeconds), psd, segments, segmentLength);
    }

    /// <summary>Welch CSD estimate <c>S_ab</c> of two equally sampled series.</summary>
    /// <exception cref="ArgumentException">The series differ in length, or as for <see cref="Psd"/>.</exception>
    public static WelchCrossSpectrum Csd(ReadOnlySpan<double> a, ReadOnlySpan<double> b, double dtSeconds, int segmentLength)
    {
        if (a.Length != b.Length)
            throw new ArgumentException($"cross-spectrum needs equal lengths, got {a.Length} and {b.Length}", nameof(b));
        var (segments, window, scale) = Prepare(a.Length, dtSeconds, segmentLength);
        int bins = FourierTransform.OneSidedLength(segmentLength);
        var csd = new Complex[bins];
        var work = new double[segmentLength];
        var spectrumA = new Complex[bins];
        var spectrumB = new Complex[bins];
        for (int s = 0; s < segments; s++)
        {
            int start = s * (segmentLength / 2);
            Transform(a.Slice(start, segmentLength), window, dtSeconds, work, spectrumA);
            Transform(b.Slice(start, segmentLength), window, dtSeconds, work, spectrumB);
            for (int k = 0; k < bins; k++)
                csd[k] += spectrumA[k] * Complex.Conjugate(spectrumB[k]);
        }
        for (int k = 0; k < bins; k++)
            csd[k] *= OneSidedFactor(k, segmentLength) * scale / segments;
        return new WelchCrossSpectrum(1.0 / (segmentLength * dtSeconds), csd, segments, segmentLength);
    }

    private static (int Segments, double[] Window, double Scale) Prepare(int sampleCount, double dtSeconds, int segmentLength)
    {
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentException($"cadence must be positive and finite, got {dtSeconds}", nameof(dtSeconds));
        int segments = SegmentCount(sampleCount, segmentLength);
        var window = new double[segmentLength];
        Array.Fill(window, 1.0);
        TukeyWindow.Apply(window, 1.0);
        double meanSquare = 0;
        foreach (double w in window) meanSquare += w * w;
        meanSquare /= segmentLength;
        return (segments, window, 1.0 / (segmentLength * dtSeconds * meanSquare));
    }

    private static void Transform(ReadOnlySpan<double> segment, double[] window, double dtSeconds, double[] work, Complex[] spectrum)
    {
        for (int i = 0; i < work.Length; i++) work[i] = segment[i] * window[i];
        FourierTransform.Forward(work, dtSeconds, spectrum);
    }

    private static double OneSidedFactor(int k, int segmentLength) => k == 0 || 2 * k == segmentLength ? 1.0 : 2.0;
}
