namespace GlobalFit.Engine.Samples;

/// <summary>What <see cref="SampleStore.TruncateAfter"/> removed from one worker's sample file.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="RecordsDropped">Committed records of later iterations that were removed.</param>
/// <param name="FirstIterationDropped">The earliest iteration among them, or null when none was.</param>
/// <param name="UncommittedBytesDropped">Bytes past the commit point (an append interrupted by a crash, possibly a
/// partial record) that were removed.</param>
public sealed record SegmentTruncation(string WorkerId, int RecordsDropped, long? FirstIterationDropped, long UncommittedBytesDropped);
