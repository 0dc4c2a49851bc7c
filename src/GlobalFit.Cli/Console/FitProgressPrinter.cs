using System.Diagnostics;
using System.Globalization;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Cli.Console;

/// <summary>Shows a fit's progress: on a terminal one redrawn line (iteration, ETA, ΔlnL, sources per class); when
/// redirected, a plain line at most every ten seconds plus the first and last iterations, so logs stay short.</summary>
/// <remarks>ΔlnL is the change of the summed cold-chain ln L since the iteration before, not ln L itself: the sum runs
/// to millions on long records, where a change of a few units (a source found or lost) would hide in the digits.</remarks>
/// <remarks>Called from the coordinator's thread; writes are serialised by a lock because warnings may come from
/// elsewhere.</remarks>
public sealed class FitProgressPrinter : IFitProgress
{
    private static readonly TimeSpan PlainInterval = TimeSpan.FromSeconds(10);
    private readonly TextWriter _writer;
    private readonly bool _interactive;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly Lock _gate = new();
    private TimeSpan _lastPlain = TimeSpan.MinValue;
    private long _firstIteration = -1;
    private long _previousIteration = -1;
    private double _previousLogLikelihood = double.NaN;
    private bool _lineOpen;

    /// <summary>Creates a printer writing to the context's error stream.</summary>
    public FitProgressPrinter(CliContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        _writer = context.Error;
        _interactive = context.OutputIsTerminal;
    }

    /// <inheritdoc />
    public void IterationCompleted(IterationReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        lock (_gate)
        {
            if (_firstIteration < 0) _firstIteration = report.Iteration - 1;
            string line = Describe(report);
            _previousIteration = report.Iteration;
            _previousLogLikelihood = report.LogLikelihood;
            if (_interactive)
            {
                _writer.Write("\r" + line.PadRight(110));
                _lineOpen = true;
                if (report.Iteration == report.TotalIterations) EndLine();
                return;
            }
            bool edge = report.Iteration == _firstIteration + 1 || report.Iteration == report.TotalIterations;
            if (!edge && _clock.Elapsed - _lastPlain < PlainInterval) return;
            _lastPlain = _clock.Elapsed;
            _writer.WriteLine(line);
        }
    }

    /// <inheritdoc />
    public void Warning(string message)
    {
        lock (_gate)
        {
            EndLine();
            _writer.WriteLine($"warning: {message}");
        }
    }

    /// <inheritdoc />
    public void Note(string message)
    {
        lock (_gate)
        {
            EndLine();
            _writer.WriteLine(message);
        }
    }

    /// <summary>Ends a redrawn line left open.</summary>
    public void EndLine()
    {
        if (!_lineOpen) return;
        _writer.WriteLine();
        _lineOpen = false;
    }

    private string Describe(IterationReport report)
    {
        long done = report.Iteration - _firstIteration;
        long left = report.TotalIterations - report.Iteration;
        var eta = done > 0 ? TimeSpan.FromSeconds(_clock.Elapsed.TotalSeconds / done * left) : TimeSpan.Zero;
        string sources = string.Join(" ", report.SourcesPerClass.Select(c => $"{c.Key}={c.Value}"));
        return string.Create(CultureInfo.InvariantCulture,
            $"iteration {report.Iteration}/{report.TotalIterations}  {report.WallTime.TotalSeconds:F2} s  ETA {eta:hh\\:mm\\:ss}  ΔlnL {Change(report)}  sources {sources}{(report.Checkpointed ? "  [checkpoint]" : "")}");
    }

    // The first iteration this process saw (also the first after a resume) has no predecessor to differ from.
    private string Change(IterationReport report) =>
        _previousIteration == report.Iteration - 1 && double.IsFinite(_previousLogLikelihood)
            ? (report.LogLikelihood - _previousLogLikelihood).ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture)
            : "n/a";
}
