using System.Collections;

namespace GlobalFit.Physics.DataFiles;

/// <summary>The gaps of one observation: finite, non-empty, sorted by start and non-overlapping.</summary>
/// <remarks>Immutable and safe to share between threads. Gaps may touch (one ends where the next starts).
/// Whether the gaps lie inside a record is checked against that record with <see cref="CheckWithin"/>.</remarks>
public sealed class GapList : IReadOnlyList<Gap>
{
    private readonly Gap[] _gaps;

    /// <summary>Validates and copies <paramref name="gaps"/>.</summary>
    /// <exception cref="ArgumentException">A gap is not finite, not positive in length, out of order or overlaps its predecessor; the message names the gap index.</exception>
    public GapList(IEnumerable<Gap> gaps)
    {
        ArgumentNullException.ThrowIfNull(gaps);
        _gaps = gaps.ToArray();
        for (int i = 0; i < _gaps.Length; i++)
        {
            var g = _gaps[i];
            if (!double.IsFinite(g.StartSeconds) || !double.IsFinite(g.EndSeconds))
                throw new ArgumentException($"gap {i} [{g.StartSeconds}, {g.EndSeconds}) has a non-finite end point");
            if (!(g.StartSeconds < g.EndSeconds))
                throw new ArgumentException($"gap {i} [{g.StartSeconds}, {g.EndSeconds}) does not start before it ends");
            if (i > 0 && g.StartSeconds < _gaps[i - 1].EndSeconds)
                throw new ArgumentException(g.StartSeconds < _gaps[i - 1].StartSeconds
                    ? $"gap {i} [{g.StartSeconds}, {g.EndSeconds}) starts before gap {i - 1} [{_gaps[i - 1].StartSeconds}, {_gaps[i - 1].EndSeconds}): gaps must be sorted by start"
                    : $"gap {i} [{g.StartSeconds}, {g.EndSeconds}) overlaps gap {i - 1} [{_gaps[i - 1].StartSeconds}, {_gaps[i - 1].EndSeconds})");
        }
    }

    /// <summary>No gaps.</summary>
    public static GapList None { get; } = new([]);

    /// <summary>Number of gaps.</summary>
    public int Count => _gaps.Length;

    /// <summary>Gap <paramref name="index"/>, in order of start time.</summary>
    public Gap this[int index] => _gaps[index];

    /// <summary>Summed length of all gaps.</summary>
    /// <value>s.</value>
    public double TotalSeconds => _gaps.Sum(g => g.DurationSeconds);

    /// <summary>Checks that every gap lies inside the record <c>[t0Seconds, endSeconds]</c>.</summary>
    /// <param name="t0Seconds">Time of the first sample, s.</param>
    /// <param name="endSeconds">End of the record, <c>t0 + N Δt</c>, s.</param>
    /// <exception cref="ArgumentException">A gap sticks out of the record; the message names the first such gap.</exception>
    public void CheckWithin(double t0Seconds, double endSeconds)
    {
        for (int i = 0; i < _gaps.Length; i++)
        {
            var g = _gaps[i];
            if (g.StartSeconds < t0Seconds || g.EndSeconds > endSeconds)
                throw new ArgumentException($"gap {i} [{g.StartSeconds}, {g.EndSeconds}) is not inside the record [{t0Seconds}, {endSeconds})");
        }
    }

    /// <summary>Marks each sample of a uniform time axis as observed (true) or inside a gap (false).</summary>
    /// <param name="t0Seconds">Time of sample 0, s.</param>
    /// <param name="dtSeconds">Cadence, s.</param>
    /// <param name="observed">One flag per sample, written by this method.</param>
    /// <remarks>Sample <c>n</c> is at <c>t0 + n Δt</c>, computed as <see cref="Series.TimeSeries.TimeOf"/> does,
    /// so the mask agrees exactly with the times a series reports.</remarks>
    public void FillObservedMask(double t0Seconds, double dtSeconds, Span<bool> observed)
    {
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentException($"cadence must be positive and finite, got {dtSeconds}", nameof(dtSeconds));
        observed.Fill(true);
        foreach (var g in _gaps)
        {
            int first = FirstSampleAtOrAfter(g.StartSeconds, t0Seconds, dtSeconds, observed.Length);
            int end = FirstSampleAtOrAfter(g.EndSeconds, t0Seconds, dtSeconds, observed.Length);
            observed[first..end].Fill(false);
        }
    }

    /// <summary>As <see cref="FillObservedMask"/>, into a new array of <paramref name="sampleCount"/> flags.</summary>
    public bool[] ObservedMask(double t0Seconds, double dtSeconds, int sampleCount)
    {
        var observed = new bool[sampleCount];
        FillObservedMask(t0Seconds, dtSeconds, observed);
        return observed;
    }

    /// <inheritdoc />
    public IEnumerator<Gap> GetEnumerator() => ((IEnumerable<Gap>)_gaps).GetEnumerator();

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();

    // Smallest n in [0, count] with t0 + n dt >= time. The division gives the answer to within one
    // sample; the two loops settle rounding with the same expression TimeSeries.TimeOf uses.
    private static int FirstSampleAtOrAfter(double time, double t0, double dt, int count)
    {
        double estimate = Math.Ceiling((time - t0) / dt);
        int n = estimate <= 0 ? 0 : estimate >= count ? count : (int)estimate;
        while (n > 0 && t0 + (n - 1) * dt >= time) n--;
        while (n < count && t0 + n * dt < time) n++;
        return n;
    }
}
