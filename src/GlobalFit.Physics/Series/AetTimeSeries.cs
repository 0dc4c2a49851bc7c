namespace GlobalFit.Physics.Series;

/// <summary>The three noise-orthogonal TDI channels A, E, T on one common time axis.</summary>
/// <remarks>A/E/T as in <see cref="TdiCombination"/>: <c>A = (Z − X)/√2</c>,
/// <c>E = (X − 2Y + Z)/√6</c>, <c>T = (X + Y + Z)/√3</c>. Values are fractional-frequency deviations.</remarks>
public sealed class AetTimeSeries
{
    /// <summary>Groups three channels that must share start time, cadence and length.</summary>
    /// <exception cref="ArgumentException">The channels' time axes differ.</exception>
    public AetTimeSeries(TimeSeries a, TimeSeries e, TimeSeries t)
    {
        foreach (var (name, s) in new[] { ("E", e), ("T", t) })
        {
            if (s.Count != a.Count)
                throw new ArgumentException($"channel {name} has {s.Count} samples, A has {a.Count}");
            if (s.DtSeconds != a.DtSeconds || s.T0Seconds != a.T0Seconds)
                throw new ArgumentException($"channel {name} time axis (t0 {s.T0Seconds}, dt {s.DtSeconds}) differs from A (t0 {a.T0Seconds}, dt {a.DtSeconds})");
        }
        A = a;
        E = e;
        T = t;
    }

    /// <summary>Channel A.</summary>
    public TimeSeries A { get; }

    /// <summary>Channel E.</summary>
    public TimeSeries E { get; }

    /// <summary>Channel T (insensitive to gravitational waves at low frequency).</summary>
    public TimeSeries T { get; }

    /// <summary>Samples per channel.</summary>
    public int Count => A.Count;

    /// <summary>Common cadence.</summary>
    /// <value>s.</value>
    public double DtSeconds => A.DtSeconds;

    /// <summary>Common start time.</summary>
    /// <value>s.</value>
    public double T0Seconds => A.T0Seconds;

    /// <summary>The channels in the order A, E, T.</summary>
    public IReadOnlyList<TimeSeries> Channels => [A, E, T];

    /// <summary>Builds A, E, T from Michelson X, Y, Z sample by sample.</summary>
    public static AetTimeSeries FromMichelson(TimeSeries x, TimeSeries y, TimeSeries z)
    {
        var check = new AetTimeSeries(x, y, z);
        int n = check.Count;
        var a = new double[n];
        var e = new double[n];
        var t = new double[n];
        for (int i = 0; i < n; i++)
            (a[i], e[i], t[i]) = TdiCombination.AetFromXyz(x.Samples[i], y.Samples[i], z.Samples[i]);
        return new AetTimeSeries(new TimeSeries(x.T0Seconds, x.DtSeconds, a), new TimeSeries(x.T0Seconds, x.DtSeconds, e), new TimeSeries(x.T0Seconds, x.DtSeconds, t));
    }
}
