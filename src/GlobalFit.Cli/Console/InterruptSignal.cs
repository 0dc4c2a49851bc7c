using System.Runtime.InteropServices;

namespace GlobalFit.Cli.Console;

/// <summary>Turns Ctrl-C and SIGTERM into a cancellation, so a fit checkpoints and exits cleanly instead of dying.
/// A second Ctrl-C is left to the default handler (immediate exit).</summary>
public sealed class InterruptSignal : IDisposable
{
    private readonly CancellationTokenSource _source = new();
    private readonly PosixSignalRegistration _terminate;
    private readonly PosixSignalRegistration _interrupt;

    /// <summary>Starts listening.</summary>
    public InterruptSignal()
    {
        _interrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, OnSignal);
        _terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, OnSignal);
    }

    /// <summary>Cancelled on the first signal.</summary>
    public CancellationToken Token => _source.Token;

    /// <summary>True once a signal arrived.</summary>
    public bool Raised => _source.IsCancellationRequested;

    private void OnSignal(PosixSignalContext context)
    {
        if (_source.IsCancellationRequested) return;
        context.Cancel = true;
        _source.Cancel();
    }

    /// <inheritdoc />
    public void Dispose()
    {
        _interrupt.Dispose();
        _terminate.Dispose();
        _source.Dispose();
    }
}
