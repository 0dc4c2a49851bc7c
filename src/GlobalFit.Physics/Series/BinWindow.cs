namespace GlobalFit.Physics.Series;

/// <summary>A contiguous run of frequency bins, <c>[First, First + Count)</c>.</summary>
/// <param name="First">Index of the first bin.</param>
/// <param name="Count">Number of bins; zero for an empty window.</param>
public readonly record struct BinWindow(int First, int Count)
{
    /// <summary>One past the last bin.</summary>
    public int End => First + Count;

    /// <summary>True when <paramref name="bin"/> lies inside the window.</summary>
    public bool Contains(int bin) => bin >= First && bin < End;

    /// <summary>The bins this window shares with <paramref name="other"/> (empty when disjoint).</summary>
    public BinWindow Intersect(BinWindow other)
    {
        int first = Math.Max(First, other.First);
        int end = Math.Min(End, other.End);
        return end > first ? new BinWindow(first, end - first) : new BinWindow(first, 0);
    }

    /// <summary>Creates a window, rejecting negative positions or sizes.</summary>
    public static BinWindow Create(int first, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(first);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        return new BinWindow(first, count);
    }
}
