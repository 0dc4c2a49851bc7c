using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;
using GlobalFit.Inference.Diagnostics;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>What one worker update did.</summary>
/// <param name="StepsThisUpdate">Steps run by the update.</param>
/// <param name="TotalSteps">Steps since the worker was created.</param>
/// <param name="SourceCount">Sources held by the first cold chain at the end.</param>
/// <param name="LogLikelihood">ln L of the first cold chain at the end.</param>
/// <param name="WallTime">Wall-clock time of the update (the only field that differs between identical runs).</param>
/// <param name="Sampler">Acceptance per move and rung (within-model moves by name, "birth", "death"), swap rates and
/// ladder, cumulative over the worker's life.</param>
public sealed record GalacticBinaryBandStatistics(int StepsThisUpdate, long TotalSteps, int SourceCount, double LogLikelihood, TimeSpan WallTime, SamplerStatistics Sampler)
{
    /// <summary>Where the update's time went, part by part (<see cref="BandUpdateClock.Snapshot"/>); like
    /// <see cref="WallTime"/>, it differs between identical runs.</summary>
    public ImmutableArray<WorkerPhaseTime> Phases { get; init; } = [];
}
