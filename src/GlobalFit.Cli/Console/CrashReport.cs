using System.Globalization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Console;

/// <summary>Keeps the full story of an unexpected error (a bug) out of the terminal: the stack trace goes to a crash log
/// file, and the user sees one line naming the error and the file.</summary>
public static class CrashReport
{
    /// <summary>Writes <paramref name="error"/> with its stack trace and the command line to a new file in
    /// <paramref name="folder"/> (the system temporary folder when null) and returns its path, or null when even that
    /// write failed.</summary>
    /// <param name="error">The unexpected exception.</param>
    /// <param name="args">The command line.</param>
    /// <param name="folder">Where to put the log.</param>
    public static string? Write(Exception error, IReadOnlyList<string> args, string? folder = null)
    {
        ArgumentNullException.ThrowIfNull(error);
        ArgumentNullException.ThrowIfNull(args);
        try
        {
            string utcTime = DateTime.UtcNow.ToString("yyyyMMdd'T'HHmmss'Z'", CultureInfo.InvariantCulture);
            string path = Path.Combine(folder ?? Path.GetTempPath(), $"globalfit-crash-{utcTime}-{Environment.ProcessId}.log");
            File.WriteAllText(path, $"""
                {ProgramInfo.Generator} crashed at {UtcText.Format(DateTimeOffset.UtcNow)}
                command line: globalfit {string.Join(' ', args)}

                {error}

                """);
            return path;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }
}
