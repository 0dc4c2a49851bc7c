using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.DataFiles;

/// <summary>One observation as stored in an observation file: the A/E/T time series, its gaps,
/// the injected sources (when the data were simulated) and where it came from.</summary>
/// <remarks>Immutable once built (the sample arrays belong to it) and safe to share between threads.
/// The file layout is described in DataFiles/LAYOUT.md; <see cref="ObservationFile"/> reads and writes it.</remarks>
public sealed class Observation
{
    /// <summary>Groups and checks the parts of an observation.</summary>
    /// <param name="data">A, E, T samples in fractional frequency; every sample finite.</param>
    /// <param name="gaps">Gaps, each inside the record <c>[t0, t0 + N Δt)</c>; <see cref="GapList.None"/> when there are none.</param>
    /// <param name="truth">Injected sources, at most one table per class id.</param>
    /// <param name="provenance">Writer, creation time and free-form notes.</param>
    /// <exception cref="ArgumentException">The series is empty or holds a non-finite sample, a gap lies outside the record, or two truth tables share a class id.</exception>
    public Observation(AetTimeSeries data, GapList gaps, IEnumerable<TruthTable> truth, ObservationProvenance provenance)
        : this(data, gaps, truth, provenance, ObservationFile.CurrentFormatVersion)
    {
    }

    internal Observation(AetTimeSeries data, GapList gaps, IEnumerable<TruthTable> truth, ObservationProvenance provenance, int formatVersion)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(gaps);
        ArgumentNullException.ThrowIfNull(truth);
        ArgumentNullException.ThrowIfNull(provenance);
        if (data.Count == 0)
            throw new ArgumentException("the time series has no samples");
        foreach (var (name, channel) in new[] { ("A", data.A), ("E", data.E), ("T", data.T) })
        {
            int bad = channel.IndexOfFirstNonFinite();
            if (bad >= 0)
                throw new ArgumentException($"channel {name} sample {bad} is {channel.Samples[bad]}; samples must be finite");
        }
        gaps.CheckWithin(data.T0Seconds, data.A.TimeOf(data.Count));
        var tables = truth.OrderBy(t => t.ClassId, StringComparer.Ordinal).ToArray();
        for (int i = 1; i < tables.Length; i++)
            if (tables[i].ClassId == tables[i - 1].ClassId)
                throw new ArgumentException($"two truth tables for class {tables[i].ClassId}");
        Data = data;
        Gaps = gaps;
        Truth = tables;
        Provenance = provenance;
        FormatVersion = formatVersion;
    }

    /// <summary>The A, E, T channels on their common time axis.</summary>
    public AetTimeSeries Data { get; }

    /// <summary>Intervals without usable data.</summary>
    public GapList Gaps { get; }

    /// <summary>Injected sources, one table per class, sorted by class id.</summary>
    public IReadOnlyList<TruthTable> Truth { get; }

    /// <summary>Writer, creation time and free-form notes.</summary>
    public ObservationProvenance Provenance { get; }

    /// <summary>Layout version of the file this observation was read from; <see cref="ObservationFile.CurrentFormatVersion"/>
    /// for one built in memory (files are always written in the current version).</summary>
    public int FormatVersion { get; }

    /// <summary>The truth table of class <paramref name="classId"/>, or null when none was stored.</summary>
    public TruthTable? FindTruth(string classId) => Truth.FirstOrDefault(t => t.ClassId == classId);
}
