using System.Collections.Immutable;
using System.Text.Json;
using System.Text.Json.Serialization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>Where a run stands, as kept in <c>RUN/status.json</c> (rewritten atomically after every iteration and when
/// the run ends). <c>status</c> reads it; whether the run is alive is decided by the lock, not by this file.</summary>
public sealed record RunStatus
{
    /// <summary><c>running</c>, <c>completed</c>, <c>interrupted</c> or <c>failed</c>.</summary>
    [JsonPropertyName("state")] public required string State { get; init; }

    /// <summary>Process id of the process that wrote the file.</summary>
    [JsonPropertyName("pid")] public int ProcessId { get; init; }

    /// <summary>Iterations completed.</summary>
    [JsonPropertyName("iteration")] public long Iteration { get; init; }

    /// <summary>Iterations the run will do.</summary>
    [JsonPropertyName("iterations_total")] public long TotalIterations { get; init; }

    /// <summary>Iteration of the newest checkpoint.</summary>
    [JsonPropertyName("checkpoint_iteration")] public long CheckpointIteration { get; init; }

    /// <summary>When the file was written.</summary>
    [JsonPropertyName("updated_utc")] public DateTimeOffset UpdatedUtc { get; init; }

    /// <summary>Wall time of the last iteration.</summary>
    [JsonPropertyName("last_iteration_s")] public double LastIterationSeconds { get; init; }

    /// <summary>Sources held per class.</summary>
    [JsonPropertyName("sources")] public ImmutableSortedDictionary<string, int> SourcesPerClass { get; init; } = ImmutableSortedDictionary<string, int>.Empty;

    /// <summary>Slowest worker of each stage in the last iteration.</summary>
    [JsonPropertyName("slowest_workers")] public ImmutableArray<SlowWorker> SlowestWorkers { get; init; } = [];

    /// <summary>Why the run stopped, for a failure.</summary>
    [JsonPropertyName("message")] public string Message { get; init; } = "";

    private static readonly JsonSerializerOptions Options = new() { WriteIndented = true };

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

/// <summary>A stage's slowest worker.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="ComputeMs">Its compute time.</param>
public sealed record SlowWorker([property: JsonPropertyName("worker")] string WorkerId, [property: JsonPropertyName("compute_ms")] double ComputeMs);
