using MessagePack;

namespace GlobalFit.Engine.Checkpoints;

/// <summary>One worker's sampler state as stored in a checkpoint.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="State">Its <see cref="Fitting.IFitWorker.SaveState"/> bytes, or null when it never ran.</param>
[MessagePackObject]
public sealed record SavedWorkerState([property: Key(0)] string WorkerId, [property: Key(1)] byte[]? State);
