using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>The entries of <c>src/BIBLIOGRAPHY.md</c>: lines of the form
/// <c>- `key` Surname, I., Surname, I. &amp; Surname, I. (year). Title. Journal volume, page. arXiv:id.</c></summary>
internal sealed class Bibliography
{
    private static readonly Regex EntryPattern = new(
        @"^- `(?<key>[^`]+)` (?<first>[^,(]+?)(?=,| \().*?\((?<year>\d{4})\)", RegexOptions.CultureInvariant);

    private Bibliography(IReadOnlyList<BibliographyEntry> entries) => Entries = entries;

    /// <summary>The entries in file order.</summary>
    public IReadOnlyList<BibliographyEntry> Entries { get; }

    /// <summary>Reads the bibliography; lines that start with "- `" and do not parse are errors.</summary>
    /// <exception cref="InvalidDataException">An entry line breaks the format; the message names the line.</exception>
    public static Bibliography Load(string path)
    {
        var entries = new List<BibliographyEntry>();
        var lines = File.ReadAllLines(path);
        for (int i = 0; i < lines.Length; i++)
        {
            if (!lines[i].StartsWith("- `", StringComparison.Ordinal)) continue;
            var match = EntryPattern.Match(lines[i]);
            if (!match.Success)
                throw new InvalidDataException($"{path}:{i + 1}: not an entry of the form - `key` Surname, I. (year). …: {lines[i]}");
            entries.Add(new BibliographyEntry(match.Groups["key"].Value, match.Groups["first"].Value.Trim(),
                int.Parse(match.Groups["year"].Value, CultureInfo.InvariantCulture), CitationRecogniser.ArxivIds(lines[i]).ToArray(), i + 1));
        }
        return new Bibliography(entries);
    }

    /// <summary>Whether an entry has the citation's first author and year, and its arXiv id when the citation gives one.</summary>
    public bool Contains(Citation citation) => Entries.Any(e =>
        e.Year == citation.Year && Normalise(e.FirstAuthor) == Normalise(citation.FirstAuthor)
        && (citation.ArxivId is null || e.ArxivIds.Contains(citation.ArxivId)));

    /// <summary>Whether some entry carries the arXiv id.</summary>
    public bool ContainsArxivId(string id) => Entries.Any(e => e.ArxivIds.Contains(id));

    /// <summary>A surname as it appears in keys: accents, spaces, hyphens and apostrophes removed, lower case
    /// (<c>ter Braak</c> → <c>terbraak</c>, <c>Królak</c> → <c>krolak</c>).</summary>
    public static string Normalise(string surname)
    {
        // A table rather than Unicode decomposition: the tests run with invariant globalization, where
        // string.Normalize leaves accented letters as they are.
        var text = new StringBuilder();
        foreach (char c in surname.ToLowerInvariant())
        {
            int accented = AccentedLetters.IndexOf(c, StringComparison.Ordinal);
            if (accented >= 0) text.Append(PlainLetters[accented]);
            else if (char.IsLetter(c)) text.Append(c);
        }
        return text.ToString();
    }

    private const string AccentedLetters = "àáâãäåāăąçćčďèéêëēěęìíîïīłñńňòóôõöøōřśšşťùúûüūůýÿźżž";
    private const string PlainLetters = "aaaaaaaaacccdeeeeeeeiiiiilnnnooooooorssstuuuuuuyyzzz";
}

/// <summary>One bibliography entry.</summary>
/// <param name="Key">The stable key, first author's normalised surname + year (+ a letter).</param>
/// <param name="FirstAuthor">The first author's surname or the organisation.</param>
/// <param name="Year">The year in parentheses after the authors.</param>
/// <param name="ArxivIds">The arXiv ids on the line.</param>
/// <param name="Line">The line number in the file.</param>
internal sealed record BibliographyEntry(string Key, string FirstAuthor, int Year, IReadOnlyList<string> ArxivIds, int Line);
