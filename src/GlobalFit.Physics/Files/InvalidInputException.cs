namespace GlobalFit.Physics.Files;

/// <summary>
/// Bad input from a user's file or option: thrown with enough context to fix it (the file, and the
/// field, key, line or sample index), and mapped by the command line to exit code 2.
/// </summary>
/// <remarks>Code that detects bad input throws this before it writes anything, so nothing is left half-written.</remarks>
public sealed class InvalidInputException : Exception
{
    /// <summary>Creates the error.</summary>
    /// <param name="source">The file (or option) the input came from.</param>
    /// <param name="location">Where inside it: a field, key, dataset, <c>line L, column C</c> or <c>sample N</c>; null when the whole source is at fault.</param>
    /// <param name="problem">What is wrong, in plain words.</param>
    /// <param name="inner">The underlying exception, if any.</param>
    public InvalidInputException(string source, string? location, string problem, Exception? inner = null)
        : base(Format(source, location, problem), inner)
    {
        InputSource = source;
        Location = location;
        Problem = problem;
    }

    /// <summary>The file or option the input came from.</summary>
    public string InputSource { get; }

    /// <summary>The field, key, line or sample inside <see cref="InputSource"/>, or null.</summary>
    public string? Location { get; }

    /// <summary>What is wrong.</summary>
    public string Problem { get; }

    // A refusal is one terminal line: text quoted from the damaged input or from a library (a file signature, a key
    // with a line break) could otherwise carry line breaks or terminal control codes into the message.
    private static string Format(string source, string? location, string problem) =>
        OneLine(location is null ? $"{source}: {problem}" : $"{source}: {location}: {problem}");

    private static string OneLine(string text) =>
        text.Any(char.IsControl)
            ? string.Create(text.Length, text, (span, t) =>
            {
                for (int i = 0; i < t.Length; i++) span[i] = t[i] is '\n' or '\r' or '\t' ? ' ' : char.IsControl(t[i]) ? '?' : t[i];
            })
            : text;
}
