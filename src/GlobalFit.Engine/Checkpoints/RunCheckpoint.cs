using System.Collections.Immutable;
using MessagePack;

namespace GlobalFit.Engine.Checkpoints;

/// <summary>Everything a run needs to continue bit for bit after iteration <see cref="Iteration"/>: every worker's
/// sampler state (random streams included, the noise worker's among them) and every template.</summary>
/// <param name="FormatVersion">Checkpoint layout version.</param>
/// <param name="Iteration">Iterations completed.</param>
/// <param name="ConfigDigest">SHA-256 of the resolved configuration, so a checkpoint is never resumed under another
/// configuration.</param>
/// <param name="Workers">Worker states, by ordinal id.</param>
/// <param name="Templates">Current templates, by ordinal id.</param>
[MessagePackObject]
public sealed record RunCheckpoint(
    [property: Key(0)] int FormatVersion,
    [property: Key(1)] long Iteration,
    [property: Key(2)] string ConfigDigest,
    [property: Key(3)] ImmutableArray<SavedWorkerState> Workers,
    [property: Key(4)] ImmutableArray<SavedTemplate> Templates)
{
    /// <summary>The layout this build writes. Version 1 kept the noise worker's state apart from the others.</summary>
    public const int CurrentFormatVersion = 2;
}
