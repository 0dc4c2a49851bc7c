using Akka.Actor;
using GlobalFit.Engine.Samples;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Actors;

/// <summary>Appends each iteration's samples to the run's <see cref="SampleStore"/> (append-only, checksummed,
/// flushed to disk before the acknowledgement). A failed write is answered with its cause, not thrown.</summary>
public sealed class SampleStoreActor : ReceiveActor
{
    /// <summary>Creates the actor around <paramref name="store"/>.</summary>
    public SampleStoreActor(SampleStore store)
    {
        Receive<AppendSamples>(m =>
        {
            string? problem = null;
            try
            {
                store.Append(m.Blocks);
            }
            catch (Exception e)
            {
                // Answered, never thrown, whatever the failure: a crashed store would leave the coordinator waiting for ever.
                problem = e.Message;
            }
            Sender.Tell(new SamplesAppended(m.Iteration, problem));
        });
    }

    /// <summary>Props.</summary>
    public static Props Props(SampleStore store) => Akka.Actor.Props.Create(() => new SampleStoreActor(store));
}
