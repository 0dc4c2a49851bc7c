using System.Collections.Concurrent;
using System.Numerics;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.NoiseFitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Actors;

/// <summary>A coordinator wired to a real residual-data actor, the stub class and recording stand-ins.</summary>
internal sealed class CoordinatorHarness
{
    public static readonly FitDataShape Shape = new("stub data", 256, 5.0, 0.0);
    public static readonly Complex DataValue = new(10, 0);

    public CoordinatorHarness(ActorSystem system, int iterations, int maxWorkerFailures = 3)
    {
        Class = new StubSourceClass(("even", 0, new BinWindow(10, 20)), ("even", 2, new BinWindow(50, 20)), ("odd", 1, new BinWindow(25, 30)));
        var settings = new RunSettings { DataPath = "unused", RunFolder = "unused", Iterations = iterations, CheckpointEvery = 2, MaxWorkerFailures = maxWorkerFailures };
        var noise = NoiseFitSettings.FromConfig(ConfigDocument.Parse("[noise]\n", "test").GetTable("noise")!, Shape);
        var schedule = FitSchedule.Default([Class]);
        Plan = RunPlan.Create(settings, Shape, [Class], noise, schedule);
        var data = Enumerable.Repeat(DataValue, Shape.BinCount).ToArray();
        var ones = Enumerable.Repeat(1.0, Shape.BinCount).ToArray();
        var book = new ResidualBook(FitData.FromSpectra(Shape, data, data, data), Plan.Workers.Select(w => (w.Id, w.Bins, w.IncludesT)), ones, ones, ones);
        var setup = new CoordinatorSetup(Plan, "digest", 0, 0,
            Plan.Workers.ToDictionary(w => w.Id, _ => (byte[]?)null),
            Plan.Workers.ToDictionary(w => w.Id, w => WindowSpectra.Zero(w.Bins, w.IncludesT)),
            null,
            system.ActorOf(ResidualDataActor.Props(book)),
            system.ActorOf(Props.Create(() => new StubStoreActor(Appended))),
            system.ActorOf(Props.Create(() => new StubCheckpointerActor(Checkpoints))),
            Progress,
            (id, state) => state is null ? Class.CreateWorker(id, 1) : Class.RestoreWorker(id, state),
            Props.Create(() => new StubNoiseActor(Shape.BinCount, Class.Log)),
            new BinWindow(0, Shape.BinCount),
            2);
        Coordinator = system.ActorOf(FitCoordinator.Props(setup));
    }

    public StubSourceClass Class { get; }

    public RunPlan Plan { get; }

    public IActorRef Coordinator { get; }

    public ConcurrentQueue<AppendSamples> Appended { get; } = new();

    public ConcurrentQueue<WriteCheckpoint> Checkpoints { get; } = new();

    public RecordingProgress Progress { get; } = new();
}
