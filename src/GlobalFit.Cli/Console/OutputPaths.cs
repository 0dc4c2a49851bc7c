using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Console;

/// <summary>Checks an output path before any work starts, so a run never computes for minutes and then fails
/// to write, and never overwrites a file unless asked to.</summary>
public static class OutputPaths
{
    /// <summary>Rejects <paramref name="path"/> when it exists (unless <paramref name="force"/>), is a folder, or its folder is missing or not writable.</summary>
    /// <param name="path">The output file.</param>
    /// <param name="force">Allow replacing an existing file.</param>
    /// <param name="optionName">The option that named the path, for the message.</param>
    /// <exception cref="InvalidInputException">The path cannot be written.</exception>
    public static string CheckWritable(string path, bool force, string optionName)
    {
        string full = Path.GetFullPath(path);
        if (Directory.Exists(full))
            throw new InvalidInputException(path, optionName, "is a folder; give a file name");
        if (File.Exists(full) && !force)
            throw new InvalidInputException(path, optionName, "already exists; pass --force to replace it");
        string? folder = Path.GetDirectoryName(full);
        if (folder is null || !Directory.Exists(folder))
            throw new InvalidInputException(path, optionName, $"folder '{folder}' does not exist");
        string probe = Path.Combine(folder, $".globalfit-write-probe-{Environment.ProcessId}-{Guid.NewGuid():N}");
        try
        {
            using (File.Create(probe, 1, FileOptions.DeleteOnClose)) { }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, optionName, $"folder '{folder}' is not writable ({e.Message})");
        }
        return full;
    }
}
