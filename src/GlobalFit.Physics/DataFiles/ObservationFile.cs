using GlobalFit.Physics.Files;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Reads and writes observation files: our own versioned HDF5 layout for A/E/T data, gaps,
/// injected sources and provenance (DataFiles/LAYOUT.md).</summary>
/// <remarks>Every problem with a file a user gave us is an <see cref="InvalidInputException"/> naming the file and
/// the group, dataset, attribute or sample at fault. Methods are thread-safe: they share no state.</remarks>
public static class ObservationFile
{
    /// <summary>The layout version this build writes, and the only one it reads.</summary>
    public const int CurrentFormatVersion = 2;

    /// <summary>Writes <paramref name="observation"/> to <paramref name="path"/> in the current layout version.</summary>
    /// <param name="observation">What to write.</param>
    /// <param name="path">Destination file, conventionally with the extension <c>.h5</c>.</param>
    /// <param name="overwrite">Replace an existing file; otherwise an existing path is refused.</param>
    /// <remarks>The file is written to a temporary file in the same folder, flushed to disk, then renamed over the
    /// destination, so a failed write leaves neither a half-written file nor a damaged old one.</remarks>
    /// <exception cref="InvalidInputException">The path exists and <paramref name="overwrite"/> is false, or the destination cannot be written.</exception>
    public static void Write(Observation observation, string path, bool overwrite)
    {
        ArgumentNullException.ThrowIfNull(observation);
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        var tree = ObservationFileWriter.BuildTree(observation);
        AtomicFile.Write(path, overwrite, stream => tree.Write(stream));
    }

    /// <summary>Reads and checks a whole observation file; X/Y/Z channels are converted to A/E/T.</summary>
    /// <exception cref="InvalidInputException">The file is missing, is not HDF5 or is truncated, is not an observation
    /// file of a supported version, or breaks the layout (missing time axis, bad cadence, non-finite or mismatched
    /// samples, bad gaps or truth tables).</exception>
    public static Observation Read(string path)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        using var reader = ObservationFileReader.Open(path);
        int version = reader.ReadFormatVersion();
        var provenance = reader.ReadProvenance();
        var tdi = reader.ReadTdi(loadSamples: true);
        var gaps = reader.ReadGaps(tdi);
        var truth = reader.ReadTruth();
        return new Observation(tdi.Data!, gaps, truth, provenance, version);
    }

    /// <summary>Reads what a file holds without loading the samples or truth values: cheap even for a year of data.</summary>
    /// <remarks>The structure is checked as by <see cref="Read"/>; sample values are not, so a file that summarises
    /// cleanly can still fail a full read on a non-finite sample. A file with an explicit <c>time_s</c> dataset has
    /// its time stamps read to derive the cadence.</remarks>
    /// <exception cref="InvalidInputException">As for <see cref="Read"/>, except for problems in sample or truth values.</exception>
    public static ObservationSummary ReadSummary(string path)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        using var reader = ObservationFileReader.Open(path);
        int version = reader.ReadFormatVersion();
        var provenance = reader.ReadProvenance();
        var tdi = reader.ReadTdi(loadSamples: false);
        var gaps = reader.ReadGaps(tdi);
        return new ObservationSummary
        {
            FormatVersion = version,
            Provenance = provenance,
            StoredChannels = tdi.StoredChannels,
            SampleCount = tdi.SampleCount,
            T0Seconds = tdi.T0Seconds,
            DtSeconds = tdi.DtSeconds,
            Gaps = gaps,
            TruthRowCounts = reader.ReadTruthRowCounts(),
        };
    }
}
