using Xunit;

namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>The recogniser behind <see cref="CitationTests"/>: it must find the forms DEVELOPERS.md asks for, ignore
/// numbers that only look like years, and the bibliography must flag what it does not hold.</summary>
public sealed class CitationRecogniserTests
{
    [Theory]
    [InlineData("as in Robson, Cornish &amp; Liu 2019, arXiv:1803.01944, Eq. 14", "Robson", 2019, "1803.01944")]
    [InlineData("ranks (Vehtari et al. 2021) split", "Vehtari", 2021, null)]
    [InlineData("Green (1995), Biometrika 82, 711", "Green", 1995, null)]
    [InlineData("snooker update of ter Braak &amp; Vrugt (2008)", "ter Braak", 2008, null)]
    [InlineData("Cornish & Rubbo 2003 (arXiv:gr-qc/0209011)", "Cornish", 2003, "gr-qc/0209011")]
    [InlineData("exact by IAU 2015 Resolution B3", "IAU", 2015, null)]
    [InlineData("the prior of Littenberg, Cornish et al. 2020 (PRD 101, 123021)", "Littenberg", 2020, null)]
    [InlineData("Królak, Tinto and Vallisneri 2004 for TDI", "Królak", 2004, null)]
    public void Recognised_forms_give_first_author_year_and_arXiv_id(string text, string first, int year, string? arxiv)
    {
        var citation = Assert.Single(CitationRecogniser.Find(text));
        Assert.Equal(first, citation.FirstAuthor);
        Assert.Equal(year, citation.Year);
        Assert.Equal(arxiv, citation.ArxivId);
    }

    [Theory]
    [InlineData("second-generation TDI 2.0 at 1 mHz")]
    [InlineData("written on 2026-12-05 by the simulator")]
    [InlineData("format version 2019.1 of the file")]
    [InlineData("an FFT of 2048 points")]
    [InlineData("seed = 20261201 for the run")]
    [InlineData("measured in December 2026 on two cores")]
    [InlineData("Welch estimates over 1999 segments")]
    public void Numbers_that_only_look_like_years_are_not_citations(string text)
    {
        Assert.Empty(CitationRecogniser.Find(text));
    }

    [Fact]
    public void A_citation_broken_across_comment_lines_is_one_citation()
    {
        // '#' comments, so that these literal lines are not themselves comments of this file.
        string[] lines = ["# <para>Prince, Tinto, Larson &amp;", "#    Armstrong 2002 built A, E, T.</para>", "x = 0", "## Welch 1967"];
        var runs = CommentText.Runs(lines, "#").ToList();
        Assert.Equal(2, runs.Count);
        Assert.Equal(1, runs[0].Line);
        Assert.Equal("Prince", Assert.Single(CitationRecogniser.Find(runs[0].Text)).FirstAuthor);
        Assert.Equal(4, runs[1].Line);
    }

    [Theory]
    [InlineData("Nobody &amp; Else 1999")]
    [InlineData("Robson et al. 2018")]
    [InlineData("Robson et al. 2019 (arXiv:1234.56789)")]
    public void Citations_the_bibliography_lacks_are_flagged(string text)
    {
        var bibliography = Bibliography.Load(RepositoryTree.BibliographyPath);
        var citation = Assert.Single(CitationRecogniser.Find(text));
        Assert.False(bibliography.Contains(citation), $"{text} should not match an entry");
    }

    [Theory]
    [InlineData("Robson et al. 2019 (arXiv:1803.01944)")]
    [InlineData("Prsa et al. 2016")]
    [InlineData("ter Braak (2006)")]
    [InlineData("Jaranowski, Krolak &amp; Schutz 1998")]
    public void Citations_the_bibliography_holds_match_by_surname_year_and_arXiv_id(string text)
    {
        var bibliography = Bibliography.Load(RepositoryTree.BibliographyPath);
        Assert.True(bibliography.Contains(Assert.Single(CitationRecogniser.Find(text))), text);
    }

    [Theory]
    [InlineData("Królak", "krolak")]
    [InlineData("Prša", "prsa")]
    [InlineData("ter Braak", "terbraak")]
    [InlineData("Bürkner", "burkner")]
    [InlineData("Ziółkowski", "ziolkowski")]
    [InlineData("MacKay", "mackay")]
    public void Surnames_normalise_to_key_stems_without_accents_or_spaces(string surname, string stem)
    {
        Assert.Equal(stem, Bibliography.Normalise(surname));
    }

    // '@' stands for the letter h, so that this file does not itself name the documents the check looks for.
    [Theory]
    [InlineData("see ../s@ared/reference/notes for the table", true)]
    [InlineData("values from the reference s@eet", true)]
    [InlineData("Source: the s@eet §C.4", true)]
    [InlineData("rows of c@eck-values.csv", true)]
    [InlineData("one file is what a spreads@eet opens", false)]
    [InlineData("tests/GlobalFit.Physics.Tests/CheckValues/instrument-noise.csv", false)]
    public void Names_of_outside_documents_are_found_and_ordinary_words_are_not(string text, bool outside)
    {
        Assert.Equal(outside, OutsideDocuments.Find(text.Replace('@', 'h')).Any());
    }
}
