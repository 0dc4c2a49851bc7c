using System.Collections.Immutable;
using System.Security.Cryptography;
using System.Text;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.Telemetry;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>Starts and resumes fits: prepares the run folder, loads the data, builds the actors, runs the coordinator
/// to the end (or until cancelled) and writes the catalogue.</summary>
public static partial class FitRunner
{
    /// <summary>Starts a fresh fit from a run configuration.</summary>
    /// <param name="configPath">The configuration file.</param>
    /// <param name="options">Progress, telemetry endpoint and cancellation.</param>
    /// <returns>How the run ended.</returns>
    /// <exception cref="InvalidInputException">The configuration, its data or its run folder is unusable.</exception>
    public static FitOutcome Start(string configPath, FitRunOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var plan = RunPlan.Load(configPath, options.Registry);
        var layout = new RunFolderLayout(plan.Settings.RunFolder);
        CheckRunFolderIsFree(configPath, layout);
        // Everything that can be wrong with the data is found before the run folder is touched, so a refused fit leaves
        // nothing behind that would block a retry.
        var data = LoadData(plan, options.Progress);
        var identity = DataIdentity.Of(plan.Settings.DataPath);
        bool unstarted = layout.HoldsUnstartedRun();
        Directory.CreateDirectory(layout.Root);
        using var runLock = RunLock.Acquire(layout);
        if (unstarted) layout.ClearUnstartedRun();
        string resolved = plan.ResolvedToml();
        AtomicFile.Write(layout.ResolvedConfig, overwrite: false, s => s.Write(Encoding.UTF8.GetBytes(resolved)));
        identity.Write(layout);
        return Run(plan, layout, Digest(resolved), data, FitPosition.Fresh(plan.Workers), options);
    }

    // A fresh fit needs a new or empty folder, or one whose earlier fit never completed an iteration (nothing to lose).
    private static void CheckRunFolderIsFree(string configPath, RunFolderLayout layout)
    {
        if (File.Exists(layout.Root))
            throw new InvalidInputException(configPath, "key 'run_folder'", $"{layout.Root} is a file, not a folder");
        if (!Directory.Exists(layout.Root) || layout.HoldsUnstartedRun()) return;
        if (File.Exists(layout.ResolvedConfig))
            throw new InvalidInputException(configPath, "key 'run_folder'", $"{layout.Root} holds another run; continue it with 'globalfit resume {layout.Root}' or choose another run_folder");
        if (Directory.EnumerateFileSystemEntries(layout.Root).Any())
            throw new InvalidInputException(configPath, "key 'run_folder'", $"{layout.Root} is not empty; choose a new or empty folder");
    }

    /// <summary>Continues a stopped fit from its newest intact checkpoint (or from the start when it never wrote one).</summary>
    /// <param name="runFolder">The run folder.</param>
    /// <param name="options">Progress, telemetry endpoint and cancellation.</param>
    /// <param name="iterations">A new total of iterations (extends a finished or stopped run; at least the iterations
    /// already checkpointed), or null to keep the run's. Written into <c>run.toml</c> before the run continues.</param>
    /// <exception cref="InvalidInputException">The folder is not a run, is running, or its checkpoints are unusable, or
    /// <paramref name="iterations"/> lies below the checkpointed iteration.</exception>
    public static FitOutcome Resume(string runFolder, FitRunOptions options, long? iterations = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        var layout = RunFolderLayout.OpenExisting(runFolder);
        using var runLock = RunLock.Acquire(layout);
        string resolved = File.ReadAllText(layout.ResolvedConfig);
        var plan = RunPlan.Load(layout.ResolvedConfig, options.Registry);
        // Checked before anything in the folder changes (run.toml included): a refused resume leaves the run as it was.
        var identity = DataIdentity.Verify(layout, plan.Settings.DataPath, options.AcceptNewData, options.Progress.Warning);
        if (iterations is { } total)
        {
            long done = CheckpointFile.Exists(layout.Root) ? CheckpointFile.Read(layout.Root, options.Progress.Warning).Iteration : 0;
            if (total < Math.Max(1, done))
                throw new InvalidInputException("--iterations", null, $"must be at least the {Math.Max(1, done)} iterations already checkpointed, got {total}");
            resolved = WithIterations(resolved, total, layout.ResolvedConfig);
            // The new total is checked before anything is written.
            plan = RunPlan.FromConfig(Configuration.ConfigDocument.Parse(resolved, layout.ResolvedConfig), layout.Root, options.Registry);
            AtomicFile.Write(layout.ResolvedConfig, overwrite: true, stream => stream.Write(Encoding.UTF8.GetBytes(resolved)));
        }
        if (plan.Settings.RunFolder != layout.Root)
            throw new InvalidInputException(layout.ResolvedConfig, "key 'run_folder'", $"names {plan.Settings.RunFolder}, but the run is in {layout.Root}; a moved run folder must have run_folder updated");
        string digest = Digest(resolved);
        FitPosition start;
        var store = new SampleStore(layout.Root);
        if (CheckpointFile.Exists(layout.Root))
        {
            start = CheckedPosition(CheckpointFile.Read(layout.Root, options.Progress.Warning, digest), plan, layout.Root);
            // Samples of iterations up to the checkpoint must all be in the store: resuming past a gap would leave it
            // out of the catalogue without a word.
            long committed = store.CommittedIteration;
            if (committed < start.Iteration)
                throw new InvalidInputException(store.SamplesFolder, null,
                    $"holds the samples of iterations 1…{committed} only, but the checkpoint is at iteration {start.Iteration}: the samples of iterations {committed + 1}…{start.Iteration} are lost");
        }
        else
        {
            start = FitPosition.Fresh(plan.Workers);
        }
        var data = LoadData(plan, options.Progress);
        store.TruncateAfter(start.Iteration);
        identity.Write(layout);
        return Run(plan, layout, digest, data, start, options);
    }

    private static FitOutcome Run(RunPlan plan, RunFolderLayout layout, string digest, FitData data, FitPosition start, FitRunOptions options)
    {
        var settings = plan.Settings;
        IFitWorker Load(string id, byte[]? state) => state is null ? plan.ClassOf(id).CreateWorker(id, settings.Seed) : plan.ClassOf(id).RestoreWorker(id, state);
        // The noise worker that gives the starting PSD is handed to its actor for its first load (from the same state),
        // so its per-bin arrays are built once; a restart after a failure loads afresh.
        var noiseId = plan.NoiseWorker.Id;
        var prebuilt = Load(noiseId, start.WorkerStates[noiseId]);
        var psd = InversePsd.From((IPsdSource)prebuilt, plan.Shape.BinCount);
        IFitWorker LoadOnce(string id, byte[]? state) => id == noiseId && Interlocked.Exchange(ref prebuilt, null) is { } built ? built : Load(id, state);
        var book = new ResidualBook(data, plan.Workers, psd.A, psd.E, psd.T);
        try
        {
            foreach (var (id, template) in start.Templates) book.Replace(id, template);
        }
        catch (ArgumentException e)
        {
            throw new InvalidInputException(CheckpointFile.LatestPath(layout.Root), null, $"the checkpoint's templates do not fit this run: {e.Message}", e);
        }
        var progress = new StatusRecordingProgress(options.Progress, layout, start.CheckpointIteration);
        progress.WriteState("running", start.Iteration, settings.Iterations, "");

        using var telemetry = TelemetrySession.Start(layout.Root, options.OtlpEndpoint);
        using var system = FitActorSystem.Create(settings.Threads);
        var residual = system.ActorOf(ResidualDataActor.Props(book), "residual-data");
        var store = system.ActorOf(SampleStoreActor.Props(new SampleStore(layout.Root)), "sample-store");
        var checkpointer = system.ActorOf(CheckpointerActor.Props(layout.Root), "checkpointer");
        var setup = new CoordinatorSetup(plan.StagePlan(digest), start, plan.Workers.ToDictionary(w => w.Id, w => w.Label, StringComparer.Ordinal),
            settings.Threads, residual, store, checkpointer, progress, LoadOnce)
        {
            RecordFailure = new WorkerFailureLog(layout.WorkerFailureLog).Record,
        };
        var coordinator = system.ActorOf(FitCoordinator.Props(setup), "fit-coordinator");
        using var stop = options.Cancellation.Register(() => coordinator.Tell(new StopFit()));
        var finished = coordinator.Ask<FitFinished>(new StartFit(), Timeout.InfiniteTimeSpan).GetAwaiter().GetResult();
        system.Terminate().Wait(TimeSpan.FromSeconds(10));
        var outcome = finished.Outcome;
        telemetry.Flush();
        if (telemetry.WriteFailure is { } lost)
            options.Progress.Warning($"telemetry could not be written ({lost}); the fit's samples and checkpoints are complete, but 'trace' lacks the spans from then on");
        progress.WriteState(outcome.Kind.StateName(), outcome.IterationsCompleted, settings.Iterations, outcome.Message, outcome.CheckpointIteration);
        return outcome.Kind == FitOutcomeKind.Completed
            ? outcome with { Catalogue = RunCatalogue.Export(plan, layout, options.Progress.Warning) }
            : outcome;
    }

    // A checkpoint that passed its checksum can still be inconsistent with the run (written by a damaged program, or
    // sealed by hand): every worker of the plan exactly once, nothing else, and templates that are whole.
    internal static FitPosition CheckedPosition(Checkpoints.RunCheckpoint checkpoint, RunPlan plan, string runFolder)
    {
        string path = CheckpointFile.LatestPath(runFolder);
        FitPosition position;
        try
        {
            position = FitPosition.From(checkpoint);
        }
        catch (ArgumentException e)
        {
            throw new InvalidInputException(path, null, $"the checkpoint is inconsistent: {e.Message}", e);
        }
        var planned = plan.Workers.Select(w => w.Id).ToHashSet(StringComparer.Ordinal);
        if (checkpoint.Workers.Length != planned.Count || !position.WorkerStates.Keys.All(planned.Contains))
            throw new InvalidInputException(path, null, $"the checkpoint holds {checkpoint.Workers.Length} worker states that do not match the run's {planned.Count} workers");
        return position;
    }

    private static FitData LoadData(RunPlan plan, IFitProgress progress)
    {
        foreach (string note in plan.Classes.SelectMany(c => c.Describe())) progress.Note(note);
        var observation = ObservationFile.Read(plan.Settings.DataPath);
        var data = FitData.FromObservation(observation, plan.Settings.DataPath);
        if (data.GapSeconds > 0)
            progress.Warning($"{plan.Settings.DataPath} has {data.GapSeconds:F0} s of gaps; they are zero-filled without tapering and the noise model does not account for them");
        return data;
    }

    /// <summary>SHA-256 of the resolved configuration text without its top-level <c>iterations</c> line, hex.</summary>
    /// <remarks>The total of iterations only says when to stop, so <c>resume --iterations</c> may change it under a
    /// checkpoint; every other setting decides what the iterations compute, and editing it refuses the checkpoint.</remarks>
    internal static string Digest(string resolvedToml) =>
        Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(IterationsLine().Replace(resolvedToml, "", 1))));

    // The top-level `iterations = N` line of a resolved configuration replaced by the new total.
    private static string WithIterations(string resolvedToml, long total, string path)
    {
        var match = IterationsLine().Match(resolvedToml);
        int firstSection = resolvedToml.IndexOf("\n[", StringComparison.Ordinal);
        if (!match.Success || (firstSection >= 0 && match.Index > firstSection))
            throw new InvalidInputException(path, "key 'iterations'", "missing from the resolved configuration; restore run.toml");
        return resolvedToml[..match.Index] + $"iterations = {total.ToString(System.Globalization.CultureInfo.InvariantCulture)}\n" + resolvedToml[(match.Index + match.Length)..];
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^iterations = [^\n]*\n", System.Text.RegularExpressions.RegexOptions.Multiline)]
    private static partial System.Text.RegularExpressions.Regex IterationsLine();
}
