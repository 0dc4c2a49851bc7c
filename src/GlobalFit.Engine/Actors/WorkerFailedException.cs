namespace GlobalFit.Engine.Actors;

/// <summary>Wraps an exception thrown by a worker so the coordinator's supervisor strategy, which sees only the
/// exception, knows which worker failed.</summary>
public sealed class WorkerFailedException : Exception
{
    /// <summary>Wraps <paramref name="inner"/>.</summary>
    public WorkerFailedException(string workerId, Exception inner)
        : base($"worker {workerId} failed: {inner?.Message}", inner) => WorkerId = workerId;

    /// <summary>The worker.</summary>
    public string WorkerId { get; }
}
