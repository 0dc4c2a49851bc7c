using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>Which observation file a run was fitted to: its size and the SHA-256 of its bytes, kept in the run folder as
/// <c>data.identity</c> so that <c>resume</c> and <c>catalogue</c> notice a file that was replaced or edited since.</summary>
/// <remarks>File layout (text, UTF-8, three lines):
/// <code>
/// globalfit data identity 1
/// size_bytes 123456789
/// sha256 &lt;64 lowercase hexadecimal digits&gt;
/// </code>
/// The digest is computed in one sequential pass over the file (about 0.1 s for a year of data at 5 s on a disk that
/// reads 1 GB/s), separate from the HDF5 read, which seeks.</remarks>
/// <param name="SizeBytes">Length of the file.</param>
/// <param name="Sha256">SHA-256 of its bytes, lowercase hexadecimal.</param>
public sealed record DataIdentity(long SizeBytes, string Sha256)
{
    /// <summary>The file's name inside a run folder.</summary>
    public const string FileName = "data.identity";

    private const string FirstLine = "globalfit data identity 1";

    /// <summary>The identity of the file at <paramref name="path"/>.</summary>
    /// <exception cref="InvalidInputException">The file cannot be read.</exception>
    public static DataIdentity Of(string path)
    {
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 20, FileOptions.SequentialScan);
            return new DataIdentity(stream.Length, Convert.ToHexStringLower(SHA256.HashData(stream)));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, null, FileProblem.Describe(path, e), e);
        }
    }

    /// <summary>Records this identity in the run folder, replacing what was there.</summary>
    public void Write(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        string text = string.Create(CultureInfo.InvariantCulture, $"{FirstLine}\nsize_bytes {SizeBytes}\nsha256 {Sha256}\n");
        AtomicFile.Write(layout.DataIdentityFile, overwrite: true, s => s.Write(Encoding.UTF8.GetBytes(text)));
    }

    /// <summary>The identity recorded in the run folder, or null for a run made before identities were recorded.</summary>
    /// <exception cref="InvalidInputException">The record is malformed (the line is named).</exception>
    public static DataIdentity? Read(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        string path = layout.DataIdentityFile;
        if (!File.Exists(path)) return null;
        string[] lines = TextFile.ReadUtf8(path).Split('\n');
        if (lines.Length < 3 || lines[0] != FirstLine)
            throw new InvalidInputException(path, "line 1", $"is not a data identity record (expected the first line '{FirstLine}')");
        if (!lines[1].StartsWith("size_bytes ", StringComparison.Ordinal)
            || !long.TryParse(lines[1].AsSpan("size_bytes ".Length), NumberStyles.None, CultureInfo.InvariantCulture, out long size))
            throw new InvalidInputException(path, "line 2", "expected 'size_bytes N' with N a whole number");
        string digest = lines[2].StartsWith("sha256 ", StringComparison.Ordinal) ? lines[2]["sha256 ".Length..] : "";
        if (digest.Length != 64 || !digest.All(char.IsAsciiHexDigitLower))
            throw new InvalidInputException(path, "line 3", "expected 'sha256 ' and 64 lowercase hexadecimal digits");
        return new DataIdentity(size, digest);
    }

    /// <summary>Checks that <paramref name="dataPath"/> is still the file the run in <paramref name="layout"/> was fitted
    /// to.</summary>
    /// <param name="layout">The run.</param>
    /// <param name="dataPath">The observation file its configuration names.</param>
    /// <param name="acceptNewData">The user's explicit override (<c>--accept-new-data</c>): a different file is then
    /// only warned about.</param>
    /// <param name="warn">Receives warnings.</param>
    /// <returns>The file's identity now, for the caller to record when the run goes on with it.</returns>
    /// <exception cref="InvalidInputException">The file differs from the recorded one and the override was not given.</exception>
    public static DataIdentity Verify(RunFolderLayout layout, string dataPath, bool acceptNewData, Action<string> warn)
    {
        ArgumentNullException.ThrowIfNull(warn);
        var recorded = Read(layout);
        var current = Of(dataPath);
        if (recorded is null)
            warn($"{layout.Root} has no record of its data file's identity (made by an earlier version); {dataPath} is taken as its data");
        else if (recorded != current && acceptNewData)
            warn($"{dataPath} is not the file this run was fitted to ({Describe(recorded)}; now {Describe(current)}); going on with it as --accept-new-data asks");
        else if (recorded != current)
            throw new InvalidInputException(dataPath, null,
                $"is not the file this run was fitted to: the run recorded {Describe(recorded)}, the file now has {Describe(current)}; restore the original file, or pass --accept-new-data to go on with this one");
        return current;
    }

    private static string Describe(DataIdentity identity) =>
        string.Create(CultureInfo.InvariantCulture, $"{identity.SizeBytes} bytes, SHA-256 {identity.Sha256[..12]}…");
}
