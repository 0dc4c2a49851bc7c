using System.Buffers;
using System.Diagnostics;
using System.Text;
using System.Text.Json;
using OpenTelemetry;

namespace GlobalFit.Engine.Telemetry;

/// <summary>Exports spans as lines of <c>telemetry.jsonl</c>:
/// <c>{"kind":"span","name","trace_id","span_id","parent_span_id","start_utc","duration_ms","status","attributes":{…}}</c>.</summary>
/// <remarks><c>parent_span_id</c> is null for a root span; <c>start_utc</c> is ISO 8601 with 100 ns resolution;
/// <c>status</c> is <c>unset</c>, <c>ok</c> or <c>error</c>. The file is owned by the caller, not by the exporter.</remarks>
/// <param name="file">The file to append to.</param>
public sealed class JsonLinesActivityExporter(TelemetryJsonLines file) : BaseExporter<Activity>
{
    private readonly TelemetryJsonLines _file = file ?? throw new ArgumentNullException(nameof(file));

    /// <summary>Appends one line per span of <paramref name="batch"/> and flushes.</summary>
    /// <param name="batch">The spans.</param>
    /// <returns>Success, or failure when the file could not be written.</returns>
    public override ExportResult Export(in Batch<Activity> batch)
    {
        var lines = new List<string>();
        foreach (var activity in batch) lines.Add(Format(activity));
        return _file.Append(lines) ? ExportResult.Success : ExportResult.Failure;
    }

    /// <summary>One span as its JSON line (without line feed).</summary>
    /// <param name="activity">The ended span.</param>
    /// <returns>The line.</returns>
    public static string Format(Activity activity)
    {
        ArgumentNullException.ThrowIfNull(activity);
        var buffer = new ArrayBufferWriter<byte>(512);
        using (var json = new Utf8JsonWriter(buffer))
        {
            json.WriteStartObject();
            json.WriteString("kind", "span");
            json.WriteString("name", activity.DisplayName);
            json.WriteString("trace_id", activity.TraceId.ToHexString());
            json.WriteString("span_id", activity.SpanId.ToHexString());
            if (activity.ParentSpanId == default) json.WriteNull("parent_span_id");
            else json.WriteString("parent_span_id", activity.ParentSpanId.ToHexString());
            // UTC with a Z like every time the program writes, here with the 100 ns resolution the critical-path analysis needs.
            json.WriteString("start_utc", DateTime.SpecifyKind(activity.StartTimeUtc, DateTimeKind.Utc).ToString("O", System.Globalization.CultureInfo.InvariantCulture));
            JsonAttributeWriter.WriteNumber(json, "duration_ms", activity.Duration.TotalMilliseconds);
            json.WriteString("status", activity.Status switch
            {
                ActivityStatusCode.Ok => "ok",
                ActivityStatusCode.Error => "error",
                _ => "unset",
            });
            JsonAttributeWriter.WriteObject(json, "attributes", activity.TagObjects);
            json.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.WrittenSpan);
    }
}
