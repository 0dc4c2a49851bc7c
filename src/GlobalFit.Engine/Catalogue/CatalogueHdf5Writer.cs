using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Files;
using L = GlobalFit.Engine.Catalogue.CatalogueHdf5Layout;
using PureHDF;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Writes catalogue records with their posterior samples to an HDF5 file in our layout (Catalogue/LAYOUT.md):
/// <c>/catalogue/&lt;class id&gt;/sources</c>, summaries and <c>samples</c>.</summary>
public static class CatalogueHdf5Writer
{
    /// <summary>Writes <paramref name="records"/> to <paramref name="path"/>, atomically.</summary>
    /// <param name="path">Destination.</param>
    /// <param name="records">The sources; rows of a class keep this order.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="InvalidInputException">The file exists and <paramref name="overwrite"/> is false, or cannot be written.</exception>
    /// <exception cref="ArgumentException">A record is inconsistent, or the records of one class differ in parameters.</exception>
    public static void Write(string path, IReadOnlyList<CatalogueRecord> records, bool overwrite)
    {
        CatalogueRecordChecks.Require(records);
        var file = new H5File { Attributes = { [L.FormatVersionAttribute] = L.FormatVersion } };
        var catalogue = new H5Group();
        foreach (var group in records.GroupBy(r => r.ClassId, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal))
            catalogue[group.Key] = ClassGroup([.. group]);
        file[L.CatalogueGroup] = catalogue;
        AtomicFile.Write(path, overwrite, stream => file.Write(stream, L.WriteOptions));
    }

    private static H5Group ClassGroup(IReadOnlyList<CatalogueRecord> records)
    {
        string[] columns = [.. records[0].ParameterNames];
        int width = columns.Length;
        long sampleRows = records.Sum(r => (long)r.SampleCount);
        var sources = new CatalogueSourceRow[records.Count];
        var median = new double[checked(records.Count * width)];
        var lower = new double[median.Length];
        var upper = new double[median.Length];
        var samples = new double[checked(sampleRows * width)];
        var sampleEntry = new long[sampleRows];
        long row = 0;
        for (int e = 0; e < records.Count; e++)
        {
            var r = records[e];
            sources[e] = new CatalogueSourceRow { Id = r.Id, Confidence = r.Confidence, Snr = r.Snr, FirstSample = row, SampleCount = r.SampleCount };
            r.Median.CopyTo(median, e * width);
            r.Lower.CopyTo(lower, e * width);
            r.Upper.CopyTo(upper, e * width);
            r.Samples.CopyTo(samples, checked((int)(row * width)));
            sampleEntry.AsSpan(checked((int)row), r.SampleCount).Fill(e);
            row += r.SampleCount;
        }
        var group = new H5Group
        {
            Attributes = { [L.ColumnsAttribute] = columns },
            [L.SourcesDataset] = sources,
            [L.MedianDataset] = Table(median, records.Count, columns),
            [L.LowerDataset] = Table(lower, records.Count, columns),
            [L.UpperDataset] = Table(upper, records.Count, columns),
            [L.SamplesDataset] = Table(samples, sampleRows, columns),
            [L.SampleSourceDataset] = sampleEntry,
        };
        // Convergence tables only for a class whose sources report it (NaN rows for any that do not).
        var modes = records.Select(r => r.Convergence).FirstOrDefault(c => c is not null)?.ModeNames;
        if (modes is { } names)
        {
            var rhat = new double[median.Length];
            var ess = new double[median.Length];
            var fractions = new double[checked(records.Count * names.Length)];
            for (int e = 0; e < records.Count; e++)
            {
                var c = records[e].Convergence;
                if (c is null)
                {
                    rhat.AsSpan(e * width, width).Fill(double.NaN);
                    ess.AsSpan(e * width, width).Fill(double.NaN);
                    fractions.AsSpan(e * names.Length, names.Length).Fill(double.NaN);
                    continue;
                }
                c.SplitRhat.CopyTo(rhat, e * width);
                c.EffectiveSampleSize.CopyTo(ess, e * width);
                c.ModeFractions.CopyTo(fractions, e * names.Length);
            }
            group[L.SplitRhatDataset] = Table(rhat, records.Count, columns);
            group[L.EssDataset] = Table(ess, records.Count, columns);
            var modeTable = new H5Dataset(fractions, fileDims: [(ulong)records.Count, (ulong)names.Length]);
            modeTable.Attributes[L.ModesAttribute] = names.ToArray();
            group[L.SkyModeDataset] = modeTable;
        }
        return group;
    }

    private static H5Dataset Table(double[] values, long rows, string[] columns)
    {
        var dataset = new H5Dataset(values, fileDims: [(ulong)rows, (ulong)columns.Length]);
        dataset.Attributes[L.ColumnsAttribute] = columns;
        return dataset;
    }
}
