using GlobalFit.Physics.Tests.CheckValues;
using Xunit;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>Every source the code and tests cite is in the bibliography, and no file points at documents outside the
/// repository. Reads only files inside the repository (found from the test output folder).</summary>
public sealed class CitationTests(ITestOutputHelper output)
{
    private static readonly Bibliography Bibliography = Bibliography.Load(RepositoryTree.BibliographyPath);

    [Fact]
    public void Every_citation_in_code_and_tests_has_a_bibliography_entry()
    {
        var found = CitationsInRepository().ToList();
        var missing = found.Where(c => !Bibliography.Contains(c.Citation))
            .Select(c => $"{c.Place}: \"{c.Citation.Text}\" ({c.Citation.FirstAuthor} {c.Citation.Year}{(c.Citation.ArxivId is null ? "" : ", arXiv:" + c.Citation.ArxivId)})")
            .ToList();
        output.WriteLine($"{found.Count} citations checked against {Bibliography.Entries.Count} entries");
        // A scan that finds nothing would pass silently: the code cites dozens of works.
        Assert.True(found.Count > 100, $"only {found.Count} citations recognised; the recogniser or the file walk is broken");
        Assert.True(missing.Count == 0, "cited but not in src/BIBLIOGRAPHY.md:\n" + string.Join("\n", missing));
    }

    [Fact]
    public void Every_arXiv_id_in_code_and_tests_is_in_the_bibliography()
    {
        var missing = new List<string>();
        int count = 0;
        foreach (var (relative, full) in SourceFiles())
            foreach (var (line, text) in CommentText.Runs(File.ReadAllLines(full), CommentMarker(relative)))
                foreach (var id in CitationRecogniser.ArxivIds(text))
                {
                    count++;
                    if (!Bibliography.ContainsArxivId(id)) missing.Add($"{relative}:{line}: arXiv:{id}");
                }
        Assert.True(count > 20, $"only {count} arXiv ids found");
        Assert.True(missing.Count == 0, "arXiv ids not in src/BIBLIOGRAPHY.md:\n" + string.Join("\n", missing));
    }

    [Fact]
    public void No_file_of_the_project_names_a_document_outside_the_repository()
    {
        var hits = new List<string>();
        var files = RepositoryTree.TextFiles();
        foreach (var (relative, full) in files)
        {
            var lines = File.ReadAllLines(full);
            for (int i = 0; i < lines.Length; i++)
                foreach (var name in OutsideDocuments.Find(lines[i]))
                    hits.Add($"{relative}:{i + 1}: {name}");
        }
        Assert.True(files.Count > 300, $"only {files.Count} files walked");
        Assert.True(hits.Count == 0, "files that name documents outside the repository (cite the published source instead):\n" + string.Join("\n", hits));
    }

    [Fact]
    public void Bibliography_keys_are_unique_sorted_and_built_from_first_author_and_year()
    {
        var entries = Bibliography.Entries;
        Assert.True(entries.Count > 50, $"only {entries.Count} entries parsed");
        var problems = new List<string>();
        foreach (var e in entries)
        {
            string stem = Bibliography.Normalise(e.FirstAuthor) + e.Year;
            if (e.Key != stem && !(e.Key.Length == stem.Length + 1 && e.Key.StartsWith(stem, StringComparison.Ordinal) && char.IsAsciiLetterLower(e.Key[^1])))
                problems.Add($"line {e.Line}: key '{e.Key}' should be '{stem}' (or '{stem}a', '{stem}b', …)");
        }
        foreach (var group in entries.GroupBy(e => e.Key).Where(g => g.Count() > 1))
            problems.Add($"key '{group.Key}' appears {group.Count()} times");
        var keys = entries.Select(e => e.Key).ToList();
        if (!keys.SequenceEqual(keys.Order(StringComparer.Ordinal)))
            problems.Add("entries are not sorted by key");
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void Every_check_value_table_names_a_source_on_every_row()
    {
        var tables = RepositoryTree.TextFiles(".csv").Where(f => f.Relative.Contains("/CheckValues/", StringComparison.Ordinal)).ToList();
        Assert.NotEmpty(tables);
        foreach (var (_, full) in tables)
        {
            var table = CheckValueTable.Read(full);
            Assert.NotEmpty(table.Rows);
        }
    }

    [Fact]
    public void The_README_links_the_bibliography_under_methods_to_cite()
    {
        string readme = File.ReadAllText(Path.Combine(RepositoryTree.Root, "README.md"));
        int section = readme.IndexOf("## Methods to cite", StringComparison.Ordinal);
        Assert.True(section >= 0, "README.md has no 'Methods to cite' section");
        int next = readme.IndexOf("\n## ", section + 1, StringComparison.Ordinal);
        string body = next < 0 ? readme[section..] : readme[section..next];
        Assert.Contains("(src/BIBLIOGRAPHY.md)", body);
    }

    /// <summary>C# files under src and tests, and the Python reference scripts under tests.</summary>
    private static IEnumerable<(string Relative, string FullPath)> SourceFiles() =>
        RepositoryTree.TextFiles().Where(f =>
            (f.Relative.StartsWith("src/", StringComparison.Ordinal) || f.Relative.StartsWith("tests/", StringComparison.Ordinal))
            && (f.Relative.EndsWith(".cs", StringComparison.Ordinal) || f.Relative.EndsWith(".py", StringComparison.Ordinal)));

    private static string CommentMarker(string relative) => relative.EndsWith(".py", StringComparison.Ordinal) ? "#" : "//";

    /// <summary>Citations in the comments of code and tests and in the source column of check-value tables.</summary>
    private static IEnumerable<(string Place, Citation Citation)> CitationsInRepository()
    {
        foreach (var (relative, full) in SourceFiles())
        {
            foreach (var (line, text) in CommentText.Runs(File.ReadAllLines(full), CommentMarker(relative)))
                foreach (var citation in CitationRecogniser.Find(text))
                    yield return ($"{relative}:{line}", citation);
        }
        foreach (var (relative, full) in RepositoryTree.TextFiles(".csv").Where(f => f.Relative.Contains("/CheckValues/", StringComparison.Ordinal)))
        {
            var table = CheckValueTable.Read(full);
            for (int i = 0; i < table.Rows.Count; i++)
                foreach (var citation in CitationRecogniser.Find(table.Rows[i][^1]))
                    yield return ($"{relative} row {i + 1}", citation);
        }
    }
}
