using System.Text.RegularExpressions;

namespace GlobalFit.Engine.Tests.Architecture;

/// <summary>The folders of GlobalFit.Engine import each other only as the table in DEVELOPERS.md allows, so the table
/// and the code cannot drift apart and no two folders import each other.</summary>
public sealed class EngineFolderDependencyTests
{
    private static readonly string Root = RepositoryRoot();

    [Fact]
    public void Every_engine_folder_imports_only_what_the_contributor_guide_allows()
    {
        var allowed = AllowedImports();
        var engine = Path.Combine(Root, "src", "GlobalFit.Engine");
        var problems = new List<string>();
        foreach (var (folder, imports) in ActualImports(engine))
        {
            if (!allowed.TryGetValue(folder, out var permitted))
            {
                problems.Add($"{folder}/ is not in the DEVELOPERS.md table");
                continue;
            }
            foreach (string imported in imports.Where(i => i != folder && !permitted.Contains(i)))
                problems.Add($"{folder}/ imports {imported}/");
        }
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void The_allowed_imports_form_no_cycle()
    {
        var allowed = AllowedImports();
        var state = new Dictionary<string, int>(StringComparer.Ordinal);
        bool Cyclic(string folder)
        {
            if (state.TryGetValue(folder, out int s)) return s == 1;
            state[folder] = 1;
            bool cyclic = allowed.GetValueOrDefault(folder, []).Any(Cyclic);
            state[folder] = 2;
            return cyclic;
        }
        Assert.DoesNotContain(allowed.Keys, Cyclic);
    }

    // Rows of the table "| `Folder/` | what | may import |"; "everything above" lists the rows above, "except" removes.
    private static Dictionary<string, HashSet<string>> AllowedImports()
    {
        var rows = Regex.Matches(File.ReadAllText(Path.Combine(Root, "DEVELOPERS.md")), @"^\| `(?<folder>[A-Za-z]+)/` \| .*? \| (?<imports>[^|]*) \|$", RegexOptions.Multiline);
        var result = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal);
        var above = new List<string>();
        foreach (Match row in rows)
        {
            string folder = row.Groups["folder"].Value, imports = row.Groups["imports"].Value.Trim();
            HashSet<string> set;
            if (imports.StartsWith("everything above", StringComparison.Ordinal))
            {
                set = new HashSet<string>(above, StringComparer.Ordinal);
                var except = Regex.Match(imports, @"except (?<names>.*)$");
                if (except.Success) set.ExceptWith(Names(except.Groups["names"].Value));
            }
            else
            {
                set = imports == "—" ? [] : new HashSet<string>(Names(imports), StringComparer.Ordinal);
            }
            result[folder] = set;
            above.Add(folder);
        }
        Assert.True(result.Count >= 10, "the folder table of DEVELOPERS.md was not found");
        return result;
    }

    private static IEnumerable<string> Names(string list) => list.Split([',', ' '], StringSplitOptions.RemoveEmptyEntries).Where(n => n != "and");

    private static Dictionary<string, HashSet<string>> ActualImports(string engine)
    {
        var result = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal);
        foreach (string file in Directory.EnumerateFiles(engine, "*.cs", SearchOption.AllDirectories))
        {
            string relative = Path.GetRelativePath(engine, file);
            if (relative.StartsWith("obj", StringComparison.Ordinal) || relative.StartsWith("bin", StringComparison.Ordinal) || !relative.Contains(Path.DirectorySeparatorChar)) continue;
            string folder = relative[..relative.IndexOf(Path.DirectorySeparatorChar)];
            var imports = result.TryGetValue(folder, out var set) ? set : result[folder] = new HashSet<string>(StringComparer.Ordinal);
            foreach (Match m in Regex.Matches(File.ReadAllText(file), @"^using (static )?GlobalFit\.Engine\.(?<folder>[A-Za-z]+)", RegexOptions.Multiline))
                imports.Add(m.Groups["folder"].Value);
        }
        return result;
    }

    private static string RepositoryRoot([System.Runtime.CompilerServices.CallerFilePath] string path = "")
    {
        var folder = new DirectoryInfo(Path.GetDirectoryName(path)!);
        while (!File.Exists(Path.Combine(folder.FullName, "globalfit.sln"))) folder = folder.Parent!;
        return folder.FullName;
    }
}
