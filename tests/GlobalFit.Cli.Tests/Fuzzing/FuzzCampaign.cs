using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Feeds mutated inputs to a reader one at a time and sorts each outcome: accepted, refused, crash, hang,
/// over-allocation or silent acceptance.</summary>
internal static class FuzzCampaign
{
    /// <summary>Per-input time limit. The slowest honest read here (an observation file of a few days) takes
    /// milliseconds; ten seconds leaves room for a loaded CI machine and still catches a reader that loops.</summary>
    public static readonly TimeSpan TimeLimit = TimeSpan.FromSeconds(10);

    /// <summary>Bytes one input may allocate. The seeds are below a megabyte and an honest reader allocates a small
    /// multiple of its file; 256 MB is far above that and far below what a size field taken on trust (gigabytes) asks for.</summary>
    public const long AllocationBound = 256L << 20;

    public static FuzzTally Run(FuzzTarget target, int inputs, int seed)
    {
        var tally = new FuzzTally(target.Name);
        var random = new Random(seed);
        var fingerprints = target.Seeds.Select(s => target.Read(s)).ToList();
        for (int i = 0; i < inputs; i++)
        {
            int which = random.Next(target.Seeds.Count);
            byte[] input = target.Mutate(target.Seeds[which], target.Seeds[random.Next(target.Seeds.Count)], random);
            bool resealed = target.Reseal is not null && random.Next(2) == 0;
            if (resealed) input = target.Reseal!(input);
            string label = $"input {i} (seed {seed}, from seed file {which}{(resealed ? ", resealed" : "")})";
            tally.Inputs++;
            if (!Judge(target, input, fingerprints[which], resealed, label, tally)) break; // a hung reader cannot be stopped
        }
        return tally;
    }

    private static bool Judge(FuzzTarget target, byte[] input, string? seedFingerprint, bool resealed, string label, FuzzTally tally)
    {
        long allocated = 0;
        string? fingerprint = null;
        var work = Task.Factory.StartNew(() =>
        {
            long before = GC.GetAllocatedBytesForCurrentThread();
            try
            {
                fingerprint = target.Read(input);
            }
            finally
            {
                allocated = GC.GetAllocatedBytesForCurrentThread() - before;
            }
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        try
        {
            if (!work.Wait(TimeLimit))
            {
                tally.Hangs.Add($"{label}: still reading after {TimeLimit.TotalSeconds} s");
                return false;
            }
            tally.Accepted++;
            if (!resealed && seedFingerprint is not null && fingerprint != seedFingerprint)
                tally.SilentAcceptances.Add($"{label}: damaged input accepted with other contents");
        }
        catch (AggregateException e) when (e.InnerException is InvalidInputException refusal)
        {
            tally.Refused++;
            if (refusal.Message.Contains('\n', StringComparison.Ordinal)) tally.Crashes.Add($"{label}: refusal is not one line: {refusal.Message}");
        }
        catch (AggregateException e)
        {
            tally.Crashes.Add($"{label}: {e.InnerException!.GetType().Name}: {e.InnerException.Message}\n{e.InnerException.StackTrace}");
        }
        if (allocated > target.AllocationBound) tally.OverAllocations.Add($"{label}: allocated {allocated >> 20} MB");
        return true;
    }
}
