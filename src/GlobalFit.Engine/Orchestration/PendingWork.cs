using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>What a worker owes the stage machine.</summary>
internal abstract record WorkerTask;

/// <summary>An update was requested.</summary>
internal sealed record UpdateTask : WorkerTask
{
    public static UpdateTask Instance { get; } = new();
}

/// <summary>Handovers were delivered.</summary>
/// <param name="Handovers">What was delivered, kept to deliver again after a failure.</param>
internal sealed record AdoptionTask(IReadOnlyList<Handover> Handovers) : WorkerTask;

/// <summary>The step of the machine that waits on something other than workers.</summary>
internal enum PendingStep
{
    /// <summary>Nothing, or workers only.</summary>
    None,

    /// <summary>The residual-data side is swapping in a stage's results.</summary>
    Commit,

    /// <summary>The sample store is appending an iteration.</summary>
    Append,

    /// <summary>A checkpoint is being written.</summary>
    Checkpoint,
}

/// <summary>What the stage machine is waiting for: tasks of workers, or one step.</summary>
internal sealed class PendingWork
{
    private readonly Dictionary<string, WorkerTask> _workers = new(StringComparer.Ordinal);

    public PendingStep Step { get; private set; }

    public bool IsEmpty => _workers.Count == 0 && Step == PendingStep.None;

    public bool WorkersDone => _workers.Count == 0;

    public void Expect(string workerId, WorkerTask task) => _workers.Add(workerId, task);

    public void Expect(PendingStep step)
    {
        if (Step != PendingStep.None) throw new InvalidOperationException($"already waiting for {Step}");
        Step = step;
    }

    public WorkerTask? TaskOf(string workerId) => _workers.GetValueOrDefault(workerId);

    /// <summary>Ticks off a worker's task of type <typeparamref name="T"/>; false when none was owed (a late or
    /// duplicate answer, which is ignored).</summary>
    public bool Complete<T>(string workerId) where T : WorkerTask =>
        _workers.TryGetValue(workerId, out var task) && task is T && _workers.Remove(workerId);

    /// <summary>Ticks off <paramref name="step"/>; false when it was not awaited.</summary>
    public bool Complete(PendingStep step)
    {
        if (Step != step) return false;
        Step = PendingStep.None;
        return true;
    }

    public void Clear()
    {
        _workers.Clear();
        Step = PendingStep.None;
    }
}
