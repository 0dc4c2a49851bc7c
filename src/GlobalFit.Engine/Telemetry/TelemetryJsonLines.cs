using System.Text;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Telemetry;

/// <summary>The <c>RUN/telemetry.jsonl</c> file: one JSON object per line, appended in batches by the span and metric
/// exporters, each batch flushed before the exporter returns.</summary>
/// <remarks>Appending (never rewriting) lets a resumed run add to the same file. A crash can leave a last line without
/// its line feed; <see cref="CriticalPathAnalysis"/> ignores such a line. Thread-safe: the span and metric exporters
/// export from different threads.</remarks>
public sealed class TelemetryJsonLines : IDisposable
{
    /// <summary>File name inside the run folder.</summary>
    public const string FileName = "telemetry.jsonl";

    private readonly object _gate = new();
    private readonly Stream _stream;

    /// <summary>Opens <paramref name="path"/> for appending, creating it if needed.</summary>
    /// <param name="path">The file.</param>
    /// <exception cref="InvalidInputException">The file cannot be opened.</exception>
    public TelemetryJsonLines(string path)
    {
        Path = path;
        try
        {
            _stream = WriteStreams.Open(path, FileMode.Append, FileAccess.Write, FileShare.ReadWrite | FileShare.Delete);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, null, $"cannot be opened for telemetry: {e.Message}", e);
        }
    }

    /// <summary>The file.</summary>
    public string Path { get; }

    /// <summary>The first failed write (file and cause), or null: telemetry is diagnostics, so a failure is reported
    /// rather than stopping the fit.</summary>
    public string? WriteFailure { get; private set; }

    /// <summary>Appends <paramref name="lines"/> (each a JSON object without line feed) and flushes them to the file.</summary>
    /// <param name="lines">The lines.</param>
    /// <returns>False when the file could not be written (the exporter then reports a failed export).</returns>
    public bool Append(IReadOnlyList<string> lines)
    {
        ArgumentNullException.ThrowIfNull(lines);
        if (lines.Count == 0) return true;
        var text = new StringBuilder();
        foreach (string line in lines) text.Append(line).Append('\n');
        byte[] bytes = Encoding.UTF8.GetBytes(text.ToString());
        lock (_gate)
        {
            try
            {
                _stream.Write(bytes);
                _stream.Flush();
                return true;
            }
            catch (Exception e) when (e is IOException or ObjectDisposedException)
            {
                WriteFailure ??= $"{Path}: {e.Message}";
                return false;
            }
        }
    }

    /// <summary>Closes the file.</summary>
    public void Dispose()
    {
        lock (_gate) _stream.Dispose();
    }
}
