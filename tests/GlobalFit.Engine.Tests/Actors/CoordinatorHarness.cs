using System.Collections.Concurrent;
using System.Numerics;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Actors;

/// <summary>A coordinator wired to a real residual-data actor, the stub class, the stub noise module and recording stand-ins.</summary>
internal sealed class CoordinatorHarness
{
    public static readonly FitDataShape Shape = new("stub data", 256, 5.0, 0.0);
    public static readonly Complex DataValue = new(10, 0);

    public CoordinatorHarness(ActorSystem system, int iterations, int maxWorkerFailures = 3)
    {
        Class = new StubSourceClass(("even", 0, new BinWindow(10, 20)), ("even", 2, new BinWindow(50, 20)), ("odd", 1, new BinWindow(25, 30)));
        var settings = new RunSettings { DataPath = "unused", RunFolder = "unused", Iterations = iterations, CheckpointEvery = 2, MaxWorkerFailures = maxWorkerFailures };
        var noise = new StubNoisePlan(Shape, Class.Log);
        var schedule = FitSchedule.Default([Class, noise]);
        Plan = RunPlan.Create(settings, Shape, [Class, noise], schedule);
        var data = Enumerable.Repeat(DataValue, Shape.BinCount).ToArray();
        var ones = Enumerable.Repeat(1.0, Shape.BinCount).ToArray();
        var book = new ResidualBook(FitData.FromSpectra(Shape, data, data, data), Plan.Workers, ones, ones, ones);
        var setup = new CoordinatorSetup(Plan.StagePlan("digest"), FitPosition.Fresh(Plan.Workers),
            Plan.Workers.ToDictionary(w => w.Id, w => w.Label), 2,
            system.ActorOf(ResidualDataActor.Props(book)),
            system.ActorOf(Props.Create(() => new StubStoreActor(Appended))),
            system.ActorOf(Props.Create(() => new StubCheckpointerActor(Checkpoints))),
            Progress,
            (id, state) => state is null ? Plan.ClassOf(id).CreateWorker(id, 1) : Plan.ClassOf(id).RestoreWorker(id, state))
        {
            RecordFailure = (id, error) => Failures.Enqueue((id, error)),
        };
        Coordinator = system.ActorOf(FitCoordinator.Props(setup));
    }

    public StubSourceClass Class { get; }

    public RunPlan Plan { get; }

    public IActorRef Coordinator { get; }

    public ConcurrentQueue<AppendSamples> Appended { get; } = new();

    public ConcurrentQueue<WriteCheckpoint> Checkpoints { get; } = new();

    public ConcurrentQueue<(string WorkerId, Exception Error)> Failures { get; } = new();

    public RecordingProgress Progress { get; } = new();
}
