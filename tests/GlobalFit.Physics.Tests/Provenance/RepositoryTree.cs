namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>The files of the repository the tests were built from, found by walking up from the test output folder to
/// the folder that holds <c>globalfit.sln</c>. Nothing outside that folder is read.</summary>
internal static class RepositoryTree
{
    /// <summary>The top-level folders and files whose text the provenance checks read.</summary>
    private static readonly string[] CheckedTopLevel = ["src", "tests", "configs", "README.md", "DEVELOPERS.md"];

    /// <summary>Build outputs and tool folders, never checked.</summary>
    private static readonly HashSet<string> SkippedFolders = new(StringComparer.Ordinal) { "bin", "obj", "TestResults", "BenchmarkDotNet.Artifacts" };

    /// <summary>The repository root.</summary>
    /// <exception cref="InvalidOperationException">No folder above the test output holds globalfit.sln.</exception>
    public static string Root { get; } = FindRoot();

    /// <summary>The repository's bibliography.</summary>
    public static string BibliographyPath => Path.Combine(Root, "src", "BIBLIOGRAPHY.md");

    /// <summary>Every text file under src, tests and configs, and README.md and DEVELOPERS.md, as (path relative to the
    /// root with '/' separators, full path). Files with a NUL byte in their first 8 KiB are binary and left out.</summary>
    public static IReadOnlyList<(string Relative, string FullPath)> TextFiles()
    {
        var files = new List<(string, string)>();
        foreach (var entry in CheckedTopLevel)
        {
            string path = Path.Combine(Root, entry);
            if (File.Exists(path)) Add(path);
            else if (Directory.Exists(path)) Walk(new DirectoryInfo(path));
        }
        return files;

        void Walk(DirectoryInfo folder)
        {
            foreach (var file in folder.EnumerateFiles()) Add(file.FullName);
            foreach (var sub in folder.EnumerateDirectories())
                if (!SkippedFolders.Contains(sub.Name) && !sub.Name.StartsWith('.')) Walk(sub);
        }

        void Add(string fullPath)
        {
            if (!IsText(fullPath)) return;
            files.Add((Path.GetRelativePath(Root, fullPath).Replace('\\', '/'), fullPath));
        }
    }

    /// <summary>The text files whose relative path ends with <paramref name="extension"/> (e.g. ".cs").</summary>
    public static IEnumerable<(string Relative, string FullPath)> TextFiles(string extension) =>
        TextFiles().Where(f => f.Relative.EndsWith(extension, StringComparison.Ordinal));

    private static bool IsText(string path)
    {
        using var stream = File.OpenRead(path);
        Span<byte> head = stackalloc byte[8192];
        int read = stream.Read(head);
        return !head[..read].Contains((byte)0);
    }

    private static string FindRoot()
    {
        var folder = new DirectoryInfo(AppContext.BaseDirectory);
        while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "globalfit.sln")))
            folder = folder.Parent;
        return folder?.FullName ?? throw new InvalidOperationException(
            $"globalfit.sln not found above {AppContext.BaseDirectory}: the provenance checks run from a build inside the repository");
    }
}
