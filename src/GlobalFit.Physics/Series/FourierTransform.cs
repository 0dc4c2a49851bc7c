using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>
/// Real-signal Fourier transforms in the continuous-transform convention used throughout globalfit.
/// </summary>
/// <remarks>
/// <para>Forward: <c>h̃_k = Δt Σ_n h_n e^{-2πikn/N}</c> for <c>k = 0 … N/2</c>, at <c>f_k = k/(NΔt)</c>,
/// approximating <c>h̃(f) = ∫ h(t) e^{-2πift} dt</c>. Inverse: <c>h_n = (1/(NΔt)) Σ_{k=0}^{N-1} h̃_k e^{+2πikn/N}</c>
/// with the negative-frequency half filled by Hermitian symmetry. With this convention Parseval reads
/// <c>Δt Σ h_n² = Δf Σ_{k=0}^{N-1} |h̃_k|²</c>, and Gaussian noise of one-sided PSD S has
/// <c>E|h̃_k|² = (T/2) S(f_k)</c> (derived: Parseval with a one-sided PSD; simulated white noise confirms it, see
/// the tests).</para>
/// <para>Implementation note: even lengths pack the real samples into N/2 complex values and run one complex
/// DFT of N/2 points (<see cref="ComplexDft"/>: radix-2 for powers of two, Bluestein otherwise); odd lengths
/// run a complex DFT of N points. MathNet 5.0's general-length transform took ~37 s for the 6.3 M samples of
/// a year at 5 s on this machine, which is why it is not used.</para>
/// </remarks>
public static class FourierTransform
{
    /// <summary>Number of one-sided bins for <paramref name="sampleCount"/> samples: <c>N/2 + 1</c>.</summary>
    public static int OneSidedLength(int sampleCount) => sampleCount / 2 + 1;

    /// <summary>Transforms a time series to its one-sided spectrum (bins 0 … N/2).</summary>
    public static FrequencySeries Forward(TimeSeries series)
    {
        var output = new Complex[OneSidedLength(series.Count)];
        Forward(series.Samples, series.DtSeconds, output);
        return new FrequencySeries(0, 1.0 / series.DurationSeconds, output);
    }

    /// <summary>Writes the one-sided spectrum of <paramref name="samples"/> into <paramref name="output"/> (length N/2 + 1).</summary>
    public static void Forward(ReadOnlySpan<double> samples, double dtSeconds, Span<Complex> output)
    {
        int n = samples.Length;
        if (output.Length != OneSidedLength(n))
            throw new ArgumentException($"output must hold {OneSidedLength(n)} bins, has {output.Length}", nameof(output));
        if (IsPackable(n))
            ForwardPacked(samples, output);
        else
            ForwardGeneral(samples, output);
        for (int k = 0; k < output.Length; k++) output[k] *= dtSeconds;
    }

    /// <summary>Rebuilds <paramref name="sampleCount"/> real samples from a one-sided spectrum of N/2 + 1 bins.</summary>
    public static TimeSeries Inverse(FrequencySeries spectrum, int sampleCount, double t0Seconds)
    {
        double dt = 1.0 / (spectrum.DfHz * sampleCount);
        var samples = new double[sampleCount];
        Inverse(spectrum.Values, dt, samples);
        return new TimeSeries(t0Seconds, dt, samples);
    }

    /// <summary>Writes the real samples whose one-sided spectrum is <paramref name="spectrum"/> into <paramref name="samples"/>.</summary>
    /// <remarks>The imaginary parts of the DC bin and, for even N, of the Nyquist bin are ignored,
    /// as a real series cannot carry them.</remarks>
    public static void Inverse(ReadOnlySpan<Complex> spectrum, double dtSeconds, Span<double> samples)
    {
        int n = samples.Length;
        if (spectrum.Length != OneSidedLength(n))
            throw new ArgumentException($"spectrum must hold {OneSidedLength(n)} bins for {n} samples, has {spectrum.Length}", nameof(spectrum));
        if (IsPackable(n))
            InversePacked(spectrum, samples);
        else
            InverseGeneral(spectrum, samples);
        double scale = 1.0 / (n * dtSeconds);
        for (int i = 0; i < n; i++) samples[i] *= scale;
    }

    private static bool IsPackable(int n) => n >= 4 && n % 2 == 0;

    // Real FFT by packing: z_m = x_{2m} + i x_{2m+1}; with Z = FFT_{N/2}(z),
    // E_k = (Z_k + Z*_{M-k})/2, O_k = (Z_k - Z*_{M-k})/(2i), X_k = E_k + e^{-2πik/N} O_k.
    private static void ForwardPacked(ReadOnlySpan<double> samples, Span<Complex> output)
    {
        int n = samples.Length, m = n / 2;
        var packed = new Complex[m];
        for (int i = 0; i < m; i++) packed[i] = new Complex(samples[2 * i], samples[2 * i + 1]);
        ComplexDft.Forward(packed);
        for (int k = 0; k <= m; k++)
        {
            Complex zk = packed[k % m];
            Complex zc = Complex.Conjugate(packed[(m - k) % m]);
            Complex even = 0.5 * (zk + zc);
            Complex odd = new Complex(0, -0.5) * (zk - zc);
            output[k] = even + Twiddle(k, n) * odd;
        }
    }

    private static void InversePacked(ReadOnlySpan<Complex> spectrum, Span<double> samples)
    {
        int n = samples.Length, m = n / 2;
        var packed = new Complex[m];
        for (int k = 0; k < m; k++)
        {
            Complex xk = k == 0 ? new Complex(spectrum[0].Real, 0) : spectrum[k];
            Complex xc = k == 0 ? new Complex(spectrum[m].Real, 0) : Complex.Conjugate(spectrum[m - k]);
            Complex even = 0.5 * (xk + xc);
            Complex odd = 0.5 * (xk - xc) / Twiddle(k, n);
            packed[k] = even + Complex.ImaginaryOne * odd;
        }
        ComplexDft.Inverse(packed);
        // The unscaled inverse of length M returns M z_m, and z_m = (x_{2m} + i x_{2m+1}); the caller's
        // 1/(N dt) expects N x, hence the factor 2.
        for (int i = 0; i < m; i++)
        {
            samples[2 * i] = 2.0 * packed[i].Real;
            samples[2 * i + 1] = 2.0 * packed[i].Imaginary;
        }
    }

    private static Complex Twiddle(int k, int n)
    {
        double angle = -2.0 * Math.PI * k / n;
        return new Complex(Math.Cos(angle), Math.Sin(angle));
    }

    private static void ForwardGeneral(ReadOnlySpan<double> samples, Span<Complex> output)
    {
        var work = new Complex[samples.Length];
        for (int i = 0; i < work.Length; i++) work[i] = samples[i];
        ComplexDft.Forward(work);
        work.AsSpan(0, output.Length).CopyTo(output);
    }

    private static void InverseGeneral(ReadOnlySpan<Complex> spectrum, Span<double> samples)
    {
        int n = samples.Length;
        var work = new Complex[n];
        for (int k = 0; k < spectrum.Length; k++) work[k] = spectrum[k];
        work[0] = new Complex(spectrum[0].Real, 0);
        if (n % 2 == 0) work[n / 2] = new Complex(spectrum[n / 2].Real, 0);
        for (int k = spectrum.Length; k < n; k++) work[k] = Complex.Conjugate(spectrum[n - k]);
        ComplexDft.Inverse(work);
        for (int i = 0; i < n; i++) samples[i] = work[i].Real;
    }
}
