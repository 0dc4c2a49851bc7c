using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Actors;

/// <summary>Sets a worker actor's worker: restored from <paramref name="State"/>, or fresh when it is null. Sent when
/// the actor starts and again after a restart, so a failed update never leaves half-changed state behind.</summary>
/// <param name="State">The committed state, or null.</param>
public sealed record LoadWorker(byte[]? State);

/// <summary>Asks a worker to run one update.</summary>
/// <param name="Iteration">Global-fit iteration (1-based).</param>
/// <param name="StageIndex">Stage within the iteration.</param>
/// <param name="Residual">Its residual.</param>
/// <param name="Steps">Sampler steps.</param>
/// <param name="SentTimestamp">Stopwatch timestamp when the request left the coordinator (for queue time).</param>
/// <param name="TraceParent">W3C traceparent of the stage span, or null when tracing is off.</param>
public sealed record UpdateWorker(long Iteration, int StageIndex, WorkerResidual Residual, int Steps, long SentTimestamp, string? TraceParent);

/// <summary>A worker's reply to <see cref="UpdateWorker"/>.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="Result">Its update, handovers and state.</param>
public sealed record WorkerUpdated(string WorkerId, UpdateResult Result);

/// <summary>Hands sources to a worker between stages.</summary>
/// <param name="Handovers">Handovers addressed to it.</param>
public sealed record AcceptHandovers(IReadOnlyList<Handover> Handovers);

/// <summary>A worker's reply to <see cref="AcceptHandovers"/>.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="Result">Its template with the adopted sources, and its state.</param>
public sealed record HandoversAccepted(string WorkerId, AdoptionResult Result);
