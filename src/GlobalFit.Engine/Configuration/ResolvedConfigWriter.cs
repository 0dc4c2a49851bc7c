using System.Globalization;
using System.Text;

namespace GlobalFit.Engine.Configuration;

/// <summary>Writes a resolved configuration (every setting, defaults included) as TOML, section by section, so a run
/// folder records exactly what ran.</summary>
public sealed class ResolvedConfigWriter
{
    private readonly StringBuilder _text = new();

    /// <summary>Starts <c>[name]</c>.</summary>
    public void Section(string name)
    {
        if (_text.Length > 0) _text.AppendLine();
        _text.Append('[').Append(name).AppendLine("]");
    }

    /// <summary>Writes a comment line.</summary>
    public void Comment(string text) => _text.Append("# ").AppendLine(text);

    /// <summary>Writes <c>key = number</c>.</summary>
    public void Key(string key, double value) => _text.Append(key).Append(" = ").AppendLine(TomlText.Number(value));

    /// <summary>Writes <c>key = integer</c>.</summary>
    public void Key(string key, long value) => _text.Append(key).Append(" = ").AppendLine(value.ToString(CultureInfo.InvariantCulture));

    /// <summary>Writes <c>key = true|false</c>.</summary>
    public void Key(string key, bool value) => _text.Append(key).Append(" = ").AppendLine(value ? "true" : "false");

    /// <summary>Writes <c>key = "string"</c>.</summary>
    public void Key(string key, string value) => _text.Append(key).Append(" = ").AppendLine(TomlText.String(value));

    /// <summary>Writes <c>key = [["a", "b"], ["c"]]</c>.</summary>
    public void Key(string key, IEnumerable<IEnumerable<string>> nested) =>
        _text.Append(key).Append(" = [").Append(string.Join(", ", nested.Select(inner => "[" + string.Join(", ", inner.Select(TomlText.String)) + "]"))).AppendLine("]");

    /// <summary>The text so far.</summary>
    public override string ToString() => _text.ToString();
}
