using GlobalFit.Engine.Configuration;

namespace GlobalFit.Engine.Fitting;

/// <summary>A source class configured for one data record: its workers, how to create and restore them, and how to
/// catalogue their samples.</summary>
public interface IFitSourceClassPlan
{
    /// <summary>The class id (its config section).</summary>
    string ClassId { get; }

    /// <summary>The worker groups, in the order the default schedule runs them.</summary>
    IReadOnlyList<WorkerGroup> Groups { get; }

    /// <summary>Sampler steps per worker update.</summary>
    int StepsPerUpdate { get; }

    /// <summary>Creates a fresh worker.</summary>
    /// <param name="workerId">One of the planned ids.</param>
    /// <param name="runSeed">The run seed; the class separates its workers' streams.</param>
    IFitWorker CreateWorker(string workerId, ulong runSeed);

    /// <summary>Recreates a worker from <see cref="IFitWorker.SaveState"/> bytes.</summary>
    /// <param name="workerId">One of the planned ids.</param>
    /// <param name="state">The bytes.</param>
    IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state);

    /// <summary>A catalogue builder for this class's samples, weighting by <paramref name="noise"/>.</summary>
    /// <param name="noise">The noise model to compute SNRs and overlaps with (the fit's final one).</param>
    /// <param name="burnInIterations">Samples of iterations 1 … this are left out.</param>
    /// <param name="minimumConfidence">Entries present in fewer samples than this fraction are left out.</param>
    IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence);

    /// <summary>The matcher <c>globalfit compare</c> uses for this class's sources, weighting by <paramref name="noise"/>,
    /// or null when the class has no sources to compare (the noise model).</summary>
    /// <param name="noise">The noise model to weight overlaps with (the fit's final one).</param>
    ISourceMatcher? CreateMatcher(IPsdSource noise) => null;

    /// <summary>Facts about the plan a user should see when the fit starts (one line each), e.g. which model of the
    /// noise it uses and why.</summary>
    IEnumerable<string> Describe() => [];

    /// <summary>Writes the resolved section (every key, defaults included) for <c>RUN/run.toml</c>.</summary>
    /// <param name="writer">The writer, positioned at this class's section.</param>
    void WriteResolved(ResolvedConfigWriter writer);
}
