using Akka.Actor;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Actors;

/// <summary>What the fit coordinator starts from: the stages, where the run stands, and the actors it talks to.</summary>
/// <param name="Plan">The stages and limits.</param>
/// <param name="Start">Where the run stands.</param>
/// <param name="Labels">Each worker's human label, for telemetry.</param>
/// <param name="Threads">Compute threads (a telemetry attribute).</param>
/// <param name="Residual">The residual-data actor.</param>
/// <param name="Store">The sample-store actor.</param>
/// <param name="Checkpointer">The checkpointer actor.</param>
/// <param name="Progress">Receives progress.</param>
/// <param name="CreateWorker">Creates a worker fresh (null) or from state, by worker id.</param>
public sealed record CoordinatorSetup(
    StagePlan Plan,
    FitPosition Start,
    IReadOnlyDictionary<string, string> Labels,
    int Threads,
    IActorRef Residual,
    IActorRef Store,
    IActorRef Checkpointer,
    IFitProgress Progress,
    Func<string, byte[]?, IFitWorker> CreateWorker)
{
    /// <summary>Receives each worker failure with its full exception (stack trace included), for the run's failure log;
    /// the terminal gets one line through <see cref="Progress"/>.</summary>
    public Action<string, Exception> RecordFailure { get; init; } = (_, _) => { };
}
