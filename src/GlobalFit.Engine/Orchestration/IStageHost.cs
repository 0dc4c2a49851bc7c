using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>What the <see cref="StageMachine"/> asks of the world around it: the fit coordinator actor in a run, a
/// recording fake in tests. Every request is answered later through the matching <c>StageMachine.On…</c> method; the
/// machine never waits.</summary>
public interface IStageHost
{
    /// <summary>Set the worker to <paramref name="state"/> (fresh when null): at start and after a failure.</summary>
    void LoadWorker(string workerId, byte[]? state);

    /// <summary>Serve the worker its residual and have it run <paramref name="steps"/> steps; answered by
    /// <see cref="StageMachine.OnUpdated"/> or <see cref="StageMachine.OnWorkerFailed"/>.</summary>
    void RequestUpdate(string workerId, long iteration, int stageIndex, int steps);

    /// <summary>Deliver sources handed over by other workers; answered by <see cref="StageMachine.OnAdopted"/>.</summary>
    void DeliverHandovers(string workerId, IReadOnlyList<Handover> handovers);

    /// <summary>Swap in a stage's new templates (by ordinal worker id) and inverse PSDs (when the stage refitted the
    /// noise); answered by <see cref="StageMachine.OnCommitted"/>.</summary>
    void CommitStage(IReadOnlyList<KeyValuePair<string, WindowSpectra>> templates, InversePsd? psd);

    /// <summary>Append an iteration's samples (by ordinal worker id); answered by <see cref="StageMachine.OnAppended"/> or
    /// <see cref="StageMachine.OnAppendFailed"/>.</summary>
    void AppendSamples(long iteration, IReadOnlyList<SampleBlock> blocks);

    /// <summary>Write a checkpoint; answered by <see cref="StageMachine.OnCheckpointWritten"/>.</summary>
    void WriteCheckpoint(RunCheckpoint checkpoint);

    /// <summary>A stage begins (for telemetry).</summary>
    void StageStarted(long iteration, int stageIndex, Stage stage);

    /// <summary>Every worker of the stage has answered (for telemetry).</summary>
    /// <param name="computeMs">Compute time of each update of the stage, by worker id.</param>
    void StageFinished(IReadOnlyDictionary<string, double> computeMs);

    /// <summary>An iteration begins (for telemetry).</summary>
    void IterationStarted(long iteration);

    /// <summary>An iteration's samples are on disk.</summary>
    void IterationCompleted(IterationReport report);

    /// <summary>Something the user should know.</summary>
    void Warning(string message);

    /// <summary>The run is over; nothing more is asked.</summary>
    void Finished(FitOutcome outcome);
}
