namespace GlobalFit.Engine.Fitting;

/// <summary>The reply of one worker update: its new template, the samples it drew and what it did.</summary>
/// <param name="Template">The worker's current template over its window after the update.</param>
/// <param name="Samples">Its cold-chain samples of the update (the iteration number is filled in by the engine).</param>
/// <param name="Statistics">Counters and timing.</param>
public sealed record WorkerUpdate(WindowSpectra Template, SampleBlock Samples, WorkerStatistics Statistics);
