using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Actors;

/// <summary>Appends one iteration's samples to the catalogue store.</summary>
/// <param name="Iteration">The iteration.</param>
/// <param name="Blocks">Every worker's block, by ordinal worker id.</param>
public sealed record AppendSamples(long Iteration, IReadOnlyList<SampleBlock> Blocks);

/// <summary>The store's answer: the iteration's samples are on disk, or could not be written.</summary>
/// <param name="Iteration">The iteration.</param>
/// <param name="Problem">Null when written; otherwise the file and the cause.</param>
public sealed record SamplesAppended(long Iteration, string? Problem = null);

/// <summary>Writes a checkpoint.</summary>
/// <param name="Checkpoint">The state.</param>
public sealed record WriteCheckpoint(RunCheckpoint Checkpoint);

/// <summary>The checkpointer's reply.</summary>
/// <param name="Iteration">The iteration checkpointed.</param>
/// <param name="Problem">Null when written; otherwise why it failed (the previous checkpoint is intact).</param>
public sealed record CheckpointWritten(long Iteration, string? Problem);
