using System.Globalization;
using PureHDF;
using L = GlobalFit.Physics.DataFiles.ObservationFileLayout;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Builds the HDF5 tree of an observation file (LAYOUT.md) from an <see cref="Observation"/>.</summary>
/// <remarks>Sample arrays are handed to PureHDF as they are, without copies: a year at 5 s cadence is
/// 3 × 6.3 M doubles (150 MB).</remarks>
internal static class ObservationFileWriter
{
    public static H5File BuildTree(Observation observation)
    {
        var data = observation.Data;
        var provenance = observation.Provenance;

        var file = new H5File();
        file.Attributes[L.FormatVersionAttribute] = ObservationFile.CurrentFormatVersion;
        file.Attributes[L.CreatedUtcAttribute] = provenance.CreatedUtc.UtcDateTime.ToString("O", CultureInfo.InvariantCulture);
        file.Attributes[L.GeneratorAttribute] = provenance.Generator;

        var provenanceGroup = new H5Group();
        foreach (var (key, value) in provenance.Entries)
            provenanceGroup.Attributes[key] = value;
        file[L.ProvenanceGroup] = provenanceGroup;

        file[L.TdiGroup] = new H5Group
        {
            ["A"] = data.A.Samples,
            ["E"] = data.E.Samples,
            ["T"] = data.T.Samples,
            Attributes =
            {
                [L.T0Attribute] = data.T0Seconds,
                [L.DtAttribute] = data.DtSeconds,
                [L.UnitsAttribute] = L.FractionalFrequency,
                [L.ChannelsAttribute] = L.AetChannels,
            },
        };

        if (observation.Gaps.Count > 0)
            file[L.GapsDataset] = GapsDataset(observation.Gaps);

        var truthGroup = new H5Group();
        foreach (var table in observation.Truth)
            truthGroup[table.ClassId] = TruthGroup(table);
        file[L.TruthGroup] = truthGroup;
        return file;
    }

    private static H5Dataset GapsDataset(GapList gaps)
    {
        var pairs = new double[checked(2 * gaps.Count)];
        for (int i = 0; i < gaps.Count; i++)
        {
            pairs[2 * i] = gaps[i].StartSeconds;
            pairs[2 * i + 1] = gaps[i].EndSeconds;
        }
        var dataset = new H5Dataset(pairs, fileDims: [(ulong)gaps.Count, 2]);
        dataset.Attributes[L.GapColumnsAttribute] = L.GapColumns;
        return dataset;
    }

    private static H5Group TruthGroup(TruthTable table)
    {
        var values = new H5Dataset(table.ValueArray, fileDims: [(ulong)table.RowCount, (ulong)table.ColumnCount]);
        values.Attributes[L.TruthColumnsAttribute] = table.Columns.ToArray();
        return new H5Group
        {
            [L.TruthValuesDataset] = values,
            [L.TruthIdsDataset] = table.Ids.ToArray(),
        };
    }
}
