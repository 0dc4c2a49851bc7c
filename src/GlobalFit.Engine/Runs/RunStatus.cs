using System.Collections.Immutable;
using System.Text.Json;
using System.Text.Json.Serialization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>Where a run stands, as kept in <c>RUN/status.json</c> (rewritten atomically after every iteration and when
/// the run ends). <c>status</c> reads it; whether the run is alive is decided by the lock, not by this file.
/// <c>status --json</c> prints this same record (<see cref="ToJson"/>), with the live state, the run folder and the
/// stored samples filled in, so the two share one schema.</summary>
public sealed record RunStatus
{
    /// <summary><c>running</c>, <c>completed</c>, <c>interrupted</c> or <c>failed</c>.</summary>
    [JsonPropertyName("state")] public required string State { get; init; }

    /// <summary>The run folder (as the writing process saw it).</summary>
    [JsonPropertyName("run")] public string Run { get; init; } = "";

    /// <summary>Process id of the process that wrote the file.</summary>
    [JsonPropertyName("pid")] public int ProcessId { get; init; }

    /// <summary>Iterations completed.</summary>
    [JsonPropertyName("iteration")] public long Iteration { get; init; }

    /// <summary>Iterations the run will do.</summary>
    [JsonPropertyName("iterations_total")] public long TotalIterations { get; init; }

    /// <summary>Iteration of the newest checkpoint.</summary>
    [JsonPropertyName("checkpoint_iteration")] public long CheckpointIteration { get; init; }

    /// <summary>When the file was written (UTC, written with a <c>Z</c>).</summary>
    [JsonPropertyName("updated_utc")]
    [JsonConverter(typeof(UtcTimeConverter))]
    public DateTimeOffset UpdatedUtc { get; init; }

    /// <summary>Wall time of the last iteration.</summary>
    [JsonPropertyName("last_iteration_s")] public double LastIterationSeconds { get; init; }

    /// <summary>Sources held per class.</summary>
    [JsonPropertyName("sources")] public ImmutableSortedDictionary<string, int> SourcesPerClass { get; init; } = ImmutableSortedDictionary<string, int>.Empty;

    /// <summary>Posterior samples stored per class; null in the file (counting reads every sample file), filled in by
    /// <c>status</c>.</summary>
    [JsonPropertyName("samples_stored")] public ImmutableSortedDictionary<string, long>? SamplesStored { get; init; }

    /// <summary>Slowest worker of each stage in the last iteration, slowest first.</summary>
    [JsonPropertyName("slowest_workers")] public ImmutableArray<SlowWorker> SlowestWorkers { get; init; } = [];

    /// <summary>Why the run stopped, for a failure.</summary>
    [JsonPropertyName("message")] public string Message { get; init; } = "";

    private static readonly JsonSerializerOptions Options = new() { WriteIndented = true };

    private static readonly JsonSerializerOptions CompactOptions = new() { WriteIndented = false };

    /// <summary>The record as one line of JSON, in the schema of the file.</summary>
    public string ToJson() => JsonSerializer.Serialize(this, CompactOptions);

    /// <summary>Writes the file atomically.</summary>
    public void Write(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        AtomicFile.Write(layout.StatusFile, overwrite: true, stream => JsonSerializer.Serialize(stream, this, Options));
    }

    /// <summary>Reads the file, or null when there is none.</summary>
    /// <exception cref="InvalidInputException">The file is not a status file.</exception>
    public static RunStatus? Read(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        if (!File.Exists(layout.StatusFile)) return null;
        try
        {
            return JsonSerializer.Deserialize<RunStatus>(File.ReadAllText(layout.StatusFile), Options)
                ?? throw new InvalidInputException(layout.StatusFile, null, "empty status file");
        }
        catch (JsonException e)
        {
            throw new InvalidInputException(layout.StatusFile, e.LineNumber is { } line ? $"line {line + 1}" : null, $"not a status file: {e.Message}");
        }
    }
}

/// <summary>Writes times as <see cref="UtcText"/> does (<c>2026-12-05T09:08:14Z</c>), reads any ISO 8601 form.</summary>
internal sealed class UtcTimeConverter : JsonConverter<DateTimeOffset>
{
    public override DateTimeOffset Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
        DateTimeOffset.Parse(reader.GetString() ?? "", System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal);

    public override void Write(Utf8JsonWriter writer, DateTimeOffset value, JsonSerializerOptions options) =>
        writer.WriteStringValue(UtcText.Format(value));
}

/// <summary>A stage's slowest worker.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="ComputeMs">Its compute time.</param>
public sealed record SlowWorker([property: JsonPropertyName("worker")] string WorkerId, [property: JsonPropertyName("compute_ms")] double ComputeMs);
