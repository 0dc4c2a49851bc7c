using System.Collections;
using System.Globalization;
using System.Text.Json;

namespace GlobalFit.Engine.Telemetry;

/// <summary>Writes span attributes and metric tags as JSON values of their own type (numbers stay numbers).</summary>
internal static class JsonAttributeWriter
{
    public static void WriteObject(Utf8JsonWriter json, string name, IEnumerable<KeyValuePair<string, object?>> attributes)
    {
        json.WriteStartObject(name);
        foreach (var (key, value) in attributes)
        {
            json.WritePropertyName(key);
            WriteValue(json, value);
        }
        json.WriteEndObject();
    }

    public static void WriteNumber(Utf8JsonWriter json, string name, double value)
    {
        json.WritePropertyName(name);
        WriteDouble(json, value);
    }

    private static void WriteValue(Utf8JsonWriter json, object? value)
    {
        switch (value)
        {
            case null: json.WriteNullValue(); break;
            case string s: json.WriteStringValue(s); break;
            case bool b: json.WriteBooleanValue(b); break;
            case int i: json.WriteNumberValue(i); break;
            case long l: json.WriteNumberValue(l); break;
            case double d: WriteDouble(json, d); break;
            case float f: WriteDouble(json, f); break;
            case IEnumerable items:
                json.WriteStartArray();
                foreach (object? item in items) WriteValue(json, item);
                json.WriteEndArray();
                break;
            default: json.WriteStringValue(Convert.ToString(value, CultureInfo.InvariantCulture)); break;
        }
    }

    // JSON has no NaN or infinity; the strings match what System.Text.Json's named-literal mode reads back.
    private static void WriteDouble(Utf8JsonWriter json, double value)
    {
        if (double.IsFinite(value)) json.WriteNumberValue(value);
        else json.WriteStringValue(double.IsNaN(value) ? "NaN" : value > 0 ? "Infinity" : "-Infinity");
    }
}
