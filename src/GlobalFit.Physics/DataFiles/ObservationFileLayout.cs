namespace GlobalFit.Physics.DataFiles;

/// <summary>Names of the groups, datasets and attributes of an observation file (LAYOUT.md), in one place
/// so that the writer, the reader and the documentation cannot drift apart.</summary>
internal static class ObservationFileLayout
{
    public const string FormatVersionAttribute = "format_version";
    public const string CreatedUtcAttribute = "created_utc";
    public const string GeneratorAttribute = "generator";

    public const string ProvenanceGroup = "provenance";

    public const string TdiGroup = "tdi";
    public const string T0Attribute = "t0_s";
    public const string DtAttribute = "dt_s";
    public const string UnitsAttribute = "units";
    public const string ChannelsAttribute = "channels";
    public const string TimeStampsDataset = "time_s";
    public const string FractionalFrequency = "fractional frequency";
    public const string AetChannels = "AET";
    public const string XyzChannels = "XYZ";

    public const string GapsDataset = "gaps";
    public const string GapColumnsAttribute = "columns";
    public static readonly string[] GapColumns = ["start_s", "end_s"];

    public const string TruthGroup = "truth";
    public const string TruthValuesDataset = "values";
    public const string TruthColumnsAttribute = "columns";
    public const string TruthIdsDataset = "ids";
}
