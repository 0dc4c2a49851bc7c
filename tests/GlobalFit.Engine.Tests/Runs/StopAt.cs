using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>Requests a stop once an iteration is reported: a fit interrupted at a known point.</summary>
internal sealed class StopAt(long iteration, CancellationTokenSource stop) : IFitProgress
{
    public void IterationCompleted(IterationReport report)
    {
        if (report.Iteration == iteration) stop.Cancel();
    }

    public void Warning(string message) { }
}
