using Akka.Actor;
using GlobalFit.Engine.Catalogue;

namespace GlobalFit.Engine.Actors;

/// <summary>Appends each iteration's samples to the run's <see cref="CatalogueStore"/> (append-only, checksummed,
/// flushed to disk before the acknowledgement).</summary>
public sealed class CatalogueStoreActor : ReceiveActor
{
    /// <summary>Creates the actor around <paramref name="store"/>.</summary>
    public CatalogueStoreActor(CatalogueStore store)
    {
        Receive<AppendSamples>(m =>
        {
            store.Append(m.Blocks);
            Sender.Tell(new SamplesAppended(m.Iteration));
        });
    }

    /// <summary>Props.</summary>
    public static Props Props(CatalogueStore store) => Akka.Actor.Props.Create(() => new CatalogueStoreActor(store));
}
