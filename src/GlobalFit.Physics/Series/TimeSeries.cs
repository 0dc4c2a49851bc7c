namespace GlobalFit.Physics.Series;

/// <summary>A uniformly sampled real time series: sample <c>n</c> is taken at <c>T0Seconds + n DtSeconds</c>.</summary>
/// <remarks>The sample array is owned by the series once handed over; callers must not change it afterwards.
/// Instances are immutable in that sense and safe to share between threads.</remarks>
public sealed class TimeSeries
{
    /// <summary>Wraps <paramref name="samples"/> (not copied) with its time axis.</summary>
    /// <exception cref="ArgumentException">The start time is not finite or the cadence is not a positive finite number.</exception>
    public TimeSeries(double t0Seconds, double dtSeconds, double[] samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        if (!double.IsFinite(t0Seconds))
            throw new ArgumentException($"start time must be finite, got {t0Seconds}", nameof(t0Seconds));
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentException($"cadence must be positive and finite, got {dtSeconds}", nameof(dtSeconds));
        T0Seconds = t0Seconds;
        DtSeconds = dtSeconds;
        Samples = samples;
    }

    /// <summary>Time of the first sample.</summary>
    /// <value>s.</value>
    public double T0Seconds { get; }

    /// <summary>Sampling interval.</summary>
    /// <value>s.</value>
    public double DtSeconds { get; }

    /// <summary>The samples.</summary>
    public double[] Samples { get; }

    /// <summary>Number of samples.</summary>
    public int Count => Samples.Length;

    /// <summary>Length of the record, <c>Count × DtSeconds</c>.</summary>
    /// <value>s.</value>
    public double DurationSeconds => Count * DtSeconds;

    /// <summary>Time of sample <paramref name="index"/>.</summary>
    /// <value>s.</value>
    public double TimeOf(int index) => T0Seconds + index * DtSeconds;

    /// <summary>Index of the first sample that is NaN or infinite, or -1 when all are finite.</summary>
    public int IndexOfFirstNonFinite()
    {
        var s = Samples;
        for (int i = 0; i < s.Length; i++)
            if (!double.IsFinite(s[i])) return i;
        return -1;
    }
}
