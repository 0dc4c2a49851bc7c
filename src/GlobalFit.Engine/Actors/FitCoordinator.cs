using System.Diagnostics;
using Akka.Actor;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Engine.Actors;

/// <summary>Runs a <see cref="StageMachine"/> as an actor: creates one worker actor per worker, turns the machine's
/// requests into messages to the workers, the residual-data actor, the sample store and the checkpointer, feeds their
/// answers back, and keeps the telemetry spans of iterations and stages.</summary>
/// <remarks>Supervision: workers are children; a worker that throws is restarted (its actor) and the machine decides
/// what follows (reload from its committed state and retry, or stop the run).</remarks>
public sealed class FitCoordinator : ReceiveActor, IStageHost
{
    private readonly CoordinatorSetup _setup;
    private readonly StageMachine _machine;
    private readonly IActorRef _self;
    private readonly Dictionary<string, IActorRef> _workers = new(StringComparer.Ordinal);
    private readonly Dictionary<string, StageMember> _members;
    private IActorRef? _requester;
    private Activity? _iterationSpan;
    private Activity? _stageSpan;

    /// <summary>Creates the coordinator; it creates the worker actors as its children when the fit starts.</summary>
    public FitCoordinator(CoordinatorSetup setup)
    {
        _setup = setup;
        _self = Self;
        _members = setup.Plan.Members.ToDictionary(m => m.WorkerId, StringComparer.Ordinal);
        _machine = new StageMachine(setup.Plan, setup.Start, this, TimeProvider.System);

        Receive<StartFit>(_ => { _requester = Sender; _machine.Start(); });
        Receive<StopFit>(_ => _machine.OnStopRequested());
        Receive<WorkerUpdated>(m => _machine.OnUpdated(m.WorkerId, m.Result));
        Receive<HandoversAccepted>(m => _machine.OnAdopted(m.WorkerId, m.Result));
        Receive<StageCommitted>(_ => _machine.OnCommitted());
        Receive<SamplesAppended>(m =>
        {
            if (m.Problem is null) _machine.OnAppended(m.Iteration);
            else _machine.OnAppendFailed(m.Iteration, m.Problem);
        });
        Receive<CheckpointWritten>(m => _machine.OnCheckpointWritten(m.Iteration, m.Problem));
        Receive<WorkerFailed>(m => _machine.OnWorkerFailed(m.WorkerId, m.Error));
    }

    /// <summary>Props.</summary>
    public static Props Props(CoordinatorSetup setup) => Akka.Actor.Props.Create(() => new FitCoordinator(setup));

    /// <inheritdoc />
    // Akka's own logging of the failure is off: it would print the stack trace on the terminal. The trace goes to the
    // run's failure log and to telemetry; the terminal gets the one-line warning of the stage machine.
    protected override SupervisorStrategy SupervisorStrategy() => new OneForOneStrategy(-1, -1, error =>
    {
        if (error is WorkerFailedException failed)
        {
            var cause = failed.InnerException ?? failed;
            FitTelemetry.RecordWorkerFailure(failed.WorkerId, cause);
            _setup.RecordFailure(failed.WorkerId, cause);
            _self.Tell(new WorkerFailed(failed.WorkerId, cause));
            return Directive.Restart;
        }
        return Directive.Escalate;
    }, loggingEnabled: false);

    void IStageHost.LoadWorker(string workerId, byte[]? state)
    {
        if (!_workers.TryGetValue(workerId, out var actor))
        {
            var member = _members[workerId];
            actor = Context.ActorOf(WorkerActor.Props(workerId, member.ClassId, _setup.Labels[workerId], s => _setup.CreateWorker(workerId, s)),
                "worker-" + workerId.Replace('/', '-'));
            _workers[workerId] = actor;
        }
        actor.Tell(new LoadWorker(state));
    }

    void IStageHost.RequestUpdate(string workerId, long iteration, int stageIndex, int steps) =>
        _setup.Residual.Tell(new ServeWorker(workerId, _workers[workerId], iteration, stageIndex, steps, _stageSpan?.Id), Self);

    void IStageHost.DeliverHandovers(string workerId, IReadOnlyList<Handover> handovers) =>
        _workers[workerId].Tell(new AcceptHandovers(handovers));

    void IStageHost.CommitStage(IReadOnlyList<KeyValuePair<string, WindowSpectra>> templates, InversePsd? psd) =>
        _setup.Residual.Tell(new CommitStage(templates, psd));

    void IStageHost.AppendSamples(long iteration, IReadOnlyList<SampleBlock> blocks)
    {
        EndStageSpan();
        _setup.Store.Tell(new AppendSamples(iteration, blocks));
    }

    void IStageHost.WriteCheckpoint(RunCheckpoint checkpoint) => _setup.Checkpointer.Tell(new WriteCheckpoint(checkpoint));

    void IStageHost.StageStarted(long iteration, int stageIndex, Stage stage)
    {
        EndStageSpan();
        _stageSpan = FitTracing.StartStage(_iterationSpan, iteration, stageIndex, stage.Groups);
    }

    void IStageHost.StageFinished(IReadOnlyDictionary<string, double> computeMs) => FitTracing.RecordStageWaits(computeMs);

    void IStageHost.IterationStarted(long iteration) => _iterationSpan = FitTelemetry.StartIteration(iteration, _setup.Threads);

    void IStageHost.IterationCompleted(IterationReport report)
    {
        EndSpans();
        FitTelemetry.IterationDuration.Record(report.WallTime.TotalMilliseconds);
        _setup.Progress.IterationCompleted(report);
    }

    void IStageHost.Warning(string message) => _setup.Progress.Warning(message);

    void IStageHost.Finished(FitOutcome outcome)
    {
        EndSpans();
        _requester?.Tell(new FitFinished(outcome));
    }

    private void EndStageSpan()
    {
        _stageSpan?.Dispose();
        _stageSpan = null;
    }

    private void EndSpans()
    {
        EndStageSpan();
        _iterationSpan?.Dispose();
        _iterationSpan = null;
    }
}
