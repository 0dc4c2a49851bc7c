using System.Diagnostics;
using Akka.Actor;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.NoiseFitting;
using GlobalFit.Engine.Telemetry;

namespace GlobalFit.Engine.Actors;

/// <summary>Runs the <see cref="NoiseWorker"/>: refits the noise PSD on the full residual and replies with the new inverse
/// PSDs for the residual-data actor. Runs on the compute dispatcher.</summary>
public sealed class NoiseActor : ReceiveActor
{
    /// <summary>The noise worker's id in telemetry, files and handovers.</summary>
    public const string WorkerId = "noise";

    private readonly Func<byte[]?, NoiseWorker> _load;
    private readonly int _binCount;
    private NoiseWorker? _worker;

    /// <summary>Creates the actor.</summary>
    /// <param name="load">Creates the worker fresh (null) or from state bytes.</param>
    /// <param name="binCount">One-sided bins of the record.</param>
    public NoiseActor(Func<byte[]?, NoiseWorker> load, int binCount)
    {
        _load = load;
        _binCount = binCount;
        Receive<LoadNoise>(m => Guarded(() => _worker = _load(m.State)));
        Receive<UpdateNoise>(m => Guarded(() => Handle(m)));
    }

    /// <summary>Props for the compute dispatcher.</summary>
    public static Props Props(Func<byte[]?, NoiseWorker> load, int binCount) =>
        Akka.Actor.Props.Create(() => new NoiseActor(load, binCount)).WithDispatcher(FitActorSystem.ComputeDispatcher);

    private static void Guarded(Action work)
    {
        try
        {
            work();
        }
        catch (Exception e) when (e is not WorkerFailedException)
        {
            throw new WorkerFailedException(WorkerId, e);
        }
    }

    private void Handle(UpdateNoise request)
    {
        var worker = _worker ?? throw new InvalidOperationException("noise worker received work before it was loaded");
        long started = Stopwatch.GetTimestamp();
        using var span = FitTracing.StartWorkerSpan(request.TraceParent, request.Iteration, request.StageIndex, WorkerId, WorkerId, "noise PSD");
        var update = worker.Update(request.Residual, request.Steps);
        var psd = InversePsd.From(worker, _binCount);
        byte[] state = worker.SaveState();
        long finished = Stopwatch.GetTimestamp();
        FitTelemetry.RecordWorkerResult(span, WorkerId, 0, update.Statistics.Steps,
            update.Statistics.Acceptance, Stopwatch.GetElapsedTime(started, finished).TotalMilliseconds,
            Stopwatch.GetElapsedTime(request.SentTimestamp, started).TotalMilliseconds);
        Sender.Tell(new NoiseUpdated(update.Samples with { Iteration = request.Iteration }, update.Statistics, psd, state, finished));
    }
}
