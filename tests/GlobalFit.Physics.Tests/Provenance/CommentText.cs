namespace GlobalFit.Physics.Tests.Provenance;

/// <summary>The comments of a source file, with runs of consecutive comment lines joined into one text so that a
/// citation broken across two lines is still one citation.</summary>
internal static class CommentText
{
    /// <summary>The comment runs of a file: the line of each run's first line and the run's text (comment markers
    /// and the indentation after them removed, lines joined by one space).</summary>
    /// <param name="lines">The file's lines.</param>
    /// <param name="marker">The line-comment marker: <c>//</c> for C# (which also covers <c>///</c>), <c>#</c> for Python.</param>
    public static IEnumerable<(int Line, string Text)> Runs(IReadOnlyList<string> lines, string marker)
    {
        int start = 0;
        var text = new System.Text.StringBuilder();
        for (int i = 0; i < lines.Count; i++)
        {
            int at = lines[i].IndexOf(marker, StringComparison.Ordinal);
            if (at < 0)
            {
                if (text.Length > 0) yield return (start, text.ToString());
                text.Clear();
                continue;
            }
            string comment = lines[i][at..].TrimStart(marker[0]).Trim();
            if (text.Length == 0) start = i + 1;
            else text.Append(' ');
            text.Append(comment);
        }
        if (text.Length > 0) yield return (start, text.ToString());
    }
}
