namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>One citation found in a comment: first author (surname or organisation), year, and the arXiv id written
/// right after it, if any.</summary>
/// <param name="FirstAuthor">The first author's surname as written (e.g. <c>ter Braak</c>, <c>Królak</c>, <c>IAU</c>).</param>
/// <param name="Year">The year of publication.</param>
/// <param name="ArxivId">The arXiv id that follows the citation (e.g. <c>1803.01944</c>, <c>gr-qc/0209011</c>), or null.</param>
/// <param name="Text">The matched text, for messages.</param>
internal sealed record Citation(string FirstAuthor, int Year, string? ArxivId, string Text);
