using System.Collections.Immutable;
using System.Diagnostics;
using Akka.Actor;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Engine.Actors;

/// <summary>Walks the blocked-Gibbs schedule: for each iteration, each stage in order, has the residual-data actor serve
/// every worker of the stage its residual, waits for all of them, routes handovers, commits the stage's templates
/// (and PSD), and at the end of the iteration appends the samples and, when due, checkpoints.</summary>
/// <remarks>
/// <para>Supervision: workers are children. A worker that throws is restarted, reloaded from its last committed state
/// (its state after its last completed stage) and asked again; its residual has not changed, so the retry is the same
/// computation. After <c>max_worker_failures</c> failures of one worker within one iteration the run stops: the last
/// complete iteration is checkpointed and the outcome names the worker and the error. Nothing appended or checkpointed
/// is ever rolled back.</para>
/// <para>Every input of a stage is fixed when the stage starts and results are committed only when all have arrived,
/// so the run's results do not depend on the order in which workers finish or on the number of threads.</para>
/// </remarks>
public sealed class FitCoordinator : ReceiveActor
{
    private const string NoiseId = NoiseActor.WorkerId;
    private readonly CoordinatorSetup _setup;
    private readonly RunPlan _plan;
    private readonly IActorRef _self;
    private readonly Dictionary<string, IActorRef> _workers = new(StringComparer.Ordinal);
    private readonly Dictionary<string, byte[]?> _committed;
    private readonly Dictionary<string, WindowSpectra> _templates;
    private readonly Dictionary<string, int> _failures = new(StringComparer.Ordinal);
    private readonly Dictionary<string, object> _outstanding = new(StringComparer.Ordinal);
    private readonly Dictionary<string, WorkerUpdated> _stageResults = new(StringComparer.Ordinal);
    private readonly Dictionary<string, HandoversAccepted> _stageAdoptions = new(StringComparer.Ordinal);
    private readonly List<SampleBlock> _iterationBlocks = [];
    private readonly List<(string WorkerId, double ComputeMs)> _slowest = [];
    private readonly Dictionary<string, WorkerStatistics> _latestStatistics = new(StringComparer.Ordinal);
    private IActorRef _noise = ActorRefs.Nobody;
    private IActorRef? _requester;
    private byte[]? _noiseCommitted;
    private NoiseUpdated? _stageNoise;
    private RunCheckpoint? _boundary;
    private (FitOutcomeKind Kind, string Message)? _pendingFinish;
    private long _completed;
    private long _checkpointIteration;
    private long _current;
    private int _stageIndex;
    private bool _stopRequested;
    private bool _finished;
    private Activity? _iterationSpan;
    private Activity? _stageSpan;
    private long _iterationStarted;
    private long _lastCheckpointTimestamp = Stopwatch.GetTimestamp();

    /// <summary>Creates the coordinator; it creates the worker and noise actors as its children.</summary>
    public FitCoordinator(CoordinatorSetup setup)
    {
        _setup = setup;
        _plan = setup.Plan;
        _self = Self;
        _committed = new Dictionary<string, byte[]?>(setup.WorkerStates, StringComparer.Ordinal);
        _templates = new Dictionary<string, WindowSpectra>(setup.Templates, StringComparer.Ordinal);
        _noiseCommitted = setup.NoiseState;
        _completed = setup.CompletedIterations;
        _checkpointIteration = setup.CheckpointIteration;
        _boundary = Snapshot();

        Receive<StartFit>(_ => { _requester = Sender; StartWorkers(); BeginIteration(); });
        Receive<StopFit>(_ => OnStop());
        Receive<WorkerUpdated>(OnWorkerUpdated);
        Receive<NoiseUpdated>(OnNoiseUpdated);
        Receive<HandoversAccepted>(OnHandoversAccepted);
        Receive<StageCommitted>(_ => OnStageCommitted());
        Receive<SamplesAppended>(OnSamplesAppended);
        Receive<CheckpointWritten>(OnCheckpointWritten);
        Receive<WorkerFailed>(OnWorkerFailed);
    }

    /// <summary>Props.</summary>
    public static Props Props(CoordinatorSetup setup) => Akka.Actor.Props.Create(() => new FitCoordinator(setup));

    /// <inheritdoc />
    protected override SupervisorStrategy SupervisorStrategy() => new OneForOneStrategy(error =>
    {
        if (error is WorkerFailedException failed)
        {
            _self.Tell(new WorkerFailed(failed.WorkerId, failed.InnerException ?? failed));
            return Directive.Restart;
        }
        return Directive.Escalate;
    });

    private void StartWorkers()
    {
        foreach (var descriptor in _plan.Workers)
        {
            var classPlan = _plan.ClassOf(descriptor.Id);
            string id = descriptor.Id;
            var actor = Context.ActorOf(WorkerActor.Props(id, classPlan.ClassId, descriptor.Label, state => _setup.CreateWorker(id, state)), ActorName(id));
            actor.Tell(new LoadWorker(_committed.GetValueOrDefault(id)));
            _workers[id] = actor;
        }
        _noise = Context.ActorOf(_setup.NoiseProps, "noise");
        _noise.Tell(new LoadNoise(_noiseCommitted));
    }

    private static string ActorName(string workerId) => "worker-" + workerId.Replace('/', '-');

    private void BeginIteration()
    {
        if (_stopRequested) { FinishAfterCheckpoint(FitOutcomeKind.Interrupted, ""); return; }
        if (_completed >= _plan.Settings.Iterations) { FinishAfterCheckpoint(FitOutcomeKind.Completed, ""); return; }
        _current = _completed + 1;
        _failures.Clear();
        _iterationBlocks.Clear();
        _slowest.Clear();
        _iterationStarted = Stopwatch.GetTimestamp();
        _iterationSpan = FitTelemetry.StartIteration(_current, _plan.Settings.Threads);
        _stageIndex = -1;
        NextStage();
    }

    private void NextStage()
    {
        _stageSpan?.Dispose();
        _stageSpan = null;
        _stageIndex++;
        if (_stageIndex == _plan.Schedule.Stages.Length) { EndIteration(); return; }
        var groups = _plan.Schedule.Stages[_stageIndex];
        _stageSpan = FitTracing.StartStage(_iterationSpan, _current, _stageIndex, groups);
        _stageResults.Clear();
        _stageAdoptions.Clear();
        _stageNoise = null;
        _outstanding.Clear();
        // Longest first (by each worker's compute time in its last update): the compute threads take requests in the
        // order they are sent, so the stage does not end with one long update running alone. Only the order of work
        // changes, never its inputs, so results are unaffected.
        var members = groups.SelectMany(g => g == FitSchedule.NoiseGroup ? [NoiseId] : _plan.GroupWorkers(g).Select(w => w.Id));
        foreach (string id in members.OrderByDescending(LastComputeMs).ThenBy(id => id, StringComparer.Ordinal))
            Serve(id);
    }

    private void Serve(string id)
    {
        string? parent = _stageSpan?.Id;
        if (id == NoiseId)
        {
            _outstanding[id] = "update";
            _setup.Residual.Tell(new ServeNoise(_setup.NoiseBins, _noise, _current, _stageIndex, _setup.NoiseSteps, parent), Self);
            return;
        }
        var descriptor = _plan.Worker(id);
        _outstanding[id] = "update";
        _setup.Residual.Tell(new ServeWorker(id, descriptor.IncludesT, _workers[id], _current, _stageIndex, _plan.ClassOf(id).StepsPerUpdate, parent), Self);
    }

    private void OnWorkerUpdated(WorkerUpdated message)
    {
        if (_finished || !_outstanding.Remove(message.WorkerId)) return;
        _stageResults[message.WorkerId] = message;
        _latestStatistics[message.WorkerId] = message.Update.Statistics;
        if (_outstanding.Count == 0) RouteHandovers();
    }

    private void OnNoiseUpdated(NoiseUpdated message)
    {
        if (_finished || !_outstanding.Remove(NoiseId)) return;
        _stageNoise = message;
        _latestStatistics[NoiseId] = message.Statistics;
        if (_outstanding.Count == 0) RouteHandovers();
    }

    // Compute time of each update of the current stage, by worker id.
    private Dictionary<string, double> StageComputeMs()
    {
        var compute = _stageResults.ToDictionary(r => r.Key, r => r.Value.Update.Statistics.WallTime.TotalMilliseconds, StringComparer.Ordinal);
        if (_stageNoise is { } noise) compute[NoiseId] = noise.Statistics.WallTime.TotalMilliseconds;
        return compute;
    }

    private double LastComputeMs(string id) => _latestStatistics.TryGetValue(id, out var statistics) ? statistics.WallTime.TotalMilliseconds : 0.0;

    private void RouteHandovers()
    {
        FitTracing.RecordStageWaits(StageComputeMs());
        var byTarget = _stageResults.Values.OrderBy(r => r.WorkerId, StringComparer.Ordinal)
            .SelectMany(r => r.Handovers)
            .Where(h => _workers.ContainsKey(h.TargetWorkerId))
            .GroupBy(h => h.TargetWorkerId, StringComparer.Ordinal)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .ToList();
        if (byTarget.Count == 0) { Commit(); return; }
        foreach (var group in byTarget)
        {
            var message = new AcceptHandovers([.. group]);
            _outstanding[group.Key] = message;
            _workers[group.Key].Tell(message);
        }
    }

    private void OnHandoversAccepted(HandoversAccepted message)
    {
        if (_finished || !_outstanding.Remove(message.WorkerId)) return;
        _stageAdoptions[message.WorkerId] = message;
        if (_outstanding.Count == 0) Commit();
    }

    private void Commit()
    {
        var templates = new List<KeyValuePair<string, WindowSpectra>>();
        foreach (var (id, result) in _stageResults.OrderBy(r => r.Key, StringComparer.Ordinal))
        {
            _committed[id] = result.State;
            _templates[id] = result.Update.Template;
            _iterationBlocks.Add(result.Update.Samples);
        }
        foreach (var (id, adoption) in _stageAdoptions.OrderBy(r => r.Key, StringComparer.Ordinal))
        {
            _committed[id] = adoption.State;
            _templates[id] = adoption.Template;
        }
        foreach (string id in _stageResults.Keys.Concat(_stageAdoptions.Keys).Distinct().Order(StringComparer.Ordinal))
            templates.Add(new(id, _templates[id]));
        InversePsd? psd = null;
        if (_stageNoise is { } noise)
        {
            _noiseCommitted = noise.State;
            _iterationBlocks.Add(noise.Samples);
            psd = noise.Psd;
        }
        var stageCompute = StageComputeMs();
        if (stageCompute.Count > 0)
        {
            var slowest = stageCompute.OrderByDescending(c => c.Value).ThenBy(c => c.Key, StringComparer.Ordinal).First();
            _slowest.Add((slowest.Key, slowest.Value));
        }
        _outstanding["residual"] = "commit";
        _setup.Residual.Tell(new CommitStage(templates, psd));
    }

    private void OnStageCommitted()
    {
        if (_finished || !_outstanding.Remove("residual")) return;
        NextStage();
    }

    private void EndIteration()
    {
        var blocks = _iterationBlocks.OrderBy(b => b.WorkerId, StringComparer.Ordinal).ToList();
        _outstanding["store"] = "append";
        _setup.Store.Tell(new AppendSamples(_current, blocks));
    }

    private void OnSamplesAppended(SamplesAppended message)
    {
        if (_finished || !_outstanding.Remove("store")) return;
        _completed = message.Iteration;
        _boundary = Snapshot();
        _iterationSpan?.Dispose();
        _iterationSpan = null;
        var wall = Stopwatch.GetElapsedTime(_iterationStarted);
        FitTelemetry.IterationDuration.Record(wall.TotalMilliseconds);
        bool due = _completed % _plan.Settings.CheckpointEvery == 0
            || _completed == _plan.Settings.Iterations
            || Stopwatch.GetElapsedTime(_lastCheckpointTimestamp).TotalMinutes >= _plan.Settings.CheckpointMinutes;
        _setup.Progress.IterationCompleted(Report(wall, due));
        if (due) WriteBoundaryCheckpoint();
        else BeginIteration();
    }

    private IterationReport Report(TimeSpan wall, bool checkpointed)
    {
        var perClass = ImmutableSortedDictionary.CreateBuilder<string, int>(StringComparer.Ordinal);
        double logLikelihood = 0;
        foreach (var (id, statistics) in _latestStatistics)
        {
            logLikelihood += statistics.LogLikelihood;
            if (id == NoiseId) continue;
            string classId = _plan.ClassOf(id).ClassId;
            perClass[classId] = perClass.GetValueOrDefault(classId) + statistics.SourceCount;
        }
        return new IterationReport(_completed, _plan.Settings.Iterations, wall, logLikelihood, perClass.ToImmutable(), [.. _slowest], checkpointed);
    }

    private RunCheckpoint Snapshot() => new(RunCheckpoint.CurrentFormatVersion, _completed, _setup.ConfigDigest,
        [.. _committed.OrderBy(w => w.Key, StringComparer.Ordinal).Select(w => new SavedWorkerState(w.Key, w.Value))],
        [.. _templates.OrderBy(t => t.Key, StringComparer.Ordinal).Select(t => SavedTemplate.From(t.Key, t.Value))],
        _noiseCommitted ?? []);

    private void WriteBoundaryCheckpoint()
    {
        _outstanding["checkpoint"] = "write";
        _setup.Checkpointer.Tell(new WriteCheckpoint(_boundary!));
    }

    private void OnCheckpointWritten(CheckpointWritten message)
    {
        if (!_outstanding.Remove("checkpoint")) return;
        if (message.Problem is null)
        {
            _checkpointIteration = message.Iteration;
            _lastCheckpointTimestamp = Stopwatch.GetTimestamp();
        }
        else
        {
            _setup.Progress.Warning($"checkpoint of iteration {message.Iteration} failed ({message.Problem}); the previous checkpoint (iteration {_checkpointIteration}) is intact");
        }
        if (_pendingFinish is { } finish) { Finish(finish.Kind, finish.Message); return; }
        BeginIteration();
    }

    // Checkpoints the last complete iteration if it is newer than the checkpoint on disk, then finishes.
    private void FinishAfterCheckpoint(FitOutcomeKind kind, string message)
    {
        _outstanding.Clear();
        _iterationSpan?.Dispose();
        _stageSpan?.Dispose();
        _iterationSpan = _stageSpan = null;
        if (_boundary is { } boundary && boundary.Iteration > _checkpointIteration && boundary.Iteration > 0)
        {
            _pendingFinish = (kind, message);
            WriteBoundaryCheckpoint();
            return;
        }
        Finish(kind, message);
    }

    private void Finish(FitOutcomeKind kind, string message)
    {
        _finished = true;
        _requester?.Tell(new FitFinished(new FitOutcome(kind, _completed, _checkpointIteration, message)));
    }

    private void OnStop()
    {
        if (_finished || _pendingFinish is not null) return;
        _stopRequested = true;
        // Between iterations (appending or checkpointing) the flag is seen at the next BeginIteration; mid-stage the
        // stage is abandoned, since the last complete iteration is already a consistent state.
        if (_outstanding.ContainsKey("store") || _outstanding.ContainsKey("checkpoint")) return;
        FinishAfterCheckpoint(FitOutcomeKind.Interrupted, "");
    }

    private void OnWorkerFailed(WorkerFailed failure)
    {
        if (_finished || _pendingFinish is not null) return;
        int count = _failures[failure.WorkerId] = _failures.GetValueOrDefault(failure.WorkerId) + 1;
        if (count > _plan.Settings.MaxWorkerFailures)
        {
            FinishAfterCheckpoint(FitOutcomeKind.Failed,
                $"worker {failure.WorkerId} failed {count} times in iteration {_current}; last error: {failure.Error.GetType().Name}: {failure.Error.Message}");
            return;
        }
        _setup.Progress.Warning($"worker {failure.WorkerId} failed in iteration {_current} ({failure.Error.GetType().Name}: {failure.Error.Message}); restarting it from its last committed state (attempt {count + 1})");
        if (failure.WorkerId == NoiseId)
        {
            _noise.Tell(new LoadNoise(_noiseCommitted));
            if (_outstanding.ContainsKey(NoiseId)) Serve(NoiseId);
            return;
        }
        var actor = _workers[failure.WorkerId];
        actor.Tell(new LoadWorker(_committed.GetValueOrDefault(failure.WorkerId)));
        if (_outstanding.TryGetValue(failure.WorkerId, out var pending))
        {
            if (pending is AcceptHandovers handovers) actor.Tell(handovers);
            else Serve(failure.WorkerId);
        }
    }
}
