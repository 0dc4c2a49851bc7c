using System.Collections.Immutable;

namespace GlobalFit.Engine.Orchestration;

/// <summary>What one iteration did, for progress lines and <c>status</c>.</summary>
/// <param name="Iteration">The iteration (1-based).</param>
/// <param name="TotalIterations">Iterations the run will do.</param>
/// <param name="WallTime">Its wall-clock time.</param>
/// <param name="LogLikelihood">Sum of the workers' cold-chain ln L (each against its own residual): a trend, not a
/// joint likelihood.</param>
/// <param name="SourcesPerClass">Sources held by the first cold chains, per class id.</param>
/// <param name="SlowestWorkers">The slowest worker of each stage with its compute time in ms.</param>
/// <param name="Checkpointed">True when a checkpoint of this iteration was written.</param>
public sealed record IterationReport(long Iteration, long TotalIterations, TimeSpan WallTime, double LogLikelihood,
    ImmutableSortedDictionary<string, int> SourcesPerClass, ImmutableArray<(string WorkerId, double ComputeMs)> SlowestWorkers, bool Checkpointed);
