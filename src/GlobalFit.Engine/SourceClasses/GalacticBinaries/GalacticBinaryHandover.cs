using MessagePack;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The payload of a galactic binary handed to the neighbouring window: the chain it came from and its
/// parameters in <see cref="Physics.GalacticBinaries.GalacticBinaryParameters.ColumnNames"/> order.</summary>
/// <param name="Chain">Sampler chain index (the same chain index continues in the neighbour).</param>
/// <param name="Parameters">The eight parameters.</param>
[MessagePackObject]
public sealed record GalacticBinaryHandover([property: Key(0)] int Chain, [property: Key(1)] double[] Parameters);
