using System.Diagnostics;
using Akka.Actor;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Engine.Actors;

/// <summary>Runs one <see cref="IFitWorker"/>: updates it against the residuals the coordinator sends and replies with
/// its template, samples, handovers and state. Runs on the compute dispatcher.</summary>
/// <remarks>An exception escapes to the coordinator's supervisor strategy, which restarts this actor and sends
/// <see cref="LoadWorker"/> with the last committed state before retrying, so a failed update leaves nothing behind.</remarks>
public sealed class WorkerActor : ReceiveActor
{
    private readonly string _workerId;
    private readonly string _classId;
    private readonly string _label;
    private readonly Func<byte[]?, IFitWorker> _load;
    private IFitWorker? _worker;

    /// <summary>Creates the actor.</summary>
    /// <param name="workerId">The worker's id.</param>
    /// <param name="classId">Its class.</param>
    /// <param name="label">Its label for telemetry.</param>
    /// <param name="load">Creates the worker fresh (null) or from state bytes.</param>
    public WorkerActor(string workerId, string classId, string label, Func<byte[]?, IFitWorker> load)
    {
        _workerId = workerId;
        _classId = classId;
        _label = label;
        _load = load;
        Receive<LoadWorker>(m => Guarded(() => _worker = _load(m.State)));
        Receive<UpdateWorker>(m => Guarded(() => Handle(m)));
        Receive<AcceptHandovers>(m => Guarded(() =>
        {
            var worker = Loaded();
            worker.Accept(m.Handovers);
            Sender.Tell(new HandoversAccepted(_workerId, new AdoptionResult(worker.CurrentTemplate(), worker.SaveState())));
        }));
    }

    /// <summary>Props for the compute dispatcher.</summary>
    public static Props Props(string workerId, string classId, string label, Func<byte[]?, IFitWorker> load) =>
        Akka.Actor.Props.Create(() => new WorkerActor(workerId, classId, label, load)).WithDispatcher(FitActorSystem.ComputeDispatcher);

    private void Handle(UpdateWorker request)
    {
        var worker = Loaded();
        long started = Stopwatch.GetTimestamp();
        using var span = FitTracing.StartWorkerSpan(request.TraceParent, request.Iteration, request.StageIndex, _workerId, _classId, _label);
        var update = worker.Update(request.Residual, request.Steps);
        var handovers = worker.TakeHandovers();
        if (handovers.Count > 0) update = update with { Template = worker.CurrentTemplate() };
        update = update with { Samples = update.Samples with { Iteration = request.Iteration } };
        long saving = Stopwatch.GetTimestamp();
        byte[] state = worker.SaveState();
        long finished = Stopwatch.GetTimestamp();
        var statistics = update.Statistics;
        FitTelemetry.RecordWorkerPhases(span, [.. statistics.Phases.Select(p => (p.Name, p.Milliseconds, p.Count, p.IsKernel))],
            Stopwatch.GetElapsedTime(saving, finished).TotalMilliseconds);
        FitTelemetry.RecordWorkerResult(span, _workerId, statistics.SourceCount,
            statistics.Steps, statistics.Acceptance, Stopwatch.GetElapsedTime(started, finished).TotalMilliseconds,
            Stopwatch.GetElapsedTime(request.SentTimestamp, started).TotalMilliseconds);
        Sender.Tell(new WorkerUpdated(_workerId, new UpdateResult(update, handovers, state)));
    }

    // Tags the exception with the worker id for the coordinator's supervisor strategy.
    private void Guarded(Action work)
    {
        try
        {
            work();
        }
        catch (Exception e) when (e is not WorkerFailedException)
        {
            throw new WorkerFailedException(_workerId, e);
        }
    }

    private IFitWorker Loaded() => _worker ?? throw new InvalidOperationException($"worker {_workerId} received work before it was loaded");
}
