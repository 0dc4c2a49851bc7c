namespace GlobalFit.Physics.Files;

/// <summary>A file could not be written for a reason of the disk or the system (full disk, I/O error), not of the
/// user's input: the command line maps it to its own exit code. Nothing half-written is left in the file's place.</summary>
public sealed class FileWriteException : IOException
{
    /// <summary>Creates the error.</summary>
    /// <param name="path">The file that could not be written.</param>
    /// <param name="cause">The failure, whose message is quoted.</param>
    public FileWriteException(string path, Exception cause)
        : base($"{path}: cannot be written: {cause?.Message}", cause)
    {
        FilePath = path;
    }

    /// <summary>The file that could not be written.</summary>
    public string FilePath { get; }

    /// <summary>The I/O failure behind <paramref name="error"/>: itself, or the first I/O or access failure among the
    /// exceptions it wraps (serialisers wrap the stream's errors in their own), or null.</summary>
    public static Exception? IoCause(Exception? error)
    {
        for (var e = error; e is not null; e = e.InnerException)
            if (e is IOException or UnauthorizedAccessException) return e;
        return null;
    }
}
