namespace GlobalFit.Physics.Series;

/// <summary>The Tukey (tapered-cosine) window, used to taper record ends before a Fourier transform.</summary>
/// <remarks>
/// Definition of Harris 1978, "On the use of windows for harmonic analysis with the discrete Fourier
/// transform", Proc. IEEE 66, 51: a flat top with cosine tapers covering the fraction
/// <c>alpha</c> of the record (half at each end). <c>alpha = 0</c> is the rectangular window and
/// <c>alpha = 1</c> the Hann window.
/// </remarks>
public static class TukeyWindow
{
    /// <summary>Weight of sample <paramref name="index"/> of <paramref name="length"/>.</summary>
    /// <param name="index">Sample index, 0 ≤ index &lt; length.</param>
    /// <param name="length">Window length.</param>
    /// <param name="alpha">Tapered fraction in [0, 1].</param>
    public static double Weight(int index, int length, double alpha)
    {
        Validate(length, alpha);
        if (alpha == 0 || length == 1) return 1.0;
        double span = alpha * (length - 1) / 2.0;
        double fromNearestEnd = Math.Min(index, length - 1 - index);
        return fromNearestEnd >= span ? 1.0 : 0.5 * (1.0 - Math.Cos(Math.PI * fromNearestEnd / span));
    }

    /// <summary>Multiplies <paramref name="samples"/> in place by the window of the same length.</summary>
    public static void Apply(Span<double> samples, double alpha)
    {
        Validate(samples.Length, alpha);
        int n = samples.Length;
        if (alpha == 0 || n == 1) return;
        double span = alpha * (n - 1) / 2.0;
        int taper = (int)Math.Ceiling(span);
        for (int i = 0; i < taper && i < n; i++)
        {
            double w = 0.5 * (1.0 - Math.Cos(Math.PI * i / span));
            samples[i] *= w;
            samples[n - 1 - i] *= w;
        }
    }

    /// <summary>Sum of squared weights divided by the length: the power lost to the taper.</summary>
    public static double MeanSquare(int length, double alpha)
    {
        double sum = 0;
        for (int i = 0; i < length; i++)
        {
            double w = Weight(i, length, alpha);
            sum += w * w;
        }
        return sum / length;
    }

    private static void Validate(int length, double alpha)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(length, 1);
        if (!(alpha >= 0 && alpha <= 1))
            throw new ArgumentOutOfRangeException(nameof(alpha), alpha, "Tukey fraction must lie in [0, 1]");
    }
}
