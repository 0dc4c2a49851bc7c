using System.Globalization;
using System.Text;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary><c>RUN/worker-failures.log</c>: every worker failure of a run with its full exception, appended as plain
/// text (a line <c>UTC-TIME worker WORKER-ID failed:</c>, the exception with its stack trace, a blank line). The terminal
/// shows one line per failure; this file holds what a bug report needs.</summary>
public sealed class WorkerFailureLog(string path)
{
    private readonly object _gate = new();

    /// <summary>The file.</summary>
    public string Path { get; } = path;

    /// <summary>Appends <paramref name="error"/> of <paramref name="workerId"/>.</summary>
    /// <remarks>A failure to write the log is not a reason to stop the fit: the one-line warning has already reached the
    /// user, and a full disk stops the run at its next sample or checkpoint write anyway.</remarks>
    public void Record(string workerId, Exception error)
    {
        ArgumentNullException.ThrowIfNull(error);
        string entry = string.Create(CultureInfo.InvariantCulture, $"{DateTime.UtcNow:yyyy-MM-ddTHH:mm:ssZ} worker {workerId} failed:\n{error}\n\n");
        lock (_gate)
        {
            try
            {
                using var stream = WriteStreams.Open(Path, FileMode.Append, FileAccess.Write, FileShare.Read);
                stream.Write(Encoding.UTF8.GetBytes(entry));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // See remarks.
            }
        }
    }
}
