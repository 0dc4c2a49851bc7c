namespace GlobalFit.Engine.Catalogue;

/// <summary>What <see cref="CatalogueStore.TruncateAfter"/> removed from one worker's chain file.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="RecordsDropped">Committed records of later iterations that were removed.</param>
/// <param name="FirstIterationDropped">The earliest iteration among them, or null when none was.</param>
/// <param name="UncommittedBytesDropped">Bytes past the commit point (an append interrupted by a crash, possibly a
/// partial record) that were removed.</param>
public sealed record ChainTruncation(string WorkerId, int RecordsDropped, long? FirstIterationDropped, long UncommittedBytesDropped);
