using GlobalFit.Cli.Tests.Support;
using Xunit.Abstractions;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Every reader of untrusted bytes either accepts a mutated file or refuses it with a one-line message (exit 2
/// at the command line): never a crash, a hang past <see cref="FuzzCampaign.TimeLimit"/>, an allocation past
/// <see cref="FuzzCampaign.AllocationBound"/>, or a damaged checksummed file read as if whole.</summary>
/// <remarks>Deterministic: fixed seeds, so a failure reproduces exactly and the false-failure rate is zero. The quick
/// run feeds 200 inputs to each of the seven readers (1,400); the long run (trait Category=Long) 15,000 each (105,000).</remarks>
[Collection(FuzzCollection.Name)]
public sealed class ReaderFuzzTests(FuzzSeeds seeds, ITestOutputHelper output) : IClassFixture<FuzzSeeds>
{
    public static TheoryData<string> Readers => new()
    {
        "observation file (HDF5)", "scenario configuration (TOML)", "run configuration (TOML)", "checkpoint", "sample file",
        "sample commit record", "telemetry (JSON lines)",
    };

    [Theory]
    [MemberData(nameof(Readers))]
    public void A_mutated_file_is_accepted_or_refused_in_one_line_never_crashing_hanging_or_read_as_whole(string reader) =>
        Fuzz(reader, inputs: 200, seed: 20261205);

    [Theory]
    [Trait("Category", "Long")]
    [MemberData(nameof(Readers))]
    public void Fifteen_thousand_mutations_of_each_file_are_accepted_or_refused_cleanly(string reader) =>
        Fuzz(reader, inputs: 15_000, seed: 515);

    private void Fuzz(string reader, int inputs, int seed)
    {
        using var scratch = new TempFolder();
        var target = new ReaderTargets(seeds, scratch).All.Single(t => t.Name == reader);
        var tally = FuzzCampaign.Run(target, inputs, seed);
        output.WriteLine(tally.ToString());
        Assert.Equal(inputs, tally.Inputs);
        Assert.True(tally.Clean, tally.ToString());
        // The mutations must reach the reader's refusals, not only inputs it cannot tell from valid ones.
        Assert.True(tally.Refused > 0, tally.ToString());
    }
}

/// <summary>Fuzz tests run alone: the allocation figure is per thread, but the time limit must not be eaten by other
/// tests running beside them.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class FuzzCollection
{
    public const string Name = "fuzzing";
}
