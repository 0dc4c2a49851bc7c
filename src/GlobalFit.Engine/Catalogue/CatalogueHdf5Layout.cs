using PureHDF;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Names of the HDF5 catalogue layout (Catalogue/LAYOUT.md), shared by the writer and by readers.</summary>
public static class CatalogueHdf5Layout
{
    /// <summary>The layout version this program writes.</summary>
    public const int FormatVersion = 1;

    /// <summary>Root attribute holding <see cref="FormatVersion"/>.</summary>
    public const string FormatVersionAttribute = "format_version";

    /// <summary>Top group; one subgroup per class id below it.</summary>
    public const string CatalogueGroup = "catalogue";

    /// <summary>Attribute of a class group (and of its 2-D datasets): the parameter names, in column order.</summary>
    public const string ColumnsAttribute = "columns";

    /// <summary>Compound dataset [R] of <see cref="CatalogueEntryRow"/>.</summary>
    public const string EntriesDataset = "entries";

    /// <summary>float64 [R, C]: per-entry medians.</summary>
    public const string MedianDataset = "median";

    /// <summary>float64 [R, C]: per-entry 5 % quantiles.</summary>
    public const string LowerDataset = "lower";

    /// <summary>float64 [R, C]: per-entry 95 % quantiles.</summary>
    public const string UpperDataset = "upper";

    /// <summary>float64 [S, C]: every entry's posterior samples, entry after entry.</summary>
    public const string SamplesDataset = "samples";

    /// <summary>int64 [S]: the entry row each sample row belongs to.</summary>
    public const string SampleEntryDataset = "sample_entry";
}

/// <summary>One row of the <c>entries</c> compound dataset.</summary>
/// <remarks>Public fields because PureHDF maps the fields of a struct to compound members.</remarks>
public struct CatalogueEntryRow
{
    /// <summary>Entry id, e.g. <c>gb-0001</c> (variable-length UTF-8 text).</summary>
    [H5Name("id")]
    public string Id;

    /// <summary>Fraction of samples holding the source.</summary>
    [H5Name("confidence")]
    public double Confidence;

    /// <summary>Median optimal SNR.</summary>
    [H5Name("snr")]
    public double Snr;

    /// <summary>First row of this entry in the <c>samples</c> dataset.</summary>
    [H5Name("first_sample")]
    public long FirstSample;

    /// <summary>Number of rows of this entry in the <c>samples</c> dataset.</summary>
    [H5Name("sample_count")]
    public long SampleCount;
}
