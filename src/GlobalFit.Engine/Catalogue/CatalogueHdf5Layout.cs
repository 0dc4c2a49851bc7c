using System.Reflection;
using PureHDF;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Names of the HDF5 catalogue layout (Catalogue/LAYOUT.md), shared by the writer and by readers.</summary>
public static class CatalogueHdf5Layout
{
    /// <summary>The layout version this program writes.</summary>
    public const int FormatVersion = 2;

    /// <summary>Root attribute holding <see cref="FormatVersion"/>.</summary>
    public const string FormatVersionAttribute = "format_version";

    /// <summary>Top group; one subgroup per class id below it.</summary>
    public const string CatalogueGroup = "catalogue";

    /// <summary>Attribute of a class group (and of its 2-D datasets): the parameter names, in column order.</summary>
    public const string ColumnsAttribute = "columns";

    /// <summary>Compound dataset [R] of <see cref="CatalogueSourceRow"/>: one row per catalogued source.</summary>
    public const string SourcesDataset = "sources";

    /// <summary>float64 [R, C]: per-source medians.</summary>
    public const string MedianDataset = "median";

    /// <summary>float64 [R, C]: per-source 5 % quantiles.</summary>
    public const string LowerDataset = "lower";

    /// <summary>float64 [R, C]: per-source 95 % quantiles.</summary>
    public const string UpperDataset = "upper";

    /// <summary>float64 [S, C]: every source's posterior samples, source after source.</summary>
    public const string SamplesDataset = "samples";

    /// <summary>int64 [S]: the source row each sample row belongs to.</summary>
    public const string SampleSourceDataset = "sample_source";

    /// <summary>float64 [R, C]: per-source split R̂ (present when the class reports convergence).</summary>
    public const string SplitRhatDataset = "split_rhat";

    /// <summary>float64 [R, C]: per-source bulk effective sample size (present with <see cref="SplitRhatDataset"/>).</summary>
    public const string EssDataset = "ess";

    /// <summary>float64 [R, M]: per-source fraction of samples in each sky mode (present with <see cref="SplitRhatDataset"/>).</summary>
    public const string SkyModeDataset = "sky_mode_fraction";

    /// <summary>Attribute of <see cref="SkyModeDataset"/>: the mode names, in column order.</summary>
    public const string ModesAttribute = "modes";

    /// <summary>Options that write the compound members under their <see cref="H5NameAttribute"/> names.</summary>
    /// <remarks>PureHDF 2.2.0 names compound members after the C# fields, on writing and on reading alike, unless
    /// a field-name mapper says otherwise; without it the members were written `Id`, `Confidence`, ….</remarks>
    public static H5WriteOptions WriteOptions { get; } = new(FieldNameMapper: MemberName);

    /// <summary>Options that read the compound members by their <see cref="H5NameAttribute"/> names.</summary>
    public static H5ReadOptions ReadOptions { get; } = new(FieldNameMapper: MemberName);

    private static string MemberName(FieldInfo field) => field.GetCustomAttribute<H5NameAttribute>()?.Name ?? field.Name;
}

/// <summary>One row of the <c>sources</c> compound dataset.</summary>
/// <remarks>Public fields because PureHDF maps the fields of a struct to compound members.</remarks>
public struct CatalogueSourceRow
{
    /// <summary>Source id, e.g. <c>gb-0001</c> (variable-length UTF-8 text).</summary>
    [H5Name("id")]
    public string Id;

    /// <summary>Fraction of samples holding the source.</summary>
    [H5Name("confidence")]
    public double Confidence;

    /// <summary>Median optimal SNR.</summary>
    [H5Name("snr")]
    public double Snr;

    /// <summary>First row of this source in the <c>samples</c> dataset.</summary>
    [H5Name("first_sample")]
    public long FirstSample;

    /// <summary>Number of rows of this source in the <c>samples</c> dataset.</summary>
    [H5Name("sample_count")]
    public long SampleCount;
}
