namespace GlobalFit.Engine.Orchestration;

/// <summary>Receives a fit's progress. Called from the coordinator's thread: implementations must be quick and must
/// not block.</summary>
public interface IFitProgress
{
    /// <summary>An iteration completed.</summary>
    void IterationCompleted(IterationReport report);

    /// <summary>Something the user should know (a worker restarted, a checkpoint failed, a damaged checkpoint skipped).</summary>
    void Warning(string message);

    /// <summary>A fact about the run worth stating once at its start (e.g. which foreground model the noise uses).</summary>
    void Note(string message) { }
}
