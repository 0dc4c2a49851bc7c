using System.Text.Json;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Writes catalogue records with their posterior samples as one JSON document (shape in Catalogue/LAYOUT.md).</summary>
public static class CatalogueJsonWriter
{
    /// <summary>Version of the JSON shape, written as <c>format_version</c>.</summary>
    public const int FormatVersion = 2;

    /// <summary>Writes <paramref name="records"/> to <paramref name="path"/>, atomically.</summary>
    /// <param name="path">Destination.</param>
    /// <param name="records">The sources, written in this order.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="InvalidInputException">The file exists and <paramref name="overwrite"/> is false, or cannot be written.</exception>
    /// <exception cref="ArgumentException">A record is inconsistent.</exception>
    /// <param name="includeSamples">Write each source's posterior samples (false: summaries only; samples grow to
    /// gigabytes on long runs).</param>
    public static void Write(string path, IReadOnlyList<CatalogueRecord> records, bool overwrite, bool includeSamples = true)
    {
        CatalogueRecordChecks.Require(records);
        AtomicFile.Write(path, overwrite, stream =>
        {
            using var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = false });
            WriteDocument(json, records, includeSamples);
        });
    }

    /// <summary>The document as text, for printing.</summary>
    /// <param name="records">The sources, in this order.</param>
    /// <param name="includeSamples">Write each source's posterior samples.</param>
    public static string Format(IReadOnlyList<CatalogueRecord> records, bool includeSamples = true)
    {
        CatalogueRecordChecks.Require(records);
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = false })) WriteDocument(json, records, includeSamples);
        return System.Text.Encoding.UTF8.GetString(buffer.ToArray());
    }

    private static void WriteDocument(Utf8JsonWriter json, IReadOnlyList<CatalogueRecord> records, bool includeSamples)
    {
        json.WriteStartObject();
        json.WriteNumber("format_version", FormatVersion);
        json.WriteStartArray("sources");
        foreach (var r in records)
        {
            json.WriteStartObject();
            json.WriteString("id", r.Id);
            json.WriteString("class", r.ClassId);
            WriteNumber(json, "confidence", r.Confidence);
            WriteNumber(json, "snr", r.Snr);
            json.WriteStartArray("parameters");
            foreach (string name in r.ParameterNames) json.WriteStringValue(name);
            json.WriteEndArray();
            WriteSummary(json, "median", r.ParameterNames, r.Median);
            WriteSummary(json, "lower", r.ParameterNames, r.Lower);
            WriteSummary(json, "upper", r.ParameterNames, r.Upper);
            json.WriteNumber("sample_count", r.SampleCount);
            if (r.Convergence is { } convergence)
            {
                json.WriteStartObject("convergence");
                WriteSummary(json, "split_rhat", r.ParameterNames, convergence.SplitRhat);
                WriteSummary(json, "ess", r.ParameterNames, convergence.EffectiveSampleSize);
                WriteSummary(json, "sky_modes", convergence.ModeNames, convergence.ModeFractions);
                json.WriteEndObject();
            }
            if (!includeSamples)
            {
                json.WriteEndObject();
                continue;
            }
            json.WriteStartArray("samples");
            int width = r.ParameterNames.Length;
            for (int s = 0; s < r.SampleCount; s++)
            {
                json.WriteStartArray();
                for (int c = 0; c < width; c++) WriteNumberValue(json, r.Samples[s * width + c]);
                json.WriteEndArray();
            }
            json.WriteEndArray();
            json.WriteEndObject();
        }
        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void WriteSummary(Utf8JsonWriter json, string name, IReadOnlyList<string> parameters, IReadOnlyList<double> values)
    {
        json.WriteStartObject(name);
        for (int c = 0; c < parameters.Count; c++) WriteNumber(json, parameters[c], values[c]);
        json.WriteEndObject();
    }

    private static void WriteNumber(Utf8JsonWriter json, string name, double value)
    {
        json.WritePropertyName(name);
        WriteNumberValue(json, value);
    }

    // JSON has no literal for NaN or infinities; the strings "NaN", "Infinity", "-Infinity" are what .NET's
    // AllowNamedFloatingPointLiterals and Python's json module both understand.
    private static void WriteNumberValue(Utf8JsonWriter json, double value)
    {
        if (double.IsFinite(value)) json.WriteNumberValue(value);
        else json.WriteStringValue(double.IsNaN(value) ? "NaN" : value > 0 ? "Infinity" : "-Infinity");
    }
}
