using System.Numerics;

namespace GlobalFit.Physics.Series;

/// <summary>A one-sided, uniformly spaced frequency series: value <c>k</c> belongs to <c>F0Hz + k DfHz</c>.</summary>
/// <remarks>
/// Values follow the continuous-transform convention of <see cref="FourierTransform"/>: a bin holds
/// <c>dt × DFT</c>, an approximation of <c>∫ h(t) e^{-2πift} dt</c>, so its unit is (signal unit)·s.
/// The value array is owned by the series once handed over.
/// </remarks>
public sealed class FrequencySeries
{
    /// <summary>Wraps <paramref name="values"/> (not copied) with its frequency axis.</summary>
    /// <exception cref="ArgumentException">The start frequency is negative or not finite, or the spacing is not positive and finite.</exception>
    public FrequencySeries(double f0Hz, double dfHz, Complex[] values)
    {
        ArgumentNullException.ThrowIfNull(values);
        if (!(f0Hz >= 0) || !double.IsFinite(f0Hz))
            throw new ArgumentException($"start frequency must be finite and non-negative, got {f0Hz}", nameof(f0Hz));
        if (!(dfHz > 0) || !double.IsFinite(dfHz))
            throw new ArgumentException($"frequency spacing must be positive and finite, got {dfHz}", nameof(dfHz));
        F0Hz = f0Hz;
        DfHz = dfHz;
        Values = values;
    }

    /// <summary>Frequency of the first value.</summary>
    /// <value>Hz.</value>
    public double F0Hz { get; }

    /// <summary>Bin spacing, the inverse of the record length.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>The complex values.</summary>
    public Complex[] Values { get; }

    /// <summary>Number of bins.</summary>
    public int Count => Values.Length;

    /// <summary>Frequency of bin <paramref name="index"/>.</summary>
    /// <value>Hz.</value>
    public double FrequencyOf(int index) => F0Hz + index * DfHz;
}
