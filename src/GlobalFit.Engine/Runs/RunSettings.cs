using GlobalFit.Engine.Configuration;

namespace GlobalFit.Engine.Runs;

/// <summary>The top-level keys of a run configuration: what to fit, where to keep the run, and how long and how wide
/// to run it. Class sections, <c>[noise]</c> and <c>[schedule]</c> are read by <see cref="RunPlan"/>.</summary>
public sealed record RunSettings
{
    /// <summary>The top-level keys (tables excluded).</summary>
    public static readonly string[] Keys =
    [
        "data", "run_folder", "seed", "iterations", "burn_in", "checkpoint_every_iterations", "checkpoint_every_minutes", "threads",
        "max_worker_failures", "min_confidence",
    ];

    /// <summary>The observation file, absolute [<c>data</c>; relative paths are taken from the config file's folder].</summary>
    public required string DataPath { get; init; }

    /// <summary>The run folder, absolute [<c>run_folder</c>, default <c>run</c> beside the config file].</summary>
    public required string RunFolder { get; init; }

    /// <summary>The run seed every random stream derives from [<c>seed</c>].</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>Blocked-Gibbs iterations to run in total [<c>iterations</c>].</summary>
    public int Iterations { get; init; } = 100;

    /// <summary>Leading iterations whose samples the catalogue leaves out [<c>burn_in</c>, default a fifth].</summary>
    public int BurnIn { get; init; }

    /// <summary>Iterations between checkpoints [<c>checkpoint_every_iterations</c>].</summary>
    public int CheckpointEvery { get; init; } = 10;

    /// <summary>Wall-clock minutes after which a checkpoint is written even if fewer iterations passed
    /// [<c>checkpoint_every_minutes</c>].</summary>
    public double CheckpointMinutes { get; init; } = 30;

    /// <summary>Threads of the compute dispatcher the workers run on [<c>threads</c>, default: the machine's cores].</summary>
    public int Threads { get; init; } = Environment.ProcessorCount;

    /// <summary>Failures of one worker within one iteration after which the run stops [<c>max_worker_failures</c>].</summary>
    public int MaxWorkerFailures { get; init; } = 3;

    /// <summary>Catalogue sources present in fewer than this fraction of the samples are left out [<c>min_confidence</c>].</summary>
    public double MinConfidence { get; init; } = 0.5;

    /// <summary>Reads the top-level keys of <paramref name="root"/>.</summary>
    /// <param name="root">The configuration's root table.</param>
    /// <param name="configFolder">Folder relative paths are taken from.</param>
    /// <param name="requireData">Whether the data file must exist now.</param>
    public static RunSettings FromConfig(ConfigTable root, string configFolder, bool requireData = true)
    {
        ArgumentNullException.ThrowIfNull(root);
        if (!root.Has("data")) throw root.Invalid("data", "the run configuration must name its observation file: data = \"FILE.h5\"");
        int iterations = (int)root.GetInteger("iterations", 100, 1, 100_000_000);
        var defaults = new RunSettings { DataPath = "", RunFolder = "" };
        var settings = new RunSettings
        {
            DataPath = root.GetPath("data", "", configFolder),
            RunFolder = root.GetPath("run_folder", "run", configFolder),
            Seed = (ulong)root.GetInteger("seed", 1, 0, long.MaxValue),
            Iterations = iterations,
            BurnIn = (int)root.GetInteger("burn_in", iterations / 5, 0, iterations - 1),
            CheckpointEvery = (int)root.GetInteger("checkpoint_every_iterations", defaults.CheckpointEvery, 1, 100_000_000),
            CheckpointMinutes = root.GetInRange("checkpoint_every_minutes", defaults.CheckpointMinutes, 0.01, 1e6),
            Threads = (int)root.GetInteger("threads", defaults.Threads, 1, 4096),
            MaxWorkerFailures = (int)root.GetInteger("max_worker_failures", defaults.MaxWorkerFailures, 1, 1000),
            MinConfidence = root.GetInRange("min_confidence", defaults.MinConfidence, 0.0, 1.0),
        };
        if (requireData && !File.Exists(settings.DataPath)) throw root.Invalid("data", $"file not found: {settings.DataPath}");
        return settings;
    }

    /// <summary>Writes every top-level key.</summary>
    public void WriteResolved(ResolvedConfigWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Key("data", DataPath);
        writer.Key("run_folder", RunFolder);
        writer.Key("seed", (long)Seed);
        writer.Key("iterations", Iterations);
        writer.Key("burn_in", BurnIn);
        writer.Key("checkpoint_every_iterations", CheckpointEvery);
        writer.Key("checkpoint_every_minutes", CheckpointMinutes);
        writer.Key("threads", Threads);
        writer.Key("max_worker_failures", MaxWorkerFailures);
        writer.Key("min_confidence", MinConfidence);
    }
}
