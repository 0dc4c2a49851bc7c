using System.Globalization;
using System.Text.Json;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Telemetry;

/// <summary>A span line of <c>telemetry.jsonl</c>, parsed.</summary>
internal sealed record TelemetrySpan(int Line, string Name, string TraceId, string SpanId, string? ParentSpanId,
    DateTimeOffset StartUtc, double DurationMs, IReadOnlyDictionary<string, JsonElement> Attributes)
{
    public DateTimeOffset EndUtc => StartUtc.AddTicks((long)Math.Round(DurationMs * TimeSpan.TicksPerMillisecond));

    /// <summary>Parses the span line <paramref name="root"/>; errors name the file and line.</summary>
    public static TelemetrySpan Parse(JsonElement root, string path, int line)
    {
        string Location() => string.Create(CultureInfo.InvariantCulture, $"line {line}");
        string Text(string name) =>
            root.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String && v.GetString() is { Length: > 0 } s
                ? s
                : throw new InvalidInputException(path, Location(), $"span has no text field '{name}'");
        string? parent = root.TryGetProperty("parent_span_id", out var p) && p.ValueKind == JsonValueKind.String ? p.GetString() : null;
        if (!DateTimeOffset.TryParse(Text("start_utc"), CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal, out var start))
            throw new InvalidInputException(path, Location(), "start_utc is not an ISO 8601 time");
        if (!root.TryGetProperty("duration_ms", out var d) || d.ValueKind != JsonValueKind.Number || !(d.GetDouble() >= 0))
            throw new InvalidInputException(path, Location(), "span has no duration_ms, or it is negative");
        var attributes = new Dictionary<string, JsonElement>(StringComparer.Ordinal);
        if (root.TryGetProperty("attributes", out var a))
        {
            if (a.ValueKind != JsonValueKind.Object) throw new InvalidInputException(path, Location(), "attributes is not an object");
            foreach (var property in a.EnumerateObject()) attributes[property.Name] = property.Value.Clone();
        }
        return new TelemetrySpan(line, Text("name"), Text("trace_id"), Text("span_id"), parent, start, d.GetDouble(), attributes);
    }

    public long RequireLong(string attribute, string path)
    {
        if (Attributes.TryGetValue(attribute, out var v) && v.ValueKind == JsonValueKind.Number && v.TryGetInt64(out long value)) return value;
        throw new InvalidInputException(path, string.Create(CultureInfo.InvariantCulture, $"line {Line}"), $"{Name} span has no whole-number attribute {attribute}");
    }

    public string RequireText(string attribute, string path)
    {
        if (Attributes.TryGetValue(attribute, out var v) && v.ValueKind == JsonValueKind.String && v.GetString() is { Length: > 0 } s) return s;
        throw new InvalidInputException(path, string.Create(CultureInfo.InvariantCulture, $"line {Line}"), $"{Name} span has no text attribute {attribute}");
    }

    public string? OptionalText(string attribute) =>
        Attributes.TryGetValue(attribute, out var v) && v.ValueKind == JsonValueKind.String && v.GetString() is { Length: > 0 } s ? s : null;

    public double? OptionalDouble(string attribute) =>
        Attributes.TryGetValue(attribute, out var v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : null;
}
