using System.Text.RegularExpressions;

namespace GlobalFit.Cli.Tests.Support;

/// <summary>The names a layout document (a LAYOUT.md) promises: the tree in its first code block after a given
/// heading, the attributes its lines list, and the members of each compound dataset from the table after
/// "Members of `name`".</summary>
/// <remarks>Paths are spelt as in <see cref="Hdf5Structure"/>. A tree segment in angle brackets (<c>&lt;class id&gt;</c>)
/// stands for any name; an attribute list that says "free-form" allows any attribute there. Lines marked
/// "(optional)" may be absent from a file, together with everything below them.</remarks>
internal sealed partial class LayoutDocument
{
    private readonly List<(string Pattern, bool Optional)> _names = [];

    private LayoutDocument() { }

    /// <summary>Reads the tree under the first heading containing <paramref name="heading"/>.</summary>
    public static LayoutDocument Parse(string markdown, string heading)
    {
        var lines = markdown.Replace("\r", "", StringComparison.Ordinal).Split('\n');
        int at = Array.FindIndex(lines, l => l.StartsWith('#') && l.Contains(heading, StringComparison.Ordinal));
        if (at < 0) throw new InvalidOperationException($"no heading with '{heading}'");
        int start = Array.FindIndex(lines, at, l => l.StartsWith("```", StringComparison.Ordinal)) + 1;
        int end = Array.FindIndex(lines, start, l => l.StartsWith("```", StringComparison.Ordinal));
        var document = new LayoutDocument();
        var parents = new List<(string Path, bool Optional)>();
        for (int i = start; i < end; i++)
        {
            string line = lines[i];
            var match = TreeLine().Match(line);
            if (!match.Success) continue;
            int depth = match.Groups[1].Length / 4;
            string name = match.Groups[2].Value.TrimEnd('/');
            string rest = match.Groups[3].Value;
            parents.RemoveRange(depth, parents.Count - depth);
            string parentPath = depth == 0 ? "" : parents[depth - 1].Path;
            bool optional = rest.Contains("(optional)", StringComparison.Ordinal) || (depth > 0 && parents[depth - 1].Optional);
            string path = depth == 0 ? "/" : (parentPath == "/" ? "" : parentPath) + "/" + name;
            parents.Add((path, optional));
            document._names.Add((path, optional));
            var attributes = AttributeList().Match(rest);
            if (attributes.Success)
            {
                foreach (string attribute in attributes.Groups[1].Value.Split(','))
                {
                    string a = attribute.Trim();
                    string owner = path;
                    document._names.Add(a.Contains("free-form", StringComparison.Ordinal) ? (owner + "@*", true) : (owner + "@" + a, optional));
                }
            }
            if (rest.TrimStart().StartsWith("compound", StringComparison.Ordinal))
                foreach (string member in Members(lines, name))
                    document._names.Add((path + "#" + member, optional));
        }
        return document;
    }

    /// <summary>Names of <paramref name="file"/> the document does not describe.</summary>
    public IEnumerable<string> Undocumented(IEnumerable<string> file) => file.Where(n => !_names.Any(d => Matches(d.Pattern, n)));

    /// <summary>Names the document requires that <paramref name="file"/> lacks.</summary>
    public IEnumerable<string> Missing(IReadOnlyCollection<string> file) =>
        _names.Where(d => !d.Optional && !d.Pattern.EndsWith("@*", StringComparison.Ordinal) && !file.Any(n => Matches(d.Pattern, n))).Select(d => d.Pattern);

    private static IEnumerable<string> Members(string[] lines, string dataset)
    {
        int at = Array.FindIndex(lines, l => l.Contains($"Members of `{dataset}`", StringComparison.Ordinal));
        if (at < 0) throw new InvalidOperationException($"the document has no member table for the compound '{dataset}'");
        int i = Array.FindIndex(lines, at, l => l.StartsWith('|'));
        for (i += 2; i < lines.Length && lines[i].StartsWith('|'); i++)
            yield return MemberCell().Match(lines[i]).Groups[1].Value;
    }

    // A pattern segment "<...>" matches one name; "@*" matches any attribute of its owner.
    private static bool Matches(string pattern, string name)
    {
        string regex = "^" + string.Concat(Segment().Split(pattern).Select((part, k) => k % 2 == 1 ? "[^/@#]+" : Regex.Escape(part))) + "$";
        regex = regex.Replace("@\\*", "@[^/@#]+", StringComparison.Ordinal);
        return Regex.IsMatch(name, regex);
    }

    [GeneratedRegex(@"^([│├└─ ]*?)(/|<[^>]+>/?|[^\s│├└─<]\S*)(.*)$")]
    private static partial Regex TreeLine();

    [GeneratedRegex(@"attributes?:\s*(.*?)(?:\s{2,}|\s*\(|\s*=|$)")]
    private static partial Regex AttributeList();

    [GeneratedRegex(@"^\|\s*`([^`]+)`")]
    private static partial Regex MemberCell();

    [GeneratedRegex(@"(<[^>]+>)")]
    private static partial Regex Segment();
}
