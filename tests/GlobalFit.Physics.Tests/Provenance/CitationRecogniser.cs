using System.Net;
using System.Text.RegularExpressions;

namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>Finds author–year citations in comment text, in the forms DEVELOPERS.md asks for.</summary>
/// <remarks>
/// <para>Recognised (YYYY a year): <c>Surname YYYY</c>, <c>Surname &amp; Surname YYYY</c>,
/// <c>Surname, Surname &amp; Surname YYYY</c>, <c>Surname et al. YYYY</c> (also <c>Surname, Surname et al. YYYY</c>),
/// each with the year bare or in parentheses (<c>Surname (YYYY)</c>), optionally followed by an arXiv id
/// (<c>… YYYY (arXiv:gr-qc/0209011)</c> or <c>… YYYY, arXiv:1803.01944</c>). "and" may stand for "&amp;", XML entities are decoded first, and a surname may
/// carry a particle (<c>ter Braak</c>) or be an organisation in capitals (<c>IAU</c>, <c>CODATA</c>).</para>
/// <para>Not citations: years of 2040 and later (sample counts such as 2048), years followed by <c>.digit</c>,
/// <c>-digit</c>, <c>/digit</c> or a letter-or-digit (versions, dates, seeds), and month names before a year.</para>
/// </remarks>
internal static class CitationRecogniser
{
    private const string Surname =
        @"(?:(?:van der|van|von|de|ter|le) )?(?:\p{Lu}\p{Ll}+(?:\p{Lu}\p{Ll}+)?(?:[-'’]\p{Lu}?\p{Ll}+)*|\p{Lu}{2,})";

    private const string Year = @"(?:1[6-9]\d\d|20[0-3]\d)";

    private const string ArxivId = @"(?:[a-z-]+(?:\.[A-Z]{2})?/\d{7}|\d{4}\.\d{4,5})";

    private static readonly Regex CitationPattern = new(
        $@"(?<![\p{{L}}\p{{N}}.\-])(?<first>{Surname})(?:(?:, {Surname})*,? (?:&|and) {Surname}|(?:, {Surname})* et al\.)?,? " +
        $@"(?:\((?<year>{Year})[a-z]?\)|(?<year>{Year})[a-z]?)(?![\p{{L}}\p{{N}}]|[.:/\-–]\d)" +
        $@"(?:,? \(?arXiv:(?<arxiv>{ArxivId}))?",
        RegexOptions.CultureInvariant);

    private static readonly Regex ArxivPattern = new($@"arXiv:(?<id>{ArxivId})", RegexOptions.CultureInvariant);

    private static readonly HashSet<string> NotAuthors = new(StringComparer.Ordinal)
    {
        "January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November",
        "December",
    };

    /// <summary>The citations in <paramref name="text"/>, in order.</summary>
    public static IEnumerable<Citation> Find(string text)
    {
        string decoded = WebUtility.HtmlDecode(text);
        foreach (Match match in CitationPattern.Matches(decoded))
        {
            string first = match.Groups["first"].Value;
            if (NotAuthors.Contains(first)) continue;
            string? arxiv = match.Groups["arxiv"].Success ? match.Groups["arxiv"].Value : null;
            yield return new Citation(first, int.Parse(match.Groups["year"].Value, System.Globalization.CultureInfo.InvariantCulture), arxiv, match.Value);
        }
    }

    /// <summary>Every arXiv id written anywhere in <paramref name="text"/>.</summary>
    public static IEnumerable<string> ArxivIds(string text) =>
        ArxivPattern.Matches(text).Select(m => m.Groups["id"].Value);
}
