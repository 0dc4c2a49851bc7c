using System.Globalization;

namespace GlobalFit.Engine.Configuration;

/// <summary>Formats values as TOML literals when settings are written back out.</summary>
public static class TomlText
{
    /// <summary>A float literal that reads back to the same double (round-trip format, always with a '.' or exponent).</summary>
    public static string Number(double value)
    {
        string text = value.ToString("R", CultureInfo.InvariantCulture);
        return text.Contains('.') || text.Contains('E') || text.Contains('e') ? text : text + ".0";
    }

    /// <summary>A basic string literal with quotes and backslashes escaped.</summary>
    public static string String(string value) =>
        "\"" + value.Replace("\\", "\\\\", StringComparison.Ordinal).Replace("\"", "\\\"", StringComparison.Ordinal) + "\"";
}
