using System.Text.RegularExpressions;

namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>Names of documents that are not part of the repository: the team's working notes and the folder beside the
/// repository that held them. A file of the project that names one points its reader at something a clone does not have.</summary>
/// <remarks>The patterns are written with character classes so that this file does not itself contain the names it looks
/// for. The sibling-folder pattern is case-sensitive: <c>tests/Shared</c> is a folder of the repository.</remarks>
internal static class OutsideDocuments
{
    private static readonly Regex Pattern = new(
        @"(?-i:\.\./s[h]ared)|s[h]ared/(?:notes|reference|design)\b|reference s[h]eets?\b|\bthe s[h]eets?\b|\bs[h]eet\s*(?:§|section)" +
        @"|check-value[s]\.csv|\b(?:detector-noise-g[b]|time-frequenc[y]|mbh[b]|emri-analytic-kludg[e]|librarie[s]|style-anchor[s]|architectur[e])\.md\b",
        RegexOptions.IgnoreCase | RegexOptions.CultureInvariant);

    /// <summary>The places in <paramref name="text"/> that name an outside document.</summary>
    public static IEnumerable<string> Find(string text) => Pattern.Matches(text).Select(m => m.Value);
}
