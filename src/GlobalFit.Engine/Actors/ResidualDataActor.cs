using System.Diagnostics;
using Akka.Actor;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Actors;

/// <summary>Owns the data, every worker's current template and the current inverse PSDs (a <see cref="ResidualBook"/>);
/// serves each worker its residual window and swaps in a stage's results when the coordinator commits them.</summary>
public sealed class ResidualDataActor : ReceiveActor
{
    private readonly ResidualBook _book;

    /// <summary>Creates the actor around <paramref name="book"/>, which it owns from now on.</summary>
    public ResidualDataActor(ResidualBook book)
    {
        _book = book;
        Receive<ServeWorker>(m =>
        {
            var residual = _book.ResidualFor(m.WorkerId);
            m.Worker.Tell(new UpdateWorker(m.Iteration, m.StageIndex, residual, m.Steps, Stopwatch.GetTimestamp(), m.TraceParent), Sender);
        });
        Receive<CommitStage>(m =>
        {
            foreach (var (id, template) in m.Templates) _book.Replace(id, template);
            if (m.Psd is { } psd) _book.SetInversePsd(psd.A, psd.E, psd.T);
            Sender.Tell(new StageCommitted());
        });
    }

    /// <summary>Props.</summary>
    public static Props Props(ResidualBook book) => Akka.Actor.Props.Create(() => new ResidualDataActor(book));
}
