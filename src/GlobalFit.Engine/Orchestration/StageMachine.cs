using System.Collections.Immutable;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>The blocked-Gibbs walk of a run, without actors or threads: for each iteration, each stage in order, it asks
/// every worker of the stage for an update, waits for all of them, routes handovers, commits the stage's templates (and
/// PSD), and at the end of the iteration appends the samples and, when due, checkpoints. The host carries the requests
/// out and reports back through the <c>On…</c> methods.</summary>
/// <remarks>
/// <para>Every input of a stage is fixed when the stage starts and results are committed only when all have arrived,
/// in ordinal worker-id order, so the run's results do not depend on the order in which answers arrive.</para>
/// <para>Failures: a worker that fails is reloaded from its last committed state (its state after its last completed
/// stage) and asked again; its residual has not changed, so the retry is the same computation. After
/// <see cref="StagePlan.MaxWorkerFailures"/> failures of one worker within one iteration the run stops: the last complete
/// iteration is checkpointed and the outcome names the worker and the error. Nothing appended or checkpointed is ever
/// rolled back.</para>
/// <para>Not thread-safe: the host calls it from one thread (the coordinator actor's).</para>
/// </remarks>
public sealed class StageMachine
{
    private readonly StagePlan _plan;
    private readonly IStageHost _host;
    private readonly TimeProvider _time;
    private readonly Dictionary<string, StageMember> _members;
    private readonly SortedDictionary<string, byte[]?> _committed;
    private readonly SortedDictionary<string, WindowSpectra> _templates;
    private readonly PendingWork _pending = new();
    private readonly Dictionary<string, int> _failures = new(StringComparer.Ordinal);
    private readonly SortedDictionary<string, UpdateResult> _stageResults = new(StringComparer.Ordinal);
    private readonly SortedDictionary<string, AdoptionResult> _stageAdoptions = new(StringComparer.Ordinal);
    private readonly List<SampleBlock> _iterationBlocks = [];
    private readonly List<(string WorkerId, double ComputeMs)> _slowest = [];
    private readonly SortedDictionary<string, WorkerStatistics> _latestStatistics = new(StringComparer.Ordinal);
    private RunCheckpoint _boundary;
    private (FitOutcomeKind Kind, string Message)? _pendingFinish;
    private long _completed;
    private long _checkpointIteration;
    private long _current;
    private int _stageIndex;
    private bool _started;
    private bool _stopRequested;
    private bool _finished;
    private long _iterationStarted;
    private long _lastCheckpoint;

    /// <summary>Creates a machine positioned at <paramref name="start"/>.</summary>
    /// <param name="plan">The stages and limits.</param>
    /// <param name="start">Where the run stands.</param>
    /// <param name="host">Carries out the requests.</param>
    /// <param name="time">The clock for iteration times and the checkpoint interval.</param>
    /// <exception cref="ArgumentException">A worker appears in two stages, or <paramref name="start"/> lacks a worker of the plan.</exception>
    public StageMachine(StagePlan plan, FitPosition start, IStageHost host, TimeProvider time)
    {
        _plan = plan ?? throw new ArgumentNullException(nameof(plan));
        ArgumentNullException.ThrowIfNull(start);
        _host = host ?? throw new ArgumentNullException(nameof(host));
        _time = time ?? throw new ArgumentNullException(nameof(time));
        _members = new Dictionary<string, StageMember>(StringComparer.Ordinal);
        foreach (var member in plan.Members)
        {
            if (!_members.TryAdd(member.WorkerId, member)) throw new ArgumentException($"worker {member.WorkerId} appears in more than one stage", nameof(plan));
            if (!start.WorkerStates.ContainsKey(member.WorkerId)) throw new ArgumentException($"the starting position lacks worker {member.WorkerId}", nameof(start));
        }
        _committed = new SortedDictionary<string, byte[]?>(start.WorkerStates, StringComparer.Ordinal);
        _templates = new SortedDictionary<string, WindowSpectra>(start.Templates, StringComparer.Ordinal);
        _completed = start.Iteration;
        _checkpointIteration = start.CheckpointIteration;
        _boundary = Snapshot();
        _lastCheckpoint = time.GetTimestamp();
    }

    /// <summary>Iterations completed so far.</summary>
    public long CompletedIterations => _completed;

    /// <summary>Whether the run is over (<see cref="IStageHost.Finished"/> was called).</summary>
    public bool IsFinished => _finished;

    /// <summary>Loads every worker and starts the first iteration (or, when a stop was requested before, finishes).</summary>
    public void Start()
    {
        _started = true;
        foreach (var (id, state) in _committed) _host.LoadWorker(id, state);
        BeginIteration();
    }

    /// <summary>A worker finished its update.</summary>
    public void OnUpdated(string workerId, UpdateResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        if (_finished || !_pending.Complete<UpdateTask>(workerId)) return;
        _stageResults[workerId] = result;
        _latestStatistics[workerId] = result.Update.Statistics;
        if (_pending.WorkersDone) RouteHandovers();
    }

    /// <summary>A worker adopted the handovers delivered to it.</summary>
    public void OnAdopted(string workerId, AdoptionResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        if (_finished || !_pending.Complete<AdoptionTask>(workerId)) return;
        _stageAdoptions[workerId] = result;
        if (_pending.WorkersDone) Commit();
    }

    /// <summary>The stage's results are swapped in.</summary>
    public void OnCommitted()
    {
        if (_finished || !_pending.Complete(PendingStep.Commit)) return;
        NextStage();
    }

    /// <summary>The iteration's samples are on disk.</summary>
    public void OnAppended(long iteration)
    {
        if (_finished || !_pending.Complete(PendingStep.Append)) return;
        _completed = iteration;
        _boundary = Snapshot();
        var wall = _time.GetElapsedTime(_iterationStarted);
        bool due = _completed % _plan.CheckpointEveryIterations == 0
            || _completed == _plan.Iterations
            || _time.GetElapsedTime(_lastCheckpoint).TotalMinutes >= _plan.CheckpointMinutes;
        _host.IterationCompleted(Report(wall, due));
        if (due) WriteBoundaryCheckpoint();
        else BeginIteration();
    }

    /// <summary>The iteration's samples could not be written: the run stops at once, with the last good checkpoint kept
    /// (a resume cuts the store back to it).</summary>
    /// <param name="iteration">The iteration whose samples were being appended.</param>
    /// <param name="problem">The file and the cause.</param>
    public void OnAppendFailed(long iteration, string problem)
    {
        if (_finished || !_pending.Complete(PendingStep.Append)) return;
        Finish(FitOutcomeKind.WriteFailed, $"the samples of iteration {iteration} could not be written: {problem}");
    }

    /// <summary>A checkpoint write ended; <paramref name="problem"/> is null when it succeeded. A failed write stops the
    /// run: the previous checkpoint is intact, and going on would only pile up work no checkpoint keeps.</summary>
    public void OnCheckpointWritten(long iteration, string? problem)
    {
        if (_finished || !_pending.Complete(PendingStep.Checkpoint)) return;
        if (problem is not null)
        {
            Finish(FitOutcomeKind.WriteFailed, $"the checkpoint of iteration {iteration} could not be written: {problem}");
            return;
        }
        _checkpointIteration = iteration;
        _lastCheckpoint = _time.GetTimestamp();
        if (_pendingFinish is { } finish) { Finish(finish.Kind, finish.Message); return; }
        BeginIteration();
    }

    /// <summary>A worker threw while updating or adopting.</summary>
    public void OnWorkerFailed(string workerId, Exception error)
    {
        ArgumentNullException.ThrowIfNull(error);
        if (_finished || _pendingFinish is not null) return;
        int count = _failures[workerId] = _failures.GetValueOrDefault(workerId) + 1;
        if (count > _plan.MaxWorkerFailures)
        {
            FinishAfterCheckpoint(FitOutcomeKind.Failed,
                $"worker {workerId} failed {count} times in iteration {_current}; last error: {error.GetType().Name}: {error.Message}");
            return;
        }
        _host.Warning($"worker {workerId} failed in iteration {_current} ({error.GetType().Name}: {error.Message}); restarting it from its last committed state (attempt {count + 1})");
        _host.LoadWorker(workerId, _committed.GetValueOrDefault(workerId));
        switch (_pending.TaskOf(workerId))
        {
            case UpdateTask: _host.RequestUpdate(workerId, _current, _stageIndex, _members[workerId].Steps); break;
            case AdoptionTask adoption: _host.DeliverHandovers(workerId, adoption.Handovers); break;
        }
    }

    /// <summary>Stop as soon as the run is consistent: the last complete iteration is checkpointed and the run finishes.</summary>
    public void OnStopRequested()
    {
        if (_finished || _pendingFinish is not null) return;
        _stopRequested = true;
        if (!_started) return; // a signal that came while the data were loading: the start finishes at once
        // Between iterations (appending or checkpointing) the flag is seen at the next iteration; mid-stage the stage is
        // abandoned, since the last complete iteration is already a consistent state.
        if (_pending.Step is PendingStep.Append or PendingStep.Checkpoint) return;
        FinishAfterCheckpoint(FitOutcomeKind.Interrupted, "");
    }

    private void BeginIteration()
    {
        if (_stopRequested) { FinishAfterCheckpoint(FitOutcomeKind.Interrupted, ""); return; }
        if (_completed >= _plan.Iterations) { FinishAfterCheckpoint(FitOutcomeKind.Completed, ""); return; }
        _current = _completed + 1;
        _failures.Clear();
        _iterationBlocks.Clear();
        _slowest.Clear();
        _iterationStarted = _time.GetTimestamp();
        _host.IterationStarted(_current);
        _stageIndex = -1;
        NextStage();
    }

    private void NextStage()
    {
        _stageIndex++;
        if (_stageIndex == _plan.Stages.Length) { EndIteration(); return; }
        var stage = _plan.Stages[_stageIndex];
        _host.StageStarted(_current, _stageIndex, stage);
        _stageResults.Clear();
        _stageAdoptions.Clear();
        if (stage.Members.IsEmpty) { RouteHandovers(); return; }
        // Longest first (by each worker's compute time in its last update): the compute threads take requests in the
        // order they are sent, so the stage does not end with one long update running alone. Only the order of work
        // changes, never its inputs, so results are unaffected.
        var order = stage.Members.OrderByDescending(m => LastComputeMs(m.WorkerId)).ThenBy(m => m.WorkerId, StringComparer.Ordinal).ToList();
        foreach (var member in order) _pending.Expect(member.WorkerId, UpdateTask.Instance);
        foreach (var member in order) _host.RequestUpdate(member.WorkerId, _current, _stageIndex, member.Steps);
    }

    private double LastComputeMs(string id) => _latestStatistics.TryGetValue(id, out var statistics) ? statistics.WallTime.TotalMilliseconds : 0.0;

    private Dictionary<string, double> StageComputeMs() =>
        _stageResults.ToDictionary(r => r.Key, r => r.Value.Update.Statistics.WallTime.TotalMilliseconds, StringComparer.Ordinal);

    private void RouteHandovers()
    {
        _host.StageFinished(StageComputeMs());
        var byTarget = _stageResults.Values
            .SelectMany(r => r.Handovers)
            .Where(h => _members.ContainsKey(h.TargetWorkerId))
            .GroupBy(h => h.TargetWorkerId, StringComparer.Ordinal)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .ToList();
        if (byTarget.Count == 0) { Commit(); return; }
        foreach (var group in byTarget) _pending.Expect(group.Key, new AdoptionTask([.. group]));
        foreach (var group in byTarget) _host.DeliverHandovers(group.Key, ((AdoptionTask)_pending.TaskOf(group.Key)!).Handovers);
    }

    private void Commit()
    {
        InversePsd? psd = null;
        foreach (var (id, result) in _stageResults)
        {
            _committed[id] = result.State;
            if (result.Update.Template is { } template) _templates[id] = template;
            if (result.Update.Psd is { } refitted) psd = refitted;
            _iterationBlocks.Add(result.Update.Samples);
        }
        foreach (var (id, adoption) in _stageAdoptions)
        {
            _committed[id] = adoption.State;
            if (adoption.Template is { } template) _templates[id] = template;
        }
        var changed = _stageResults.Keys.Concat(_stageAdoptions.Keys).Distinct().Where(_templates.ContainsKey).Order(StringComparer.Ordinal)
            .Select(id => new KeyValuePair<string, WindowSpectra>(id, _templates[id])).ToList();
        var stageCompute = StageComputeMs();
        if (stageCompute.Count > 0)
        {
            var slowest = stageCompute.OrderByDescending(c => c.Value).ThenBy(c => c.Key, StringComparer.Ordinal).First();
            _slowest.Add((slowest.Key, slowest.Value));
        }
        _pending.Expect(PendingStep.Commit);
        _host.CommitStage(changed, psd);
    }

    private void EndIteration()
    {
        var blocks = _iterationBlocks.OrderBy(b => b.WorkerId, StringComparer.Ordinal).ToList();
        _pending.Expect(PendingStep.Append);
        _host.AppendSamples(_current, blocks);
    }

    private IterationReport Report(TimeSpan wall, bool checkpointed)
    {
        var perClass = ImmutableSortedDictionary.CreateBuilder<string, int>(StringComparer.Ordinal);
        double logLikelihood = 0;
        foreach (var (id, statistics) in _latestStatistics)
        {
            logLikelihood += statistics.LogLikelihood;
            var member = _members[id];
            if (member.Role != WorkerRole.Sources) continue;
            perClass[member.ClassId] = perClass.GetValueOrDefault(member.ClassId) + statistics.SourceCount;
        }
        return new IterationReport(_completed, _plan.Iterations, wall, logLikelihood, perClass.ToImmutable(), [.. _slowest], checkpointed);
    }

    private RunCheckpoint Snapshot() => new(RunCheckpoint.CurrentFormatVersion, _completed, _plan.ConfigDigest,
        [.. _committed.Select(w => new SavedWorkerState(w.Key, w.Value))],
        [.. _templates.Select(t => SavedTemplate.From(t.Key, t.Value))]);

    private void WriteBoundaryCheckpoint()
    {
        _pending.Expect(PendingStep.Checkpoint);
        _host.WriteCheckpoint(_boundary);
    }

    // Checkpoints the last complete iteration if it is newer than the checkpoint on disk, then finishes.
    private void FinishAfterCheckpoint(FitOutcomeKind kind, string message)
    {
        _pending.Clear();
        if (_boundary.Iteration > _checkpointIteration && _boundary.Iteration > 0)
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
        _host.Finished(new FitOutcome(kind, _completed, _checkpointIteration, message));
    }
}
