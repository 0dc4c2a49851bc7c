using System.Collections.Concurrent;
using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>
/// A precomputed complex DFT for any length, by Bluestein's chirp-z algorithm on top of the power-of-two
/// <see cref="FftPlan"/>: <c>X_k = w_k Σ_n (x_n w_n) w*_{k−n}</c> with <c>w_k = e^{−iπk²/N}</c>, the convolution done
/// with FFTs of a power-of-two length M ≥ 2N − 1.
/// </summary>
/// <remarks>
/// Bluestein 1970, IEEE Trans. Audio Electroacoust. 18, 451. Observation lengths are rarely powers of two
/// (a Julian year at 5 s is 2^5·3^4·5·487 samples), and a general-length transform that is tens of times
/// slower than the power-of-two one would dominate simulation and whitening. The chirp angle uses
/// <c>k² mod 2N</c> in exact integer arithmetic, because <c>πk²/N</c> in floating point loses digits once
/// <c>k²</c> exceeds 2^53 / N. Implementation note: per transform this costs two FFTs of length M plus O(M)
/// work, about 4–6× a power-of-two transform of length N. A plan is immutable and thread-safe.
/// </remarks>
public sealed class BluesteinPlan
{
    private static readonly ConcurrentDictionary<int, BluesteinPlan> Cache = new();

    private readonly Complex[] _chirp;          // w_k = e^{-iπk²/N}, k = 0 … N−1
    private readonly Complex[] _kernelSpectrum; // FFT_M of b, b_k = conj(w_|k|) wrapped onto M points
    private readonly FftPlan _fft;

    private BluesteinPlan(int length)
    {
        Length = length;
        int m = checked((int)BitOperations.RoundUpToPowerOf2((uint)(2 * length - 1)));
        _fft = FftPlan.ForLength(m);
        _chirp = new Complex[length];
        long twiceLength = 2L * length;
        for (int k = 0; k < length; k++)
        {
            long residue = (long)k * k % twiceLength;
            double angle = -Math.PI * residue / length;
            _chirp[k] = new Complex(Math.Cos(angle), Math.Sin(angle));
        }
        _kernelSpectrum = new Complex[m];
        _kernelSpectrum[0] = Complex.Conjugate(_chirp[0]);
        for (int k = 1; k < length; k++)
        {
            _kernelSpectrum[k] = Complex.Conjugate(_chirp[k]);
            _kernelSpectrum[m - k] = Complex.Conjugate(_chirp[k]);
        }
        _fft.Forward(_kernelSpectrum);
    }

    /// <summary>Transform length.</summary>
    public int Length { get; }

    /// <summary>The shared plan for <paramref name="length"/> (≥ 1).</summary>
    public static BluesteinPlan ForLength(int length)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(length, 1);
        return Cache.GetOrAdd(length, static n => new BluesteinPlan(n));
    }

    /// <summary>Unscaled forward DFT, <c>X_k = Σ_n x_n e^{−2πikn/N}</c>, in place.</summary>
    public void Forward(Span<Complex> data) => Transform(data, inverse: false);

    /// <summary>Unscaled inverse DFT, <c>x_n = Σ_k X_k e^{+2πikn/N}</c> (no 1/N), in place.</summary>
    public void Inverse(Span<Complex> data) => Transform(data, inverse: true);

    private void Transform(Span<Complex> data, bool inverse)
    {
        if (data.Length != Length)
            throw new ArgumentException($"plan is for {Length} points, data has {data.Length}", nameof(data));
        int m = _kernelSpectrum.Length;
        var work = new Complex[m];
        // The inverse DFT is the conjugate of the forward DFT of the conjugate.
        for (int n = 0; n < Length; n++)
            work[n] = (inverse ? Complex.Conjugate(data[n]) : data[n]) * _chirp[n];
        _fft.Forward(work);
        for (int k = 0; k < m; k++) work[k] *= _kernelSpectrum[k];
        _fft.Inverse(work);
        double scale = 1.0 / m;
        for (int k = 0; k < Length; k++)
        {
            Complex value = work[k] * _chirp[k] * scale;
            data[k] = inverse ? Complex.Conjugate(value) : value;
        }
    }
}
