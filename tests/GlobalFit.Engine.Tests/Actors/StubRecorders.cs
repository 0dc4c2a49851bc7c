using System.Collections.Concurrent;
using Akka.Actor;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Engine.Tests.Actors;

/// <summary>Stand-ins for the store, checkpointer and noise actors, and a progress sink, that record what they get.</summary>
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

/// <summary>Replies to every noise update with unit inverse PSDs and logs the call, so the schedule can be checked.</summary>
internal sealed class StubNoiseActor : ReceiveActor
{
    public StubNoiseActor(int binCount, ConcurrentQueue<StubSourceClass.UpdateRecord> log)
    {
        var ones = Enumerable.Repeat(1.0, binCount).ToArray();
        long updates = 0;
        Receive<LoadNoise>(_ => { });
        Receive<UpdateNoise>(m =>
        {
            updates++;
            log.Enqueue(new StubSourceClass.UpdateRecord("noise", updates, m.Residual.A[0]));
            Sender.Tell(new NoiseUpdated(new SampleBlock("noise", "noise", m.Iteration, ["level"], [1], [1.0], [0.0]),
                new WorkerStatistics(m.Steps, updates, 0, 0, 1, TimeSpan.Zero), new InversePsd(ones, ones, ones), BitConverter.GetBytes(updates), 0));
        });
    }
}

internal sealed class RecordingProgress : IFitProgress
{
    public ConcurrentQueue<IterationReport> Reports { get; } = new();

    public ConcurrentQueue<string> Warnings { get; } = new();

    public void IterationCompleted(IterationReport report) => Reports.Enqueue(report);

    public void Warning(string message) => Warnings.Enqueue(message);
}
