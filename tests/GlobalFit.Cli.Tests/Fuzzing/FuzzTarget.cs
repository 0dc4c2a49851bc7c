namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>One reader of untrusted bytes under fuzzing.</summary>
/// <param name="Name">What is read (for the report).</param>
/// <param name="Seeds">Valid files the program wrote; every input is a mutation of one of them.</param>
/// <param name="Mutate">Makes one input from a seed and a donor for splices.</param>
/// <param name="Read">Reads one input the way the program does. It returns normally when the input is accepted and
/// throws <see cref="GlobalFit.Physics.Files.InvalidInputException"/> when it is refused; any other exception is a crash.
/// It returns a fingerprint of what it read, or null when the format carries no checksum.</param>
/// <param name="Reseal">For checksummed formats: recomputes the checksums of a mutated input, so that the decoder behind
/// them is fuzzed too (a well-formed but inconsistent file); null when there is nothing to reseal.</param>
internal sealed record FuzzTarget(
    string Name,
    IReadOnlyList<byte[]> Seeds,
    Func<byte[], byte[], Random, byte[]> Mutate,
    Func<byte[], string?> Read,
    Func<byte[], byte[]>? Reseal = null)
{
    /// <summary>Bytes one input may allocate; <see cref="FuzzCampaign.AllocationBound"/> unless the reader states another.</summary>
    public long AllocationBound { get; init; } = FuzzCampaign.AllocationBound;
}
