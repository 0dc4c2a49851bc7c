using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>Every kind of bad input exits with code 2, names the file and place, and writes nothing.</summary>
public class BadInputTests
{
    [Fact]
    public void A_misspelt_scenario_key_is_reported_with_line_and_column_and_nothing_is_written()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", "[observation]\nduration_days = 2\ncadense_s = 10\n");
        var result = CliRun.Run("simulate", scenario, "--out", folder.File("d.h5"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("s.toml: line 3, column 1, key 'observation.cadense_s': unknown key", result.Error);
        Assert.Contains("did you mean 'cadence_s'?", result.Error);
        Assert.False(File.Exists(folder.File("d.h5")));
        Assert.Single(Directory.GetFiles(folder.Path)); // no temporary files left behind
    }

    [Theory]
    [InlineData("duration_days = -2", "must be a positive finite number")]
    [InlineData("duration_days = 0", "must be a positive finite number")]
    [InlineData("duration_days = 2\ncadence_s = 0", "must be a positive finite number")]
    [InlineData("duration_days = 2\ncadence_s = \"fast\"", "must be a number")]
    public void Zero_negative_or_mistyped_durations_and_cadences_are_rejected(string body, string problem)
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", "[observation]\n" + body + "\n");
        var result = CliRun.Run("simulate", scenario, "--out", folder.File("d.h5"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("s.toml: line ", result.Error);
        Assert.Contains(problem, result.Error);
        Assert.False(File.Exists(folder.File("d.h5")));
    }

    [Fact]
    public void An_existing_output_is_refused_without_force_and_left_byte_identical()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        string output = folder.Write("d.h5", "precious");
        var result = CliRun.Run("simulate", scenario, "--out", output);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("already exists; pass --force", result.Error);
        Assert.Equal("precious", File.ReadAllText(output));
        Assert.Equal(0, CliRun.Run("simulate", scenario, "--out", output, "--force").ExitCode);
        Assert.NotEqual("precious", File.ReadAllText(output));
    }

    [Fact]
    public void An_unwritable_output_location_is_refused_before_any_work()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        var missingFolder = CliRun.Run("simulate", scenario, "--out", folder.File("no/such/folder/d.h5"));
        Assert.Equal(2, missingFolder.ExitCode);
        Assert.Contains("does not exist", missingFolder.Error);
        var aFolder = CliRun.Run("simulate", scenario, "--out", folder.Path);
        Assert.Equal(2, aFolder.ExitCode);
        Assert.Contains("is a folder", aFolder.Error);
    }

    [Fact]
    public void A_missing_scenario_file_is_named()
    {
        using var folder = new TempFolder();
        var result = CliRun.Run("simulate", folder.File("absent.toml"), "--out", folder.File("d.h5"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("absent.toml: file not found", result.Error);
    }

    [Fact]
    public void Inspecting_a_text_file_or_a_truncated_file_names_the_file()
    {
        using var folder = new TempFolder();
        string text = folder.Write("notes.h5", "this is not HDF5");
        var result = CliRun.Run("inspect", text);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("notes.h5", result.Error);

        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        string data = folder.File("d.h5");
        CliRun.Run("simulate", scenario, "--out", data);
        byte[] bytes = File.ReadAllBytes(data);
        string truncated = folder.File("cut.h5");
        File.WriteAllBytes(truncated, bytes[..(bytes.Length / 2)]);
        var cut = CliRun.Run("inspect", truncated);
        Assert.Equal(2, cut.ExitCode);
        Assert.Contains("cut.h5", cut.Error);
    }

    [Fact]
    public void Unknown_options_and_missing_arguments_exit_with_code_two()
    {
        var unknown = CliRun.Run("sensitivity", "--out", "x.csv", "--bogus");
        Assert.Equal(2, unknown.ExitCode);
        Assert.Contains("--bogus", unknown.Error);
        var missing = CliRun.Run("simulate");
        Assert.Equal(2, missing.ExitCode);
    }

    [Fact]
    public void An_unsupported_foreground_duration_is_rejected_naming_the_option()
    {
        using var folder = new TempFolder();
        var result = CliRun.Run("sensitivity", "--foreground-fit-years", "3", "--out", folder.File("c.csv"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--foreground-fit-years", result.Error);
        Assert.Contains("0.5, 1, 2 and 4", result.Error);
        Assert.False(File.Exists(folder.File("c.csv")));
    }

    [Fact]
    public void A_scenario_that_is_not_utf8_text_is_refused_in_those_words()
    {
        using var folder = new TempFolder();
        string scenario = folder.File("s.toml");
        File.WriteAllBytes(scenario, [.. "name = \""u8, 0xFF, 0xFE, .. "\"\n[observation]\nduration_days = 2\n"u8]);
        var result = CliRun.Run("simulate", scenario, "--out", folder.File("d.h5"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("s.toml: line 1: is not UTF-8 text", result.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("UTF-16", result.Error, StringComparison.Ordinal); // not the parser's own complaint
    }
}
