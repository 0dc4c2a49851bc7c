using System.Text.RegularExpressions;

namespace GlobalFit.Physics.DataFiles;

/// <summary>The plain names used for source-class ids and table columns: lower-case words joined by single underscores.</summary>
/// <remarks>Examples: <c>class_id</c>, <c>f0_hz</c>, <c>fdot_hz_s</c>. Such names are valid HDF5 link names,
/// Python identifiers and TOML keys, so they survive every file format the project writes.</remarks>
public static partial class SnakeCaseName
{
    /// <summary>True when <paramref name="name"/> is a lower-case snake_case name starting with a letter.</summary>
    public static bool IsValid(string? name) => name is not null && Pattern().IsMatch(name);

    [GeneratedRegex("^[a-z][a-z0-9]*(_[a-z0-9]+)*$", RegexOptions.CultureInvariant)]
    private static partial Regex Pattern();
}
