
namespace GlobalFit.Physics.Files;

/// <summary>Writes a file so that readers see either the old file or the complete new one, never a half-written file.</summary>
/// <remarks>The content goes to a hidden temporary file in the destination folder (same file system, so the
/// final rename is atomic), is flushed to disk, and is then renamed over the destination. On any failure the
/// temporary file is deleted and the destination is left as it was.</remarks>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="path"/> through <paramref name="writeContent"/>.</summary>
    /// <exception cref="InvalidInputException">The path exists and <paramref name="overwrite"/> is false, its folder
    /// does not exist, or the path cannot hold a file (a folder in the way, no permission).</exception>
    /// <exception cref="FileWriteException">The write or the rename failed (full disk, I/O error).</exception>
    public static void Write(string path, bool overwrite, Action<Stream> writeContent)
    {
        string fullPath = Path.GetFullPath(path);
        if (!overwrite && (File.Exists(fullPath) || Directory.Exists(fullPath)))
            throw new InvalidInputException(path, null, "already exists; refusing to replace it without overwrite");
        string folder = Path.GetDirectoryName(fullPath) ?? throw new InvalidInputException(path, null, "is not a file path");
        if (!Directory.Exists(folder))
            throw new InvalidInputException(path, null, $"cannot be written: folder {folder} does not exist");

        string temporary = Path.Combine(folder, $".{Path.GetFileName(fullPath)}.{Guid.NewGuid():N}.tmp");
        bool renamed = false;
        try
        {
            using (var stream = WriteStreams.Open(temporary, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None))
            {
                writeContent(stream);
                WriteStreams.FlushToDisk(stream);
            }
            File.Move(temporary, fullPath, overwrite);
            renamed = true;
        }
        catch (Exception e) when (FileWriteException.IoCause(e) is { } cause)
        {
            // A path the user chose that cannot hold a file (a folder in the way, no permission, a missing or special
            // folder) is bad input; anything else (full disk, I/O error) is a failed write.
            if (Directory.Exists(fullPath) || cause is UnauthorizedAccessException or FileNotFoundException or DirectoryNotFoundException)
                throw new InvalidInputException(path, null, $"cannot be written: {FileProblem.Describe(fullPath, cause)}", e);
            throw new FileWriteException(path, cause);
        }
        finally
        {
            if (!renamed) DeleteQuietly(temporary);
        }
    }

    // The write has already failed; a failure to tidy up must not hide the original error.
    private static void DeleteQuietly(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
