using System.Buffers;
using System.Text;
using System.Text.Json;
using OpenTelemetry;
using OpenTelemetry.Metrics;

namespace GlobalFit.Engine.Telemetry;

/// <summary>Exports metric points as lines of <c>telemetry.jsonl</c>:
/// <c>{"kind":"metric","name","unit","start_utc","end_utc","tags":{…}, …}</c> with <c>count</c>, <c>sum</c>, <c>min</c>,
/// <c>max</c> for histograms and <c>value</c> for sums and gauges.</summary>
/// <remarks>Registered behind a periodic reader with delta temporality (<see cref="TelemetrySession"/>), so each line
/// covers the interval from <c>start_utc</c> to <c>end_utc</c> and only points that changed are written.</remarks>
/// <param name="file">The file to append to.</param>
public sealed class JsonLinesMetricExporter(TelemetryJsonLines file) : BaseExporter<Metric>
{
    private readonly TelemetryJsonLines _file = file ?? throw new ArgumentNullException(nameof(file));

    /// <summary>Appends one line per metric point of <paramref name="batch"/> and flushes.</summary>
    /// <param name="batch">The metrics.</param>
    /// <returns>Success, or failure when the file could not be written.</returns>
    public override ExportResult Export(in Batch<Metric> batch)
    {
        var lines = new List<string>();
        foreach (var metric in batch)
            foreach (ref readonly var point in metric.GetMetricPoints())
                lines.Add(Format(metric, point));
        return _file.Append(lines) ? ExportResult.Success : ExportResult.Failure;
    }

    private static string Format(Metric metric, in MetricPoint point)
    {
        var buffer = new ArrayBufferWriter<byte>(256);
        using (var json = new Utf8JsonWriter(buffer))
        {
            json.WriteStartObject();
            json.WriteString("kind", "metric");
            json.WriteString("name", metric.Name);
            json.WriteString("unit", metric.Unit);
            json.WriteString("start_utc", point.StartTime);
            json.WriteString("end_utc", point.EndTime);
            var tags = new List<KeyValuePair<string, object?>>();
            foreach (var tag in point.Tags) tags.Add(tag);
            JsonAttributeWriter.WriteObject(json, "tags", tags);
            switch (metric.MetricType)
            {
                case MetricType.Histogram:
                    json.WriteNumber("count", point.GetHistogramCount());
                    JsonAttributeWriter.WriteNumber(json, "sum", point.GetHistogramSum());
                    if (point.TryGetHistogramMinMaxValues(out double min, out double max))
                    {
                        JsonAttributeWriter.WriteNumber(json, "min", min);
                        JsonAttributeWriter.WriteNumber(json, "max", max);
                    }
                    break;
                case MetricType.LongSum or MetricType.LongSumNonMonotonic:
                    json.WriteNumber("value", point.GetSumLong());
                    break;
                case MetricType.DoubleSum or MetricType.DoubleSumNonMonotonic:
                    JsonAttributeWriter.WriteNumber(json, "value", point.GetSumDouble());
                    break;
                case MetricType.LongGauge:
                    json.WriteNumber("value", point.GetGaugeLastValueLong());
                    break;
                case MetricType.DoubleGauge:
                    JsonAttributeWriter.WriteNumber(json, "value", point.GetGaugeLastValueDouble());
                    break;
                default:
                    break;
            }
            json.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.WrittenSpan);
    }
}
