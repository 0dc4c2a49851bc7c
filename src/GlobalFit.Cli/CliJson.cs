using System.Text.Json;
using System.Text.Json.Serialization;

namespace GlobalFit.Cli;

/// <summary>JSON settings shared by every <c>--json</c> output.</summary>
public static class CliJson
{
    /// <summary>Compact output; NaN and infinities written as the strings "NaN", "Infinity" and "-Infinity"
    /// (plain JSON has no literal for them, and a missing figure must not crash a report).</summary>
    public static JsonSerializerOptions Options { get; } = new()
    {
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    /// <summary>Serialises <paramref name="value"/> with <see cref="Options"/>.</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options);
}
