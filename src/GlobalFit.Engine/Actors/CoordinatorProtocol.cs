using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Actors;

/// <summary>Starts the fit; the coordinator answers the sender with <see cref="FitFinished"/>.</summary>
public sealed record StartFit;

/// <summary>Asks the coordinator to stop at once (Ctrl-C): it checkpoints the last complete iteration and finishes.</summary>
public sealed record StopFit;

/// <summary>The coordinator's final answer.</summary>
/// <param name="Outcome">How the run ended.</param>
public sealed record FitFinished(FitOutcome Outcome);

/// <summary>A worker threw; sent by the supervisor strategy to the coordinator itself.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="Error">What it threw.</param>
internal sealed record WorkerFailed(string WorkerId, Exception Error);
