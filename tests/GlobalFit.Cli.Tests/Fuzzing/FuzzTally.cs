namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>What a fuzzing campaign saw. A crash is an exception other than a refusal; a hang an input that ran past the
/// time limit; an over-allocation an input that allocated more than the bound; a silent acceptance a damaged input of a
/// checksummed format accepted with other contents than its seed's, without the checksums having been resealed.</summary>
internal sealed class FuzzTally(string target)
{
    public string Target { get; } = target;

    public int Inputs { get; set; }

    public int Accepted { get; set; }

    public int Refused { get; set; }

    public List<string> Crashes { get; } = [];

    public List<string> Hangs { get; } = [];

    public List<string> OverAllocations { get; } = [];

    public List<string> SilentAcceptances { get; } = [];

    public bool Clean => Crashes.Count == 0 && Hangs.Count == 0 && OverAllocations.Count == 0 && SilentAcceptances.Count == 0;

    public override string ToString() =>
        $"{Target}: {Inputs} inputs, {Accepted} accepted, {Refused} refused, {Crashes.Count} crashes, {Hangs.Count} hangs, " +
        $"{OverAllocations.Count} over the allocation bound, {SilentAcceptances.Count} silent acceptances" +
        string.Concat(Crashes.Concat(Hangs).Concat(OverAllocations).Concat(SilentAcceptances).Take(5).Select(p => "\n  " + p));
}
