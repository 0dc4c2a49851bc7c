namespace GlobalFit.Physics.Files;

/// <summary>Plain words for why a file could not be opened or written, rather than the platform's message, which says
/// "access denied" for a folder standing where a file should be.</summary>
public static class FileProblem
{
    /// <summary>Describes the failure <paramref name="error"/> of an operation on <paramref name="path"/>.</summary>
    /// <param name="path">The file.</param>
    /// <param name="error">What the operation threw.</param>
    /// <returns>"is a folder, not a file" when a folder is in the way; otherwise the error's message.</returns>
    public static string Describe(string path, Exception error)
    {
        ArgumentNullException.ThrowIfNull(error);
        return Directory.Exists(path) ? "is a folder, not a file" : error.Message;
    }
}
