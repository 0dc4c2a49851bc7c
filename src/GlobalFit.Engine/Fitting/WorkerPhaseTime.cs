namespace GlobalFit.Engine.Fitting;

/// <summary>The time one part of a worker update took (a row of the update's time breakdown).</summary>
/// <param name="Name">The part, snake_case (<c>template</c>, <c>likelihood</c>, <c>fstatistic_map</c>, …).</param>
/// <param name="Milliseconds">Time spent in it during the update.</param>
/// <param name="Count">How many times it ran (templates rendered, likelihoods evaluated, …; 1 for a one-off part).</param>
/// <param name="IsKernel">Whether it is part of the template + log-likelihood kernel whose share of the update's compute
/// is the worker's efficiency.</param>
public readonly record struct WorkerPhaseTime(string Name, double Milliseconds, long Count, bool IsKernel);
