using System.Collections.Immutable;
using System.Diagnostics;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Stopwatch-tick accumulators for the parts of one band update (<see cref="BandUpdatePhase"/>): the hot
/// paths add <c>Stopwatch.GetTimestamp()</c> differences to an array slot, which allocates nothing and costs two clock
/// reads (tens of nanoseconds) against the ~10 µs of a template.</summary>
/// <remarks>Times only; the clock never changes what the sampler computes. Not thread-safe (one per worker).</remarks>
public sealed class BandUpdateClock
{
    private static readonly int PhaseCount = Enum.GetValues<BandUpdatePhase>().Length;
    private readonly long[] _ticks = new long[PhaseCount];
    private readonly long[] _counts = new long[PhaseCount];

    /// <summary>Now, in stopwatch ticks.</summary>
    /// <returns><see cref="Stopwatch.GetTimestamp"/>.</returns>
    public static long Now() => Stopwatch.GetTimestamp();

    /// <summary>Adds the time since <paramref name="started"/> to <paramref name="phase"/> and counts one run of it.</summary>
    /// <param name="phase">The part.</param>
    /// <param name="started">A <see cref="Now"/> reading.</param>
    /// <returns>The time now, so that consecutive parts can share a reading.</returns>
    public long Add(BandUpdatePhase phase, long started)
    {
        long now = Stopwatch.GetTimestamp();
        _ticks[(int)phase] += now - started;
        _counts[(int)phase]++;
        return now;
    }

    /// <summary>Adds <paramref name="ticks"/> to <paramref name="phase"/> without counting a run.</summary>
    /// <param name="phase">The part.</param>
    /// <param name="ticks">Stopwatch ticks, may be negative to move time out of a part.</param>
    public void AddTicks(BandUpdatePhase phase, long ticks) => _ticks[(int)phase] += ticks;

    /// <summary>Ticks accumulated in <paramref name="phase"/>.</summary>
    /// <param name="phase">The part.</param>
    /// <returns>Stopwatch ticks.</returns>
    public long Ticks(BandUpdatePhase phase) => _ticks[(int)phase];

    /// <summary>Runs counted in <paramref name="phase"/>.</summary>
    /// <param name="phase">The part.</param>
    /// <returns>The count.</returns>
    public long Count(BandUpdatePhase phase) => _counts[(int)phase];

    /// <summary>Milliseconds accumulated in <paramref name="phase"/>.</summary>
    /// <param name="phase">The part.</param>
    /// <returns>ms.</returns>
    public double Milliseconds(BandUpdatePhase phase) => _ticks[(int)phase] * 1000.0 / Stopwatch.Frequency;

    /// <summary>Ticks of the parts that run nested inside others (the kernel, pair terms, Fisher matrices, birth-density
    /// evaluations and sample collection), for <see cref="AddExclusive"/>.</summary>
    /// <returns>Stopwatch ticks.</returns>
    public long NestedTicks() =>
        _ticks[(int)BandUpdatePhase.Template] + _ticks[(int)BandUpdatePhase.Likelihood] + _ticks[(int)BandUpdatePhase.LikelihoodAssembly]
        + _ticks[(int)BandUpdatePhase.PairTerms] + _ticks[(int)BandUpdatePhase.Fisher] + _ticks[(int)BandUpdatePhase.BirthDensity]
        + _ticks[(int)BandUpdatePhase.SampleCollection];

    /// <summary>Adds the time since <paramref name="started"/> to <paramref name="phase"/>, less the time the nested parts
    /// gained meanwhile (they keep it), so that the parts never count the same tick twice.</summary>
    /// <param name="phase">The enclosing part.</param>
    /// <param name="started">A <see cref="Now"/> reading.</param>
    /// <param name="nestedBefore"><see cref="NestedTicks"/> at <paramref name="started"/>.</param>
    /// <returns>The time now.</returns>
    public long AddExclusive(BandUpdatePhase phase, long started, long nestedBefore)
    {
        long now = Add(phase, started);
        _ticks[(int)phase] -= NestedTicks() - nestedBefore;
        return now;
    }

    /// <summary>Clears every accumulator.</summary>
    public void Reset()
    {
        Array.Clear(_ticks);
        Array.Clear(_counts);
    }

    /// <summary>The accumulators as the engine's class-neutral breakdown, in <see cref="BandUpdatePhase"/> order, each
    /// named in snake_case (<c>fstatistic_map</c>); template and likelihood form the kernel.</summary>
    /// <returns>One row per part.</returns>
    public ImmutableArray<WorkerPhaseTime> Snapshot()
    {
        var rows = ImmutableArray.CreateBuilder<WorkerPhaseTime>(PhaseCount);
        foreach (var phase in Enum.GetValues<BandUpdatePhase>())
            rows.Add(new WorkerPhaseTime(Name(phase), Milliseconds(phase), Count(phase), phase is BandUpdatePhase.Template or BandUpdatePhase.Likelihood));
        return rows.MoveToImmutable();
    }

    /// <summary>The snake_case name of <paramref name="phase"/> used in telemetry.</summary>
    /// <param name="phase">The part.</param>
    /// <returns>E.g. <c>pair_terms</c>.</returns>
    public static string Name(BandUpdatePhase phase) => phase switch
    {
        BandUpdatePhase.Template => "template",
        BandUpdatePhase.Likelihood => "likelihood",
        BandUpdatePhase.LikelihoodAssembly => "likelihood_assembly",
        BandUpdatePhase.PairTerms => "pair_terms",
        BandUpdatePhase.Fisher => "fisher",
        BandUpdatePhase.BirthDensity => "birth_density",
        BandUpdatePhase.Proposals => "proposals",
        BandUpdatePhase.SampleCollection => "sample_collection",
        BandUpdatePhase.ModelSetup => "model_setup",
        BandUpdatePhase.FStatisticMap => "fstatistic_map",
        BandUpdatePhase.ProposalSetup => "proposal_setup",
        BandUpdatePhase.GreedySearch => "greedy_search",
        BandUpdatePhase.Rescoring => "rescoring",
        BandUpdatePhase.StateCapture => "state_capture",
        BandUpdatePhase.OutputTemplate => "output_template",
        _ => throw new ArgumentOutOfRangeException(nameof(phase), phase, "not a band-update phase"),
    };
}
