using System.Text.Json;
using System.Text.Json.Serialization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli;

/// <summary>JSON settings shared by every <c>--json</c> output.</summary>
public static class CliJson
{
    /// <summary>Compact output; NaN and infinities written as the strings "NaN", "Infinity" and "-Infinity"
    /// (plain JSON has no literal for them, and a missing figure must not crash a report); times as
    /// <see cref="UtcText"/> writes them (<c>2026-12-05T11:06:56Z</c>).</summary>
    public static JsonSerializerOptions Options { get; } = new()
    {
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Converters = { new UtcTextConverter() },
    };

    /// <summary>Serialises <paramref name="value"/> with <see cref="Options"/>.</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options);

    private sealed class UtcTextConverter : JsonConverter<DateTimeOffset>
    {
        public override DateTimeOffset Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            DateTimeOffset.Parse(reader.GetString() ?? "", System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal);

        public override void Write(Utf8JsonWriter writer, DateTimeOffset value, JsonSerializerOptions options) =>
            writer.WriteStringValue(UtcText.Format(value));
    }
}
