namespace GlobalFit.Engine.Fitting;

/// <summary>What a worker contributes to the global fit besides its samples.</summary>
public enum WorkerRole
{
    /// <summary>Sources: its template over its window is subtracted from every other worker's residual.</summary>
    Sources,

    /// <summary>The noise model: it holds no template, reads the residual of every source over its window, and its
    /// updates carry the new inverse PSDs every other worker is then weighted with. A run has exactly one.</summary>
    Noise,
}
