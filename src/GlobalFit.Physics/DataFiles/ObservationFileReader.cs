using System.Globalization;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Series;
using L = GlobalFit.Physics.DataFiles.ObservationFileLayout;
using PureHDF;
using PureHDF.VOL.Native;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Reads and checks the parts of an observation file (LAYOUT.md), one part per method, so that a full
/// read and a summary share every check.</summary>
/// <remarks>Call <see cref="ReadFormatVersion"/> first: it is what tells an observation file from any other HDF5 file.</remarks>
internal sealed class ObservationFileReader : IDisposable
{
    private const string Root = "/";
    private const string TdiPath = "/" + L.TdiGroup;

    private readonly NativeFile _file;
    private readonly H5Input _input;

    private ObservationFileReader(NativeFile file, H5Input input)
    {
        _file = file;
        _input = input;
    }

    /// <summary>The channel datasets and their time axis; <see cref="Data"/> is null when the samples were not loaded.</summary>
    public sealed record TdiContents(string StoredChannels, double T0Seconds, double DtSeconds, int SampleCount, AetTimeSeries? Data)
    {
        public double EndSeconds => T0Seconds + SampleCount * DtSeconds;
    }

    public static ObservationFileReader Open(string path)
    {
        var input = new H5Input(path);
        if (Directory.Exists(path))
            throw input.Error(null, "is a folder, not an observation file");
        if (!File.Exists(path))
            throw input.Error(null, "file not found");
        CheckSignatureAndLength(path, input);
        NativeFile file;
        try
        {
            file = H5File.OpenRead(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw input.Error(null, $"cannot be opened ({e.Message})", e);
        }
        catch (Exception e)
        {
            // What passed the signature, length and memory checks but PureHDF cannot parse (a damaged superblock or
            // root object header, or a size field beyond any allocation) arrives here as a plain Exception.
            throw input.Error(null, $"is not a readable HDF5 file, or is truncated ({e.Message})", e);
        }
        return new ObservationFileReader(file, input);
    }

    public void Dispose() => _file.Dispose();

    private static void CheckSignatureAndLength(string path, H5Input input)
    {
        Hdf5Superblock.Facts facts;
        long length;
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
            length = stream.Length;
            facts = Hdf5Superblock.Inspect(stream);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw input.Error(null, $"cannot be opened ({e.Message})", e);
        }
        if (!facts.HasSignature)
            throw input.Error(null, length == 0 ? "is empty, not an HDF5 file" : "is not an HDF5 file (no HDF5 signature at its start)");
        if (facts.RecordedLengthBytes > length)
            throw input.Error(null, $"is truncated: it has {length} bytes but its HDF5 superblock records {facts.RecordedLengthBytes}");
        // Reading holds the samples (about the file's size) and the A/E/T conversion of X/Y/Z channels (as much again);
        // four times the length leaves room for the library's buffers. Checked before anything is allocated.
        long available = GC.GetGCMemoryInfo().TotalAvailableMemoryBytes;
        if (length > available / 4)
            throw input.Error(null, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"holds {length / (double)(1 << 30):F1} GiB; reading it needs about {4.0 * length / (1 << 30):F1} GiB, more than the {available / (double)(1 << 30):F1} GiB available"));
    }

    /// <summary>Reads the root <c>format_version</c> and rejects files that are not observation files or are too new.</summary>
    public int ReadFormatVersion()
    {
        if (!_input.HasAttribute(_file, Root, L.FormatVersionAttribute))
            throw _input.Error(H5Input.AttributePath(Root, L.FormatVersionAttribute),
                "missing: this HDF5 file is not a globalfit observation file (layout in src/GlobalFit.Physics/DataFiles/LAYOUT.md)");
        long version = _input.ReadInteger(_file, Root, L.FormatVersionAttribute);
        if (version == 1)
            throw _input.Error(H5Input.AttributePath(Root, L.FormatVersionAttribute),
                $"format version 1 was written by an earlier globalfit whose truth columns and class ids have since been renamed "
                + $"(amp is now amplitude); simulate the data again, or set format_version = {ObservationFile.CurrentFormatVersion} "
                + "after renaming the truth columns as in src/GlobalFit.Physics/DataFiles/LAYOUT.md");
        if (version != ObservationFile.CurrentFormatVersion)
            throw _input.Error(H5Input.AttributePath(Root, L.FormatVersionAttribute),
                $"format version {version} is not supported; this build reads version {ObservationFile.CurrentFormatVersion}");
        return (int)version;
    }

    public ObservationProvenance ReadProvenance()
    {
        string generator = _input.ReadString(_file, Root, L.GeneratorAttribute);
        string createdPath = H5Input.AttributePath(Root, L.CreatedUtcAttribute);
        string createdText = _input.ReadString(_file, Root, L.CreatedUtcAttribute);
        if (!DateTimeOffset.TryParse(createdText, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out var created))
            throw _input.Error(createdPath, $"'{createdText}' is not an ISO 8601 time such as 2026-12-01T22:05:00Z");

        var entries = new List<KeyValuePair<string, string>>();
        string groupPath = H5Input.ChildPath(Root, L.ProvenanceGroup);
        var group = _input.OptionalGroup(_file, Root, L.ProvenanceGroup);
        if (group is not null)
            foreach (var attribute in _input.Guard(groupPath, () => group.Attributes().ToArray()))
                entries.Add(new(attribute.Name, _input.ReadString(attribute, H5Input.AttributePath(groupPath, attribute.Name))));

        try
        {
            return new ObservationProvenance(generator, created, entries);
        }
        catch (ArgumentException e)
        {
            throw _input.Error(string.IsNullOrWhiteSpace(generator) ? H5Input.AttributePath(Root, L.GeneratorAttribute) : groupPath, e.Message, e);
        }
    }

    /// <summary>Reads the channel layout and the time axis, and the samples when <paramref name="loadSamples"/> is set.</summary>
    public TdiContents ReadTdi(bool loadSamples)
    {
        var tdi = _input.RequiredGroup(_file, Root, L.TdiGroup, "missing: the file holds no TDI channels");

        string channels = _input.ReadString(tdi, TdiPath, L.ChannelsAttribute);
        if (channels is not (L.AetChannels or L.XyzChannels))
            throw _input.Error(H5Input.AttributePath(TdiPath, L.ChannelsAttribute), $"is '{channels}'; expected '{L.AetChannels}' or '{L.XyzChannels}'");
        string units = _input.ReadString(tdi, TdiPath, L.UnitsAttribute);
        if (units != L.FractionalFrequency)
            throw _input.Error(H5Input.AttributePath(TdiPath, L.UnitsAttribute), $"is '{units}'; expected '{L.FractionalFrequency}'");

        var names = channels.Select(c => c.ToString()).ToArray();
        var datasets = new IH5Dataset[names.Length];
        int count = 0;
        for (int i = 0; i < names.Length; i++)
        {
            string path = H5Input.ChildPath(TdiPath, names[i]);
            datasets[i] = _input.RequiredDataset(tdi, TdiPath, names[i]);
            int length = _input.Count(_input.Float64Shape(datasets[i], path, rank: 1)[0], path);
            if (length == 0)
                throw _input.Error(path, "is empty");
            if (i == 0)
                count = length;
            else if (length != count)
                throw _input.Error(path, $"has {length} samples but {H5Input.ChildPath(TdiPath, names[0])} has {count}; channels must have equal lengths");
        }

        var (t0, dt) = ReadTimeAxis(tdi, count);
        if (!loadSamples)
            return new TdiContents(channels, t0, dt, count, null);

        var series = new TimeSeries[names.Length];
        for (int i = 0; i < names.Length; i++)
        {
            string path = H5Input.ChildPath(TdiPath, names[i]);
            var samples = _input.ReadDoubles(datasets[i], path);
            if (samples.Length != count)
                throw _input.Error(path, $"returned {samples.Length} samples where its shape says {count}");
            series[i] = new TimeSeries(t0, dt, samples);
            int bad = series[i].IndexOfFirstNonFinite();
            if (bad >= 0)
                throw _input.Error($"{path} sample {bad}", $"is {samples[bad]}; samples must be finite (first bad sample of channel {names[i]})");
        }
        var data = channels == L.AetChannels
            ? new AetTimeSeries(series[0], series[1], series[2])
            : AetTimeSeries.FromMichelson(series[0], series[1], series[2]);
        return new TdiContents(channels, t0, dt, count, data);
    }

    private (double T0Seconds, double DtSeconds) ReadTimeAxis(IH5Group tdi, int count)
    {
        string t0Path = H5Input.AttributePath(TdiPath, L.T0Attribute);
        string dtPath = H5Input.AttributePath(TdiPath, L.DtAttribute);
        bool hasT0 = _input.HasAttribute(tdi, TdiPath, L.T0Attribute);
        bool hasDt = _input.HasAttribute(tdi, TdiPath, L.DtAttribute);
        var stampsDataset = _input.OptionalDataset(tdi, TdiPath, L.TimeStampsDataset);

        if (stampsDataset is null)
        {
            const string Alternative = $"missing (give {L.T0Attribute} and {L.DtAttribute} attributes, or a {L.TimeStampsDataset} dataset, in /{L.TdiGroup})";
            if (!hasT0) throw _input.Error(t0Path, Alternative);
            if (!hasDt) throw _input.Error(dtPath, Alternative);
            double t0 = _input.ReadNumber(tdi, TdiPath, L.T0Attribute);
            double dt = _input.ReadNumber(tdi, TdiPath, L.DtAttribute);
            if (!double.IsFinite(t0))
                throw _input.Error(t0Path, $"is {t0}; the start time must be finite");
            if (!(dt > 0) || !double.IsFinite(dt))
                throw _input.Error(dtPath, $"is {dt}; the cadence must be a positive finite number of seconds");
            return (t0, dt);
        }

        string stampsPath = H5Input.ChildPath(TdiPath, L.TimeStampsDataset);
        int stampCount = _input.Count(_input.Float64Shape(stampsDataset, stampsPath, rank: 1)[0], stampsPath);
        if (stampCount != count)
            throw _input.Error(stampsPath, $"has {stampCount} time stamps for {count} samples per channel");
        var (fittedT0, fittedDt) = TimeStampAxis.Fit(_input.ReadDoubles(stampsDataset, stampsPath), _input.Source, stampsPath);

        // Attributes given alongside the stamps must tell the same story.
        double tolerance = TimeStampAxis.Tolerance(fittedDt, Math.Abs(fittedT0) + count * fittedDt);
        if (hasT0)
        {
            double t0 = _input.ReadNumber(tdi, TdiPath, L.T0Attribute);
            if (!(Math.Abs(t0 - fittedT0) <= tolerance))
                throw _input.Error(t0Path, $"is {t0} s but {stampsPath} starts at {fittedT0} s");
        }
        if (hasDt)
        {
            double dt = _input.ReadNumber(tdi, TdiPath, L.DtAttribute);
            if (!(Math.Abs(dt - fittedDt) <= TimeStampAxis.RelativeTolerance * fittedDt))
                throw _input.Error(dtPath, $"is {dt} s but the spacing of {stampsPath} is {fittedDt} s");
        }
        return (fittedT0, fittedDt);
    }

    /// <summary>Reads <c>/gaps</c> (absent means no gaps) and checks it against the record.</summary>
    public GapList ReadGaps(TdiContents tdi)
    {
        string path = H5Input.ChildPath(Root, L.GapsDataset);
        var dataset = _input.OptionalDataset(_file, Root, L.GapsDataset);
        if (dataset is null)
            return GapList.None;
        var shape = _input.Float64Shape(dataset, path, rank: 2);
        if (shape[1] != 2)
            throw _input.Error(path, $"has {shape[1]} columns; expected 2 ([start_s, end_s) per gap)");
        int rows = _input.Count(shape[0], path);
        var pairs = _input.ReadDoubles(dataset, path);
        if (pairs.Length != 2 * rows)
            throw _input.Error(path, $"returned {pairs.Length} values where its shape says {2 * rows}");
        var gaps = new Gap[rows];
        for (int i = 0; i < rows; i++)
            gaps[i] = new Gap(pairs[2 * i], pairs[2 * i + 1]);
        try
        {
            var list = new GapList(gaps);
            list.CheckWithin(tdi.T0Seconds, tdi.EndSeconds);
            return list;
        }
        catch (ArgumentException e)
        {
            throw _input.Error(path, e.Message, e);
        }
    }

    /// <summary>Reads every table under <c>/truth</c> (absent means none), sorted by class id.</summary>
    public List<TruthTable> ReadTruth()
    {
        var tables = new List<TruthTable>();
        foreach (var (classId, group, path) in TruthGroups())
        {
            var (values, rows, columns) = TruthValues(group, path);
            var ids = TruthIds(group, path, rows);
            var data = _input.ReadDoubles(values, H5Input.ChildPath(path, L.TruthValuesDataset));
            try
            {
                tables.Add(new TruthTable(classId, columns, ids, data));
            }
            catch (ArgumentException e)
            {
                throw _input.Error(path, e.Message, e);
            }
        }
        return tables;
    }

    /// <summary>Number of rows of every table under <c>/truth</c>, without reading the values.</summary>
    public SortedDictionary<string, int> ReadTruthRowCounts()
    {
        var counts = new SortedDictionary<string, int>(StringComparer.Ordinal);
        foreach (var (classId, group, path) in TruthGroups())
            counts[classId] = TruthValues(group, path).Rows;
        return counts;
    }

    private List<(string ClassId, IH5Group Group, string Path)> TruthGroups()
    {
        string truthPath = H5Input.ChildPath(Root, L.TruthGroup);
        var truth = _input.OptionalGroup(_file, Root, L.TruthGroup);
        if (truth is null)
            return [];
        var groups = new List<(string, IH5Group, string)>();
        foreach (var child in _input.Guard(truthPath, () => truth.Children().ToArray()).OrderBy(c => c.Name, StringComparer.Ordinal))
        {
            string path = H5Input.ChildPath(truthPath, child.Name);
            if (child is not IH5Group group)
                throw _input.Error(path, "is not a group; each source class has a group holding 'values' and 'ids'");
            if (!SnakeCaseName.IsValid(child.Name))
                throw _input.Error(path, $"'{child.Name}' is not a snake_case class id such as class_id");
            groups.Add((child.Name, group, path));
        }
        return groups;
    }

    private (IH5Dataset Values, int Rows, string[] Columns) TruthValues(IH5Group group, string groupPath)
    {
        string path = H5Input.ChildPath(groupPath, L.TruthValuesDataset);
        var values = _input.RequiredDataset(group, groupPath, L.TruthValuesDataset);
        var shape = _input.Float64Shape(values, path, rank: 2);
        var columns = _input.ReadStrings(values, path, L.TruthColumnsAttribute);
        if ((ulong)columns.Length != shape[1])
            throw _input.Error(H5Input.AttributePath(path, L.TruthColumnsAttribute), $"names {columns.Length} columns but the table has {shape[1]}");
        return (values, _input.Count(shape[0], path), columns);
    }

    private string[] TruthIds(IH5Group group, string groupPath, int rows)
    {
        string path = H5Input.ChildPath(groupPath, L.TruthIdsDataset);
        var dataset = _input.RequiredDataset(group, groupPath, L.TruthIdsDataset);
        ulong length = _input.StringListLength(dataset, path);
        if (length != (ulong)rows)
            throw _input.Error(path, $"holds {length} ids but {H5Input.ChildPath(groupPath, L.TruthValuesDataset)} has {rows} rows");
        return rows == 0 ? [] : _input.ReadStrings(dataset, path);
    }
}
