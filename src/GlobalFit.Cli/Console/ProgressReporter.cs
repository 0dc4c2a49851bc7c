using System.Diagnostics;

namespace GlobalFit.Cli.Console;

/// <summary>
/// Reports the progress of long work: a redrawn single line on a terminal, and otherwise (pipes, files,
/// CI logs) at most one plain line per ten percent so logs stay short and parseable.
/// </summary>
/// <remarks>Not thread-safe; report from the thread that runs the work.</remarks>
public sealed class ProgressReporter : IProgress<double>, IDisposable
{
    private readonly TextWriter _writer;
    private readonly string _task;
    private readonly bool _interactive;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private int _lastDecile = -1;
    private long _lastDrawMs = -1000;
    private bool _finished;

    /// <summary>Creates a reporter for <paramref name="task"/>; <paramref name="quiet"/> suppresses all output (e.g. with --json).</summary>
    public ProgressReporter(CliContext context, string task, bool quiet)
    {
        _writer = quiet ? TextWriter.Null : context.Error;
        _task = task;
        _interactive = context.OutputIsTerminal && !quiet;
    }

    /// <summary>Reports the completed fraction in [0, 1].</summary>
    public void Report(double fraction)
    {
        fraction = Math.Clamp(fraction, 0, 1);
        if (_interactive)
        {
            long now = _clock.ElapsedMilliseconds;
            if (now - _lastDrawMs < 100 && fraction < 1) return;
            _lastDrawMs = now;
            int width = 30, filled = (int)(fraction * width);
            _writer.Write($"\r{_task} [{new string('#', filled)}{new string('.', width - filled)}] {fraction * 100,5:F1}%  {_clock.Elapsed:mm\\:ss}");
            if (fraction >= 1) { _writer.WriteLine(); _finished = true; }
            return;
        }
        int decile = (int)(fraction * 10);
        if (decile <= _lastDecile) return;
        _lastDecile = decile;
        _writer.WriteLine($"{_task}: {decile * 10}% ({_clock.Elapsed.TotalSeconds:F1} s)");
        if (fraction >= 1) _finished = true;
    }

    /// <summary>Ends an interactive line that was left unfinished (e.g. after an error).</summary>
    public void Dispose()
    {
        if (_interactive && !_finished && _lastDrawMs >= 0) _writer.WriteLine();
    }
}
