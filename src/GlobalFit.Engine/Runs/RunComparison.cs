using System.Collections.Immutable;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Runs;

/// <summary>A run's catalogue against the truth tables of an observation file, class by class
/// (<see cref="CatalogueComparison"/> with each class's own matcher): what <c>globalfit compare</c> and the demo report.</summary>
public static class RunComparison
{
    /// <summary>Compares every class of the run that has a matcher and a truth table.</summary>
    /// <param name="plan">The run's plan.</param>
    /// <param name="layout">The run folder.</param>
    /// <param name="catalogue">The run's catalogue (from <see cref="RunCatalogue.Build"/>).</param>
    /// <param name="truth">The observation whose truth tables hold the injections.</param>
    /// <param name="detectableSnr">Injected SNR from which an unmatched injection counts as missed.</param>
    /// <param name="warn">Receives a message when the newest checkpoint is damaged and the previous one is used.</param>
    /// <returns>One comparison per class with sources, in registration order; a class whose truth table is absent is
    /// compared with an empty one.</returns>
    public static ImmutableArray<ClassComparison> Compare(RunPlan plan, RunFolderLayout layout, IReadOnlyList<CatalogueRecord> catalogue,
        Observation truth, double detectableSnr, Action<string> warn)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(catalogue);
        ArgumentNullException.ThrowIfNull(truth);
        var noise = RunCatalogue.FinalNoise(plan, layout, warn);
        var results = ImmutableArray.CreateBuilder<ClassComparison>();
        foreach (var classPlan in plan.Classes)
        {
            if (classPlan.CreateMatcher(noise) is not { } matcher) continue;
            var table = truth.FindTruth(classPlan.ClassId) ?? new TruthTable(classPlan.ClassId, [.. matcher.ParameterColumns, "snr"], [], []);
            results.Add(CatalogueComparison.Compare([.. catalogue.Where(r => r.ClassId == classPlan.ClassId)], table, matcher, detectableSnr));
        }
        return results.ToImmutable();
    }
}
