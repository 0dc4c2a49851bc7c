using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>Simulation and fitting helpers for end-to-end fits through <see cref="FitRunner"/> (the record and configuration
/// are <see cref="GlobalFit.Tests.Shared.SmallFitRecord"/>).</summary>
internal static class FitRunFixture
{
    /// <summary>Simulates <paramref name="scenarioToml"/> into <paramref name="path"/>.</summary>
    public static void Simulate(string scenarioToml, string path)
    {
        var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(scenarioToml, "test scenario"));
        ObservationFile.Write(ObservationSimulator.Simulate(scenario, "globalfit tests", new Dictionary<string, string>(), null), path, overwrite: false);
    }

    /// <summary>Runs a fit to the end with progress collected.</summary>
    public static (FitOutcome Outcome, CollectingProgress Progress) Fit(string configPath)
    {
        var progress = new CollectingProgress();
        var outcome = FitRunner.Start(configPath, new FitRunOptions(progress, null, CancellationToken.None));
        return (outcome, progress);
    }
}

/// <summary>Keeps what a fit reports.</summary>
internal sealed class CollectingProgress : IFitProgress
{
    public List<IterationReport> Reports { get; } = [];

    public List<string> Warnings { get; } = [];

    public void IterationCompleted(IterationReport report)
    {
        lock (Reports) Reports.Add(report);
    }

    public void Warning(string message)
    {
        lock (Warnings) Warnings.Add(message);
    }
}
