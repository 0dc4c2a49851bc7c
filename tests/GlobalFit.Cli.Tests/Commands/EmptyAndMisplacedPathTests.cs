using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>An empty string where a path is expected, or a folder where a file is expected (and the reverse), is bad
/// input: exit 2 and one line naming what is wrong, never an internal error.</summary>
public sealed class EmptyAndMisplacedPathTests
{
    public static TheoryData<string[]> EmptyPaths => new()
    {
        new[] { "simulate", "" , "--out", "OUT/d.h5" },
        new[] { "simulate", "SCENARIO", "--out", "" },
        new[] { "inspect", "" },
        new[] { "fit", "" },
        new[] { "resume", "" },
        new[] { "status", "" },
        new[] { "catalogue", "" },
        new[] { "trace", "" },
        new[] { "demo", "--out", "" },
        new[] { "sensitivity", "--out", "" },
    };

    public static TheoryData<string[]> FoldersForFiles => new()
    {
        new[] { "simulate", "OUT", "--out", "OUT/d.h5" },
        new[] { "simulate", "SCENARIO", "--out", "OUT" },
        new[] { "inspect", "OUT" },
        new[] { "fit", "OUT" },
        new[] { "sensitivity", "--out", "OUT" },
        new[] { "resume", "SCENARIO" },
        new[] { "status", "SCENARIO" },
        new[] { "catalogue", "SCENARIO" },
        new[] { "trace", "SCENARIO" },
        new[] { "demo", "--out", "SCENARIO" },
    };

    [Theory]
    [MemberData(nameof(EmptyPaths))]
    public void An_empty_path_is_refused_in_one_line(string[] args) => ExpectRefusal(args);

    [Theory]
    [MemberData(nameof(FoldersForFiles))]
    public void A_folder_given_for_a_file_or_a_file_for_a_folder_is_refused_in_one_line(string[] args) => ExpectRefusal(args);

    private static void ExpectRefusal(string[] args)
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("scenario.toml", Scenarios.TwoDays);
        string outFolder = folder.File("out");
        Directory.CreateDirectory(outFolder);
        var before = Directory.GetFileSystemEntries(folder.Path, "*", SearchOption.AllDirectories).Order().ToList();
        var result = CliRun.Run([.. args.Select(a => a.Replace("SCENARIO", scenario, StringComparison.Ordinal).Replace("OUT", outFolder, StringComparison.Ordinal))]);
        Assert.True(result.ExitCode == ExitCodes.BadInput, $"exit {result.ExitCode}: {result.Error}");
        string line = Assert.Single(result.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries), l => l.StartsWith("error:", StringComparison.Ordinal));
        Assert.DoesNotContain("internal error", line, StringComparison.Ordinal);
        Assert.Equal(before, Directory.GetFileSystemEntries(folder.Path, "*", SearchOption.AllDirectories).Order().ToList());
    }
}
