namespace GlobalFit.Cli;

/// <summary>Where a command writes, and whether a person is watching.</summary>
/// <param name="Out">Results (tables, JSON).</param>
/// <param name="Error">Errors, warnings and, when results go to a pipe, progress lines.</param>
/// <param name="OutputIsTerminal">True when standard output is an interactive terminal: live progress bars are drawn
/// only then; otherwise progress is a few plain lines.</param>
public sealed record CliContext(TextWriter Out, TextWriter Error, bool OutputIsTerminal)
{
    /// <summary>The process console.</summary>
    public static CliContext FromConsole() =>
        new(System.Console.Out, System.Console.Error, !System.Console.IsOutputRedirected && !System.Console.IsErrorRedirected);
}
