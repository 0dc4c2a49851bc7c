using System.Collections.Concurrent;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Actors;

/// <summary>Stand-ins for the store and checkpointer actors, the noise module, and a progress sink, that record what they get.</summary>
internal sealed class StubStoreActor : ReceiveActor
{
    public StubStoreActor(ConcurrentQueue<AppendSamples> appended) =>
        Receive<AppendSamples>(m => { appended.Enqueue(m); Sender.Tell(new SamplesAppended(m.Iteration)); });
}

internal sealed class StubCheckpointerActor : ReceiveActor
{
    public StubCheckpointerActor(ConcurrentQueue<WriteCheckpoint> written) =>
        Receive<WriteCheckpoint>(m => { written.Enqueue(m); Sender.Tell(new CheckpointWritten(m.Checkpoint.Iteration, null)); });
}

/// <summary>A stand-in noise module: one <see cref="WorkerRole.Noise"/> worker over every bin that logs each update with
/// the residual it saw (into the stub class's log, so the schedule can be checked) and serves unit inverse PSDs.</summary>
internal sealed class StubNoisePlan(FitDataShape shape, ConcurrentQueue<StubSourceClass.UpdateRecord> log) : IFitSourceClassPlan
{
    public string ClassId => "noise";

    public IReadOnlyList<WorkerGroup> Groups { get; } =
        [new WorkerGroup("noise", [new WorkerDescriptor("noise", new BinWindow(0, shape.BinCount), "noise PSD", false, WorkerRole.Noise)])];

    public int StepsPerUpdate => 2;

    public IFitWorker CreateWorker(string workerId, ulong runSeed) => new Worker(shape, log, 0);

    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state) => new Worker(shape, log, BitConverter.ToInt64(state.Span));

    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) => throw new NotSupportedException();

    public void WriteResolved(ResolvedConfigWriter writer) { }

    private sealed class Worker(FitDataShape shape, ConcurrentQueue<StubSourceClass.UpdateRecord> log, long updates) : IFitWorker
    {
        private readonly double[] _ones = Enumerable.Repeat(1.0, shape.BinCount).ToArray();
        private long _updates = updates;

        public string Id => "noise";

        public BinWindow Bins => new(0, shape.BinCount);

        public bool IncludesT => false;

        public WorkerUpdate Update(WorkerResidual residual, int steps)
        {
            _updates++;
            log.Enqueue(new StubSourceClass.UpdateRecord("noise", _updates, residual.Spectra.A[0]));
            return new WorkerUpdate(null, new SampleBlock("noise", "noise", 0, ["level"], [1], [1.0], [0.0]),
                new WorkerStatistics(steps, _updates, 0, 0, 1, TimeSpan.Zero), new InversePsd(_ones, _ones, _ones));
        }

        public WindowSpectra? CurrentTemplate() => null;

        public byte[] SaveState() => BitConverter.GetBytes(_updates);

        public IReadOnlyList<Handover> TakeHandovers() => [];

        public void Accept(IReadOnlyList<Handover> handovers) { }
    }
}

internal sealed class RecordingProgress : IFitProgress
{
    public ConcurrentQueue<IterationReport> Reports { get; } = new();

    public ConcurrentQueue<string> Warnings { get; } = new();

    public void IterationCompleted(IterationReport report) => Reports.Enqueue(report);

    public void Warning(string message) => Warnings.Enqueue(message);
}
