namespace GlobalFit.Physics.DataFiles;

/// <summary>What an observation file holds, read without loading the samples or the truth values.</summary>
/// <remarks>Produced by <see cref="ObservationFile.ReadSummary"/>; the structure is checked as by a full read,
/// the sample values are not.</remarks>
public sealed class ObservationSummary
{
    /// <summary>Layout version of the file.</summary>
    public required int FormatVersion { get; init; }

    /// <summary>Writer, creation time and free-form notes.</summary>
    public required ObservationProvenance Provenance { get; init; }

    /// <summary>The channels as stored: <c>AET</c>, or <c>XYZ</c> when a full read converts them to A, E, T.</summary>
    public required string StoredChannels { get; init; }

    /// <summary>Samples per channel.</summary>
    public required int SampleCount { get; init; }

    /// <summary>Time of the first sample.</summary>
    /// <value>s.</value>
    public required double T0Seconds { get; init; }

    /// <summary>Cadence.</summary>
    /// <value>s.</value>
    public required double DtSeconds { get; init; }

    /// <summary>Gaps of the record.</summary>
    public required GapList Gaps { get; init; }

    /// <summary>Number of injected sources per class id, sorted by class id.</summary>
    public required IReadOnlyDictionary<string, int> TruthRowCounts { get; init; }

    /// <summary>Length of the record, <c>N Δt</c>.</summary>
    /// <value>s.</value>
    public double DurationSeconds => SampleCount * DtSeconds;
}
