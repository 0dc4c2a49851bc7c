using Akka.Actor;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Actors;

/// <summary>Asks the residual-data actor to cut a worker's residual and send it the update request; the worker
/// replies to the coordinator (the sender of this message).</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="Worker">Its actor.</param>
/// <param name="Iteration">Global-fit iteration.</param>
/// <param name="StageIndex">Stage within the iteration.</param>
/// <param name="Steps">Sampler steps.</param>
/// <param name="TraceParent">W3C traceparent of the stage span, or null.</param>
public sealed record ServeWorker(string WorkerId, IActorRef Worker, long Iteration, int StageIndex, int Steps, string? TraceParent);

/// <summary>Swaps in the templates and, when given, the inverse PSDs produced by one stage.</summary>
/// <param name="Templates">New templates by worker id.</param>
/// <param name="Psd">New inverse PSDs, or null when the stage did not refit the noise.</param>
public sealed record CommitStage(IReadOnlyList<KeyValuePair<string, WindowSpectra>> Templates, InversePsd? Psd);

/// <summary>The residual-data actor's acknowledgement of <see cref="CommitStage"/>.</summary>
public sealed record StageCommitted;
