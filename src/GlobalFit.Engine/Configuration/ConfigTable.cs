using System.Globalization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Configuration;

/// <summary>
/// One table of a configuration file: typed look-ups that name the file, key, line and column when a
/// value is missing or wrong, and a final check that every key present was understood.
/// </summary>
/// <remarks>
/// Each settings record is built by one factory that reads its keys through this class and then calls
/// <see cref="RejectUnknownKeys"/>, so a misspelt key is an error rather than a silently ignored default
/// (validate on create: a settings value that exists is valid). Not thread-safe: the consumed-key set
/// is mutated by reads.
/// </remarks>
public sealed class ConfigTable
{
    private readonly Dictionary<string, ConfigValue> _entries = new(StringComparer.Ordinal);
    private readonly HashSet<string> _consumed = new(StringComparer.Ordinal);

    internal ConfigTable(string sourceName, string path, int line, int column)
    {
        SourceName = sourceName;
        Path = path;
        Line = line;
        Column = column;
    }

    /// <summary>The file this table was read from.</summary>
    public string SourceName { get; }

    /// <summary>Dotted path of this table from the root ("" for the root).</summary>
    public string Path { get; }

    /// <summary>1-based line where the table starts (1 for the root).</summary>
    public int Line { get; }

    /// <summary>1-based column where the table starts.</summary>
    public int Column { get; }

    /// <summary>The keys present, in file order.</summary>
    public IEnumerable<string> Keys => _entries.Keys;

    internal IReadOnlyDictionary<string, ConfigValue> Entries => _entries;

    internal void Add(string key, ConfigValue value, Func<string, InvalidInputException> duplicate)
    {
        if (!_entries.TryAdd(key, value)) throw duplicate(key);
    }

    internal bool TryGetRaw(string key, out ConfigValue value) => _entries.TryGetValue(key, out value!);

    /// <summary>True when <paramref name="key"/> is present (and marks nothing as read).</summary>
    public bool Has(string key) => _entries.ContainsKey(key);

    /// <summary>A number (integer literals are accepted), or <paramref name="fallback"/> when absent.</summary>
    public double GetDouble(string key, double fallback) => TryNumber(key, out double v) ? v : fallback;

    /// <summary>A number that must be present.</summary>
    public double RequireDouble(string key) => TryNumber(key, out double v) ? v : throw Missing(key, "a number");

    /// <summary>A positive finite number, or <paramref name="fallback"/> when absent.</summary>
    public double GetPositive(string key, double fallback)
    {
        double v = GetDouble(key, fallback);
        if (!(v > 0) || !double.IsFinite(v)) throw Invalid(key, $"must be a positive finite number, got {Format(v)}");
        return v;
    }

    /// <summary>A finite number that is zero or more, or <paramref name="fallback"/> when absent.</summary>
    public double GetNonNegative(string key, double fallback)
    {
        double v = GetDouble(key, fallback);
        if (!(v >= 0) || !double.IsFinite(v)) throw Invalid(key, $"must be a finite number ≥ 0, got {Format(v)}");
        return v;
    }

    /// <summary>A number inside [<paramref name="min"/>, <paramref name="max"/>], or <paramref name="fallback"/> when absent.</summary>
    public double GetInRange(string key, double fallback, double min, double max)
    {
        double v = GetDouble(key, fallback);
        if (!(v >= min && v <= max)) throw Invalid(key, $"must lie in [{Format(min)}, {Format(max)}], got {Format(v)}");
        return v;
    }

    /// <summary>An integer, or <paramref name="fallback"/> when absent.</summary>
    public long GetInteger(string key, long fallback)
    {
        if (!_entries.TryGetValue(key, out var entry)) return fallback;
        _consumed.Add(key);
        return entry.Value is long l ? l : throw WrongType(key, entry, "an integer");
    }

    /// <summary>An integer in [<paramref name="min"/>, <paramref name="max"/>], or <paramref name="fallback"/> when absent.</summary>
    public long GetInteger(string key, long fallback, long min, long max)
    {
        long v = GetInteger(key, fallback);
        if (v < min || v > max) throw Invalid(key, $"must be an integer in [{min}, {max}], got {v}");
        return v;
    }

    /// <summary>A boolean, or <paramref name="fallback"/> when absent.</summary>
    public bool GetBool(string key, bool fallback)
    {
        if (!_entries.TryGetValue(key, out var entry)) return fallback;
        _consumed.Add(key);
        return entry.Value is bool b ? b : throw WrongType(key, entry, "true or false");
    }

    /// <summary>A string, or <paramref name="fallback"/> when absent.</summary>
    public string GetString(string key, string fallback)
    {
        if (!_entries.TryGetValue(key, out var entry)) return fallback;
        _consumed.Add(key);
        return entry.Value is string s ? s : throw WrongType(key, entry, "a string");
    }

    /// <summary>A file or folder path, made absolute against <paramref name="baseFolder"/>; <paramref name="fallback"/> when
    /// absent. Refused (naming the key) when empty or when it holds a character no path may hold.</summary>
    public string GetPath(string key, string fallback, string baseFolder)
    {
        string v = GetString(key, fallback);
        if (string.IsNullOrWhiteSpace(v)) throw Invalid(key, "must name a file or folder, got an empty string");
        if (v.Any(char.IsControl)) throw Invalid(key, "holds a control character (such as NUL or a line break), which no path may hold");
        try
        {
            return System.IO.Path.GetFullPath(v, baseFolder);
        }
        catch (Exception e) when (e is ArgumentException or PathTooLongException or NotSupportedException)
        {
            throw Invalid(key, $"is not a usable path ({e.Message})");
        }
    }

    /// <summary>A string that must be one of <paramref name="allowed"/>, or <paramref name="fallback"/> when absent.</summary>
    public string GetChoice(string key, string fallback, params string[] allowed)
    {
        string v = GetString(key, fallback);
        if (Array.IndexOf(allowed, v) < 0) throw Invalid(key, $"must be one of {string.Join(", ", allowed.Select(a => $"\"{a}\""))}, got \"{v}\"");
        return v;
    }

    /// <summary>A sub-table, or null when absent.</summary>
    public ConfigTable? GetTable(string key)
    {
        if (!_entries.TryGetValue(key, out var entry)) return null;
        _consumed.Add(key);
        return entry.Value as ConfigTable ?? throw WrongType(key, entry, "a table");
    }

    /// <summary>An array of tables (<c>[[key]]</c> sections or an array of inline tables); empty when absent.</summary>
    public IReadOnlyList<ConfigTable> GetTableArray(string key)
    {
        if (!_entries.TryGetValue(key, out var entry)) return [];
        _consumed.Add(key);
        if (entry.Value is IReadOnlyList<object> items && items.All(i => i is ConfigTable))
            return items.Cast<ConfigTable>().ToList();
        throw WrongType(key, entry, "an array of tables");
    }

    /// <summary>An array whose items are each a string or an array of strings, as a list of string lists (a bare
    /// string is a list of one); empty when absent.</summary>
    public IReadOnlyList<IReadOnlyList<string>> GetStringLists(string key)
    {
        if (!_entries.TryGetValue(key, out var entry)) return [];
        _consumed.Add(key);
        if (entry.Value is not IReadOnlyList<object> items) throw WrongType(key, entry, "an array");
        var result = new List<IReadOnlyList<string>>(items.Count);
        foreach (var item in items)
        {
            if (item is string single) result.Add([single]);
            else if (item is IReadOnlyList<object> inner && inner.All(i => i is string)) result.Add([.. inner.Cast<string>()]);
            else throw WrongType(key, entry, "an array of strings or of arrays of strings");
        }
        return result;
    }

    /// <summary>Fails on the first key of this table (or a nested one) that no reader asked for,
    /// suggesting the closest known key when one is near.</summary>
    /// <param name="knownKeys">Keys this table accepts, used for the suggestion.</param>
    /// <exception cref="InvalidInputException">A key was not understood.</exception>
    public void RejectUnknownKeys(IEnumerable<string>? knownKeys = null)
    {
        foreach (var (key, entry) in _entries)
        {
            if (_consumed.Contains(key)) continue;
            var known = (knownKeys ?? _consumed).ToList();
            string? suggestion = KeySuggestion.Closest(key, known);
            string hint = suggestion is null ? "" : $"; did you mean '{suggestion}'?";
            throw new InvalidInputException(SourceName, Where(key, entry), $"unknown key '{Qualified(key)}'{hint}");
        }
    }

    /// <summary>An error about <paramref name="key"/> with its position, for checks made by the caller.</summary>
    public InvalidInputException Invalid(string key, string problem)
    {
        string location = _entries.TryGetValue(key, out var entry) ? Where(key, entry) : $"key '{Qualified(key)}' (default)";
        return new InvalidInputException(SourceName, location, problem);
    }

    /// <summary>An error about the table as a whole.</summary>
    public InvalidInputException InvalidTable(string problem) =>
        new(SourceName, Path.Length == 0 ? null : $"line {Line}, column {Column}, table [{Path}]", problem);

    private bool TryNumber(string key, out double value)
    {
        value = 0;
        if (!_entries.TryGetValue(key, out var entry)) return false;
        _consumed.Add(key);
        value = entry.Value switch
        {
            double d => d,
            long l => l,
            _ => throw WrongType(key, entry, "a number"),
        };
        return true;
    }

    private InvalidInputException Missing(string key, string what) =>
        new(SourceName, Path.Length == 0 ? null : $"table [{Path}] (line {Line})", $"required key '{Qualified(key)}' ({what}) is missing");

    private InvalidInputException WrongType(string key, ConfigValue entry, string expected) =>
        new(SourceName, Where(key, entry), $"'{Qualified(key)}' must be {expected}, got {Describe(entry.Value)}");

    private string Where(string key, ConfigValue entry) => $"line {entry.Line}, column {entry.Column}, key '{Qualified(key)}'";

    private string Qualified(string key) => Path.Length == 0 ? key : $"{Path}.{key}";

    private static string Describe(object value) => value switch
    {
        string s => $"the string \"{s}\"",
        bool b => b ? "true" : "false",
        double d => Format(d),
        long l => l.ToString(CultureInfo.InvariantCulture),
        ConfigTable => "a table",
        _ => "an array",
    };

    private static string Format(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
