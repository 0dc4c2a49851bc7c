using Akka.Actor;
using GlobalFit.Engine.Samples;

namespace GlobalFit.Engine.Actors;

/// <summary>Appends each iteration's samples to the run's <see cref="SampleStore"/> (append-only, checksummed,
/// flushed to disk before the acknowledgement).</summary>
public sealed class SampleStoreActor : ReceiveActor
{
    /// <summary>Creates the actor around <paramref name="store"/>.</summary>
    public SampleStoreActor(SampleStore store)
    {
        Receive<AppendSamples>(m =>
        {
            store.Append(m.Blocks);
            Sender.Tell(new SamplesAppended(m.Iteration));
        });
    }

    /// <summary>Props.</summary>
    public static Props Props(SampleStore store) => Akka.Actor.Props.Create(() => new SampleStoreActor(store));
}
