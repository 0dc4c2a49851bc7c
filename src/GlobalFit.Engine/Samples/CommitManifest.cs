using System.Globalization;
using System.Text;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Samples;

/// <summary>The commit point of a samples folder: the last iteration whose samples are all on disk, and how many bytes of
/// each sample file belong to committed iterations. Bytes past a file's committed length are an interrupted append.</summary>
/// <remarks>Stored as the text file <c>samples/committed</c> (Catalogue/LAYOUT.md) and replaced atomically after the chain
/// files are flushed, so a crash at any moment leaves either the old or the new commit point, never a mixture.</remarks>
internal sealed record CommitManifest(long Iteration, IReadOnlyDictionary<string, long> Lengths)
{
    public const string FileName = "committed";

    private const string FirstLine = "globalfit chain commit 1";

    public static CommitManifest Empty { get; } = new(0, new Dictionary<string, long>(StringComparer.Ordinal));

    public long LengthOf(string fileName) => Lengths.TryGetValue(fileName, out long length) ? length : 0;

    /// <summary>Reads the manifest of <paramref name="samplesFolder"/>; no file means nothing was committed yet, unless
    /// sample files hold data, in which case the record was lost and the store cannot tell what was committed.</summary>
    /// <exception cref="InvalidInputException">The record is missing beside non-empty sample files, or is malformed.</exception>
    public static CommitManifest Load(string samplesFolder)
    {
        string path = Path.Combine(samplesFolder, FileName);
        if (!File.Exists(path))
        {
            if (Directory.Exists(samplesFolder) && Directory.EnumerateFiles(samplesFolder, "*" + WorkerFileName.Extension).Any(f => new FileInfo(f).Length > 0))
                throw new InvalidInputException(path, null, "is missing, but sample files beside it hold data: which samples were committed cannot be told, so none are read");
            return Empty;
        }
        string[] lines = TextFile.ReadUtf8(path).Split('\n').Select(l => l.TrimEnd('\r')).ToArray();
        if (lines.Length < 2 || lines[0] != FirstLine)
            throw new InvalidInputException(path, "line 1", $"is not a chain commit file (expected the first line '{FirstLine}')");
        var iterationField = lines[1].Split(' ');
        if (iterationField.Length != 2 || iterationField[0] != "iteration"
            || !long.TryParse(iterationField[1], NumberStyles.None, CultureInfo.InvariantCulture, out long iteration))
            throw new InvalidInputException(path, "line 2", "expected 'iteration N' with N a whole number");
        var lengths = new Dictionary<string, long>(StringComparer.Ordinal);
        for (int i = 2; i < lines.Length; i++)
        {
            if (lines[i].Length == 0) continue;
            int space = lines[i].LastIndexOf(' ');
            if (space <= 0 || !long.TryParse(lines[i].AsSpan(space + 1), NumberStyles.None, CultureInfo.InvariantCulture, out long length)
                || WorkerFileName.ToWorkerId(lines[i][..space]) is null || !lengths.TryAdd(lines[i][..space], length))
                throw new InvalidInputException(path, $"line {i + 1}", "expected a distinct sample file name and its committed length in bytes");
        }
        return new CommitManifest(iteration, lengths);
    }

    /// <summary>Replaces the manifest of <paramref name="samplesFolder"/> atomically.</summary>
    public void Save(string samplesFolder)
    {
        var text = new StringBuilder();
        text.Append(FirstLine).Append('\n');
        text.Append(CultureInfo.InvariantCulture, $"iteration {Iteration}\n");
        foreach (var (file, length) in Lengths.OrderBy(p => p.Key, StringComparer.Ordinal))
            text.Append(CultureInfo.InvariantCulture, $"{file} {length}\n");
        byte[] bytes = Encoding.UTF8.GetBytes(text.ToString());
        AtomicFile.Write(Path.Combine(samplesFolder, FileName), overwrite: true, stream => stream.Write(bytes));
    }
}
