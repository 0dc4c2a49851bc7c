using System.Globalization;

namespace GlobalFit.Physics.Tests.CheckValues;

/// <summary>A table of check values read from <c>CheckValues/NAME.csv</c> beside these tests (copied to the test
/// output folder, so no test reads outside the repository's build).</summary>
/// <remarks>Format: a header of column names whose last column is <c>source</c>, then one row per check value set.
/// The source names the published work (authors year, equation or table) or says "derived: …" with a one-line
/// description of how the numbers were obtained; it may not be empty. Fields that contain commas are double-quoted.
/// Numbers use the invariant culture.</remarks>
internal sealed class CheckValueTable
{
    /// <summary>The name of the column every table must end with.</summary>
    public const string SourceColumn = "source";

    private CheckValueTable(string path, IReadOnlyList<string> columns, IReadOnlyList<IReadOnlyList<string>> rows)
    {
        Path = path;
        Columns = columns;
        Rows = rows;
    }

    /// <summary>The file the table was read from.</summary>
    public string Path { get; }

    /// <summary>The column names, <see cref="SourceColumn"/> last.</summary>
    public IReadOnlyList<string> Columns { get; }

    /// <summary>The rows, each with one field per column.</summary>
    public IReadOnlyList<IReadOnlyList<string>> Rows { get; }

    /// <summary>Reads <c>CheckValues/<paramref name="name"/>.csv</c> from the test output folder.</summary>
    public static CheckValueTable Load(string name) =>
        Read(System.IO.Path.Combine(AppContext.BaseDirectory, "CheckValues", name + ".csv"));

    /// <summary>Reads and checks one table: equal field counts, a last column named source, no empty source.</summary>
    /// <exception cref="InvalidDataException">The file breaks the format; the message names the file and line.</exception>
    public static CheckValueTable Read(string path)
    {
        var lines = File.ReadAllLines(path);
        if (lines.Length == 0) throw new InvalidDataException($"{path}: empty check-value table");
        var columns = ParseLine(lines[0]);
        if (columns[^1] != SourceColumn)
            throw new InvalidDataException($"{path}:1: the last column must be '{SourceColumn}', not '{columns[^1]}'");
        var rows = new List<IReadOnlyList<string>>();
        for (int i = 1; i < lines.Length; i++)
        {
            if (lines[i].Length == 0) continue;
            var fields = ParseLine(lines[i]);
            if (fields.Count != columns.Count)
                throw new InvalidDataException($"{path}:{i + 1}: {fields.Count} fields where the header has {columns.Count}");
            if (string.IsNullOrWhiteSpace(fields[^1]))
                throw new InvalidDataException($"{path}:{i + 1}: the row names no source");
            rows.Add(fields);
        }
        return new CheckValueTable(path, columns, rows);
    }

    /// <summary>The named numeric columns of every row, as xunit theory data.</summary>
    /// <exception cref="ArgumentException">A column does not exist.</exception>
    public IEnumerable<object[]> Numbers(params string[] columns)
    {
        var indices = columns.Select(IndexOf).ToArray();
        return Rows.Select(row => indices.Select(i => (object)double.Parse(row[i], NumberStyles.Float, CultureInfo.InvariantCulture)).ToArray()).ToList();
    }

    private int IndexOf(string column)
    {
        for (int i = 0; i < Columns.Count; i++)
            if (Columns[i] == column) return i;
        throw new ArgumentException($"{Path}: no column '{column}' (columns: {string.Join(", ", Columns)})", nameof(column));
    }

    /// <summary>Splits one CSV line; a field in double quotes may hold commas, and "" inside it is one quote.</summary>
    internal static IReadOnlyList<string> ParseLine(string line)
    {
        var fields = new List<string>();
        var field = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < line.Length; i++)
        {
            char c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"') { field.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else field.Append(c);
            }
            else if (c == '"') quoted = true;
            else if (c == ',') { fields.Add(field.ToString()); field.Clear(); }
            else field.Append(c);
        }
        fields.Add(field.ToString());
        return fields;
    }
}
