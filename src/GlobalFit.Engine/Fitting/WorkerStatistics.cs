using System.Collections.Immutable;

namespace GlobalFit.Engine.Fitting;

/// <summary>What one worker update did, for progress lines, telemetry and <c>status</c>.</summary>
/// <param name="Steps">Sampler steps run by the update.</param>
/// <param name="TotalSteps">Steps since the worker was created.</param>
/// <param name="SourceCount">Sources held by the first cold chain at the end (for the noise worker, 0).</param>
/// <param name="LogLikelihood">ln L of the first cold chain at the end.</param>
/// <param name="Acceptance">Fraction of cold-chain proposals accepted during the worker's life, in [0, 1].</param>
/// <param name="WallTime">Wall-clock time of the update; the only field that differs between identical runs.</param>
public sealed record WorkerStatistics(int Steps, long TotalSteps, int SourceCount, double LogLikelihood, double Acceptance, TimeSpan WallTime)
{
    /// <summary>Where the update's time went, part by part (empty for a worker that does not measure it). Like
    /// <see cref="WallTime"/> it differs between identical runs.</summary>
    public ImmutableArray<WorkerPhaseTime> Phases { get; init; } = [];
}
