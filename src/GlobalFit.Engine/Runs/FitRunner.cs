using System.Collections.Immutable;
using System.Security.Cryptography;
using System.Text;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.NoiseFitting;
using GlobalFit.Engine.Telemetry;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Input;

namespace GlobalFit.Engine.Runs;

/// <summary>Starts and resumes fits: prepares the run folder, loads the data, builds the actors, runs the coordinator
/// to the end (or until cancelled) and writes the catalogue.</summary>
public static class FitRunner
{
    /// <summary>Starts a fresh fit from a run configuration.</summary>
    /// <param name="configPath">The configuration file.</param>
    /// <param name="options">Progress, telemetry endpoint and cancellation.</param>
    /// <returns>How the run ended.</returns>
    /// <exception cref="InvalidInputException">The configuration, its data or its run folder is unusable.</exception>
    public static FitOutcome Start(string configPath, FitRunOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var plan = RunPlan.Load(configPath);
        var layout = new RunFolderLayout(plan.Settings.RunFolder);
        if (File.Exists(layout.ResolvedConfig))
            throw new InvalidInputException(configPath, "key 'run_folder'", $"{layout.Root} holds another run; continue it with 'globalfit resume {layout.Root}' or choose another run_folder");
        if (Directory.Exists(layout.Root) && Directory.EnumerateFileSystemEntries(layout.Root).Any())
            throw new InvalidInputException(configPath, "key 'run_folder'", $"{layout.Root} is not empty; choose a new or empty folder");
        Directory.CreateDirectory(layout.Root);
        using var runLock = RunLock.Acquire(layout);
        string resolved = plan.ResolvedToml();
        AtomicFile.Write(layout.ResolvedConfig, overwrite: false, s => s.Write(Encoding.UTF8.GetBytes(resolved)));
        var data = LoadData(plan, options.Progress);
        return Run(plan, layout, Digest(resolved), data, StartingPoint.Fresh(plan), options);
    }

    /// <summary>Continues a stopped fit from its newest intact checkpoint (or from the start when it never wrote one).</summary>
    /// <param name="runFolder">The run folder.</param>
    /// <param name="options">Progress, telemetry endpoint and cancellation.</param>
    /// <exception cref="InvalidInputException">The folder is not a run, is running, or its checkpoints are unusable.</exception>
    public static FitOutcome Resume(string runFolder, FitRunOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var layout = RunFolderLayout.OpenExisting(runFolder);
        using var runLock = RunLock.Acquire(layout);
        string resolved = File.ReadAllText(layout.ResolvedConfig);
        var plan = RunPlan.Load(layout.ResolvedConfig);
        if (plan.Settings.RunFolder != layout.Root)
            throw new InvalidInputException(layout.ResolvedConfig, "key 'run_folder'", $"names {plan.Settings.RunFolder}, but the run is in {layout.Root}; a moved run folder must have run_folder updated");
        string digest = Digest(resolved);
        StartingPoint start;
        var store = new CatalogueStore(layout.Root);
        if (CheckpointFile.Exists(layout.Root))
        {
            var checkpoint = CheckpointFile.Read(layout.Root, options.Progress.Warning);
            if (checkpoint.ConfigDigest != digest)
                throw new InvalidInputException(layout.ResolvedConfig, null, "run.toml was edited after the checkpoint was written; restore it or start a new fit");
            start = new StartingPoint(checkpoint.Iteration, checkpoint.Iteration,
                checkpoint.Workers.ToDictionary(w => w.WorkerId, w => w.State, StringComparer.Ordinal),
                checkpoint.Templates.ToDictionary(t => t.WorkerId, t => t.ToSpectra(), StringComparer.Ordinal),
                checkpoint.NoiseState.Length == 0 ? null : checkpoint.NoiseState);
        }
        else
        {
            start = StartingPoint.Fresh(plan);
        }
        store.TruncateAfter(start.Iteration);
        var data = LoadData(plan, options.Progress);
        return Run(plan, layout, digest, data, start, options);
    }

    private static FitOutcome Run(RunPlan plan, RunFolderLayout layout, string digest, FitData data, StartingPoint start, FitRunOptions options)
    {
        var settings = plan.Settings;
        NoiseWorker LoadNoise(byte[]? state) => state is null
            ? new NoiseWorker(plan.Noise, plan.Shape, settings.Seed)
            : NoiseWorker.Restore(plan.Noise, plan.Shape, state);
        // The worker that gives the starting PSD is handed to the noise actor for its first load (from the same state),
        // so the per-bin arrays are built once; a restart after a failure loads afresh.
        NoiseWorker? prebuilt = LoadNoise(start.NoiseState);
        var psd = InversePsd.From(prebuilt, plan.Shape.BinCount);
        var noiseBins = prebuilt.Bins;
        NoiseWorker LoadNoiseOnce(byte[]? state) => Interlocked.Exchange(ref prebuilt, null) ?? LoadNoise(state);
        var book = new ResidualBook(data, plan.Workers.Select(w => (w.Id, w.Bins, w.IncludesT)), psd.A, psd.E, psd.T);
        foreach (var (id, template) in start.Templates) book.Replace(id, template);
        var progress = new StatusRecordingProgress(options.Progress, layout, start.CheckpointIteration);
        progress.WriteState("running", start.Iteration, settings.Iterations, "");

        using var telemetry = TelemetrySession.Start(layout.Root, options.OtlpEndpoint);
        using var system = FitActorSystem.Create(settings.Threads);
        var residual = system.ActorOf(ResidualDataActor.Props(book), "residual-data");
        var store = system.ActorOf(CatalogueStoreActor.Props(new CatalogueStore(layout.Root)), "catalogue-store");
        var checkpointer = system.ActorOf(CheckpointerActor.Props(layout.Root), "checkpointer");
        var setup = new CoordinatorSetup(plan, digest, start.Iteration, start.CheckpointIteration, start.WorkerStates, start.Templates, start.NoiseState,
            residual, store, checkpointer, progress,
            (id, state) => state is null ? plan.ClassOf(id).CreateWorker(id, settings.Seed) : plan.ClassOf(id).RestoreWorker(id, state),
            NoiseActor.Props(LoadNoiseOnce, plan.Shape.BinCount), noiseBins, plan.Noise.StepsPerUpdate);
        var coordinator = system.ActorOf(FitCoordinator.Props(setup), "fit-coordinator");
        using var stop = options.Cancellation.Register(() => coordinator.Tell(new StopFit()));
        var finished = coordinator.Ask<FitFinished>(new StartFit(), Timeout.InfiniteTimeSpan).GetAwaiter().GetResult();
        system.Terminate().Wait(TimeSpan.FromSeconds(10));
        var outcome = finished.Outcome;
        progress.WriteState(outcome.Kind.ToString().ToLowerInvariant(), outcome.IterationsCompleted, settings.Iterations, outcome.Message, outcome.CheckpointIteration);
        return outcome.Kind == FitOutcomeKind.Completed
            ? outcome with { Catalogue = RunCatalogue.Export(plan, layout, options.Progress.Warning) }
            : outcome;
    }

    private static FitData LoadData(RunPlan plan, IFitProgress progress)
    {
        var observation = ObservationFile.Read(plan.Settings.DataPath);
        var data = FitData.FromObservation(observation, plan.Settings.DataPath);
        if (data.GapSeconds > 0)
            progress.Warning($"{plan.Settings.DataPath} has {data.GapSeconds:F0} s of gaps; they are zero-filled without tapering and the noise model does not account for them");
        return data;
    }

    /// <summary>SHA-256 of the resolved configuration text, hex.</summary>
    internal static string Digest(string resolvedToml) => Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(resolvedToml)));

    private sealed record StartingPoint(long Iteration, long CheckpointIteration, IReadOnlyDictionary<string, byte[]?> WorkerStates,
        IReadOnlyDictionary<string, WindowSpectra> Templates, byte[]? NoiseState)
    {
        // Before the first iteration: no worker has state and every template is zero.
        public static StartingPoint Fresh(RunPlan plan) => new(0, 0,
            plan.Workers.ToDictionary(w => w.Id, _ => (byte[]?)null, StringComparer.Ordinal),
            plan.Workers.ToDictionary(w => w.Id, w => WindowSpectra.Zero(w.Bins, w.IncludesT), StringComparer.Ordinal), null);
    }
}
