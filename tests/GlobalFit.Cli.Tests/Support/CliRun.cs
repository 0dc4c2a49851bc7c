using GlobalFit.Cli;

namespace GlobalFit.Cli.Tests.Support;

/// <summary>Runs the <c>globalfit</c> command tree in-process and captures what it prints.</summary>
internal sealed record CliResult(int ExitCode, string Out, string Error);

internal static class CliRun
{
    public static CliResult Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLineApp.Run(args, new CliContext(output, error, OutputIsTerminal: false));
        return new CliResult(code, output.ToString(), error.ToString());
    }
}

/// <summary>A temporary folder removed after the test.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "globalfit-tests-" + Guid.NewGuid().ToString("N"));

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public string Write(string name, string text)
    {
        string path = File(name);
        System.IO.File.WriteAllText(path, text);
        return path;
    }

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); }
        catch (IOException) { }
    }
}

/// <summary>Small scenarios that simulate in well under a second.</summary>
internal static class Scenarios
{
    /// <summary>Two days at 10 s: 17,280 points per channel.</summary>
    public const string TwoDays = """
        name = "two test days"
        seed = 7
        [observation]
        duration_days = 2
        cadence_s = 10
        [noise.foreground]
        enabled = true
        fit_years = 1
        """;
}
