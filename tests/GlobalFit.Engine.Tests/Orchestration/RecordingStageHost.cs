using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Tests.Orchestration;

/// <summary>A stage host that records every request, so a test can answer them in any order it likes.</summary>
internal sealed class RecordingStageHost : IStageHost
{
    public List<string> Calls { get; } = [];

    public List<(string WorkerId, long Iteration, int Stage)> Updates { get; } = [];

    public List<(string WorkerId, byte[]? State)> Loads { get; } = [];

    public List<(string WorkerId, IReadOnlyList<Handover> Handovers)> Deliveries { get; } = [];

    public List<(IReadOnlyList<KeyValuePair<string, WindowSpectra>> Templates, InversePsd? Psd)> Commits { get; } = [];

    public List<(long Iteration, IReadOnlyList<SampleBlock> Blocks)> Appends { get; } = [];

    public List<RunCheckpoint> Checkpoints { get; } = [];

    public List<IterationReport> Reports { get; } = [];

    public List<string> Warnings { get; } = [];

    public FitOutcome? Outcome { get; private set; }

    public void LoadWorker(string workerId, byte[]? state) => Loads.Add((workerId, state));

    public void RequestUpdate(string workerId, long iteration, int stageIndex, int steps)
    {
        Updates.Add((workerId, iteration, stageIndex));
        Calls.Add($"update {workerId}");
    }

    public void DeliverHandovers(string workerId, IReadOnlyList<Handover> handovers)
    {
        Deliveries.Add((workerId, handovers));
        Calls.Add($"deliver {workerId}");
    }

    public void CommitStage(IReadOnlyList<KeyValuePair<string, WindowSpectra>> templates, InversePsd? psd)
    {
        Commits.Add((templates, psd));
        Calls.Add("commit");
    }

    public void AppendSamples(long iteration, IReadOnlyList<SampleBlock> blocks)
    {
        Appends.Add((iteration, blocks));
        Calls.Add($"append {iteration}");
    }

    public void WriteCheckpoint(RunCheckpoint checkpoint)
    {
        Checkpoints.Add(checkpoint);
        Calls.Add($"checkpoint {checkpoint.Iteration}");
    }

    public void StageStarted(long iteration, int stageIndex, Stage stage) => Calls.Add($"stage {iteration}.{stageIndex}");

    public void StageFinished(IReadOnlyDictionary<string, double> computeMs) { }

    public void IterationStarted(long iteration) => Calls.Add($"iteration {iteration}");

    public void IterationCompleted(IterationReport report) => Reports.Add(report);

    public void Warning(string message) => Warnings.Add(message);

    public void Finished(FitOutcome outcome)
    {
        Assert.Null(Outcome); // finished once
        Outcome = outcome;
        Calls.Add($"finished {outcome.Kind}");
    }
}
