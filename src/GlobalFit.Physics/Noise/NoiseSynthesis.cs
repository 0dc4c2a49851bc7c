using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Noise;

/// <summary>
/// Stationary coloured Gaussian noise with a given one-sided PSD, synthesised in the frequency domain from
/// standard-normal draws supplied by the caller (so Physics owns no random-number generator and a run is
/// reproducible from the caller's stream).
/// </summary>
/// <remarks>
/// <para>For N samples at cadence Δt (T = NΔt, bins <c>f_k = k/T</c>, k = 0 … ⌊N/2⌋): bin 0 is set to 0
/// (no DC offset); bins <c>1 ≤ k &lt; N/2</c> get <c>ñ_k = √(T S_k/4) (g₁ + i g₂)</c>; for even N the Nyquist bin
/// <c>k = N/2</c> is real, <c>ñ = √(T S_k/2) g</c>. Every bin then has <c>E|ñ_k|² = (T/2) S_k</c>, the one-sided
/// noise statistics (as in Cutler &amp; Flanagan 1994, arXiv:gr-qc/9402014) in the continuous-transform convention of
/// <see cref="FourierTransform"/>, and <see cref="FourierTransform.Inverse(ReadOnlySpan{Complex}, double, Span{double})"/>
/// returns the time series. Its expected mean square is <c>Δf (Σ_{0&lt;k&lt;N/2} S_k + S_{N/2}/2)</c>,
/// the discrete <c>∫ S df</c>.</para>
/// <para>Draw order: exactly <see cref="RequiredNormalCount"/> = N − 1 normals are consumed, in the order
/// <c>Re ñ_1, Im ñ_1, Re ñ_2, Im ñ_2, …</c> up to the last complex bin, then (even N only) the Nyquist bin.</para>
/// <para>The output is periodic over T (a circulant process): correlations wrap around the record ends, which
/// is harmless when T is much longer than the noise correlation time.</para>
/// <para>Implementation note (Release build, shared 2-core machine, <see cref="NoiseSynthesisProbe"/>): one Julian
/// year of A, E and T at 5 s (N = 6,311,520 = 2⁵·3⁴·5·487) took 112–121 s, almost all of it in the general-length
/// inverse FFT of <see cref="FourierTransform"/>; the nearest power of two, N = 2²³ (≈ 3.76 s cadence), took
/// 7–10 s. Prefer power-of-two lengths for long simulations.</para>
/// </remarks>
public static class NoiseSynthesis
{
    /// <summary>Number of standard normals one channel of <paramref name="sampleCount"/> samples consumes: N − 1.</summary>
    public static int RequiredNormalCount(int sampleCount)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(sampleCount, 2);
        return sampleCount - 1;
    }

    /// <summary>Colours standard-normal draws into a time series whose one-sided PSD is <paramref name="oneSidedPsd"/>.</summary>
    /// <param name="standardNormals">N − 1 independent standard-normal draws, consumed in the documented order.</param>
    /// <param name="oneSidedPsd">PSD at <c>f_k = k/(NΔt)</c>, k = 0 … N/2 (length N/2 + 1); bin 0 is ignored and
    /// may be infinite; the others must be finite and non-negative. Unit: (signal unit)²/Hz.</param>
    /// <param name="dtSeconds">Sampling interval Δt.</param>
    /// <param name="output">The N samples to write.</param>
    /// <exception cref="ArgumentException">A length does not match N, the cadence is not positive and finite,
    /// or a PSD value past bin 0 is negative or not finite.</exception>
    public static void ColourWhiteNoise(ReadOnlySpan<double> standardNormals, ReadOnlySpan<double> oneSidedPsd, double dtSeconds, Span<double> output)
    {
        int n = output.Length;
        int normals = RequiredNormalCount(n);
        if (standardNormals.Length != normals)
            throw new ArgumentException($"{n} samples need {normals} standard normals, got {standardNormals.Length}", nameof(standardNormals));
        int bins = FourierTransform.OneSidedLength(n);
        if (oneSidedPsd.Length != bins)
            throw new ArgumentException($"{n} samples need a PSD of {bins} bins, got {oneSidedPsd.Length}", nameof(oneSidedPsd));
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentException($"cadence must be positive and finite, got {dtSeconds}", nameof(dtSeconds));
        for (int k = 1; k < bins; k++)
        {
            if (!(oneSidedPsd[k] >= 0) || !double.IsFinite(oneSidedPsd[k]))
                throw new ArgumentException($"PSD bin {k} must be finite and non-negative, got {oneSidedPsd[k]}", nameof(oneSidedPsd));
        }

        double durationSeconds = n * dtSeconds;
        var spectrum = new Complex[bins];
        bool hasNyquist = n % 2 == 0;
        int lastComplexBin = hasNyquist ? bins - 2 : bins - 1;
        int draw = 0;
        for (int k = 1; k <= lastComplexBin; k++)
        {
            double scale = Math.Sqrt(0.25 * durationSeconds * oneSidedPsd[k]);
            spectrum[k] = new Complex(scale * standardNormals[draw], scale * standardNormals[draw + 1]);
            draw += 2;
        }
        if (hasNyquist)
            spectrum[bins - 1] = Math.Sqrt(0.5 * durationSeconds * oneSidedPsd[bins - 1]) * standardNormals[draw];
        FourierTransform.Inverse(spectrum, dtSeconds, output);
    }

    /// <summary>Synthesises A, E and T noise for <paramref name="model"/>, each channel from its own normals.</summary>
    /// <param name="model">The noise model (instrument and optional foreground).</param>
    /// <param name="sampleCount">Samples per channel N (at least 2).</param>
    /// <param name="dtSeconds">Sampling interval.</param>
    /// <param name="t0Seconds">Time of the first sample.</param>
    /// <param name="normalsA">N − 1 standard normals for A.</param>
    /// <param name="normalsE">N − 1 standard normals for E.</param>
    /// <param name="normalsT">N − 1 standard normals for T.</param>
    /// <remarks>A, E and T noises are independent for equal arms (derived: their cross-spectra vanish, see
    /// <see cref="InstrumentNoiseModel"/>), so
    /// independent draws per channel give the right joint statistics.</remarks>
    public static AetTimeSeries SynthesiseAet(AetNoiseModel model, int sampleCount, double dtSeconds, double t0Seconds,
        ReadOnlySpan<double> normalsA, ReadOnlySpan<double> normalsE, ReadOnlySpan<double> normalsT)
    {
        ArgumentNullException.ThrowIfNull(model);
        int normals = RequiredNormalCount(sampleCount);
        if (normalsA.Length != normals || normalsE.Length != normals || normalsT.Length != normals)
            throw new ArgumentException(
                $"{sampleCount} samples need {normals} standard normals per channel, got {normalsA.Length}, {normalsE.Length} and {normalsT.Length}");
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentException($"cadence must be positive and finite, got {dtSeconds}", nameof(dtSeconds));
        var psd = new double[FourierTransform.OneSidedLength(sampleCount)];
        double dfHz = 1.0 / (sampleCount * dtSeconds);
        var a = Channel(model, AetChannel.A, normalsA, psd, dfHz, dtSeconds, sampleCount);
        var e = Channel(model, AetChannel.E, normalsE, psd, dfHz, dtSeconds, sampleCount);
        var t = Channel(model, AetChannel.T, normalsT, psd, dfHz, dtSeconds, sampleCount);
        return new AetTimeSeries(new TimeSeries(t0Seconds, dtSeconds, a), new TimeSeries(t0Seconds, dtSeconds, e), new TimeSeries(t0Seconds, dtSeconds, t));
    }

    private static double[] Channel(AetNoiseModel model, AetChannel channel, ReadOnlySpan<double> normals, double[] psd,
        double dfHz, double dtSeconds, int sampleCount)
    {
        model.FillPsd(channel, 0.0, dfHz, psd);
        var samples = new double[sampleCount];
        ColourWhiteNoise(normals, psd, dtSeconds, samples);
        return samples;
    }
}
