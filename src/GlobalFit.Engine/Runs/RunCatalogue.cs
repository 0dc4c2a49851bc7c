using System.Collections.Immutable;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Samples;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>Builds a run's catalogue from its catalogue store: every class's sources from the samples after burn-in,
/// with SNRs and overlaps weighted by the noise model of the newest checkpoint.</summary>
public static class RunCatalogue
{
    /// <summary>Builds the catalogue of the run in <paramref name="layout"/>.</summary>
    /// <param name="plan">The run's plan (from its run.toml).</param>
    /// <param name="layout">The run folder.</param>
    /// <param name="warn">Receives a message when the newest checkpoint is damaged and the previous one is used.</param>
    /// <param name="burnIn">Iterations whose samples are left out, instead of the run's <c>burn_in</c>.</param>
    /// <param name="minConfidence">Sources present in fewer samples are left out, instead of the run's <c>min_confidence</c>.</param>
    /// <returns>The rows of every class (the noise posterior's among them), class by class in registration order.</returns>
    public static ImmutableArray<CatalogueRecord> Build(RunPlan plan, RunFolderLayout layout, Action<string> warn, long? burnIn = null, double? minConfidence = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(layout);
        var noise = FinalNoise(plan, layout, warn);
        long burn = burnIn ?? plan.Settings.BurnIn;
        double confidence = minConfidence ?? plan.Settings.MinConfidence;
        var catalogues = plan.Classes.ToDictionary(c => c.ClassId, c => c.CreateCatalogue(noise, burn, confidence), StringComparer.Ordinal);
        foreach (var block in new SampleStore(layout.Root).ReadAll())
            if (catalogues.TryGetValue(block.ClassId, out var catalogue)) catalogue.Add(block);
        return [.. plan.Classes.SelectMany(c => catalogues[c.ClassId].Build())];
    }

    /// <summary>Builds the catalogue and writes <c>catalogue.csv</c> and <c>catalogue.h5</c> into the run folder.</summary>
    public static ImmutableArray<CatalogueRecord> Export(RunPlan plan, RunFolderLayout layout, Action<string> warn)
    {
        var records = Build(plan, layout, warn);
        CatalogueCsvWriter.Write(layout.CatalogueCsv, records, overwrite: true);
        CatalogueHdf5Writer.Write(layout.CatalogueHdf5, records, overwrite: true);
        return records;
    }

    /// <summary>The noise model of the newest checkpoint: its noise worker restored (or fresh when it never ran).</summary>
    /// <param name="plan">The run's plan.</param>
    /// <param name="layout">The run folder.</param>
    /// <param name="warn">Receives a message when the newest checkpoint is damaged and the previous one is used.</param>
    /// <exception cref="InvalidInputException">The run has no checkpoint yet.</exception>
    public static IPsdSource FinalNoise(RunPlan plan, RunFolderLayout layout, Action<string> warn)
    {
        if (!CheckpointFile.Exists(layout.Root))
            throw new InvalidInputException(layout.Root, null, "the run has no checkpoint yet, so there is no noise model to build the catalogue with");
        var checkpoint = CheckpointFile.Read(layout.Root, warn);
        string id = plan.NoiseWorker.Id;
        byte[]? state = checkpoint.Workers.FirstOrDefault(w => w.WorkerId == id)?.State;
        var worker = state is null ? plan.ClassOf(id).CreateWorker(id, plan.Settings.Seed) : plan.ClassOf(id).RestoreWorker(id, state);
        return worker as IPsdSource ?? throw new InvalidOperationException($"worker {id} models the noise but serves no PSD");
    }
}
