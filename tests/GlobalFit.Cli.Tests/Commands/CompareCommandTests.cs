using System.Text.Json;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary><c>globalfit compare</c> on a real run: the small three-binary record, fitted briefly.</summary>
public class CompareCommandTests
{
    [Fact]
    public void Compare_reports_found_missed_spurious_per_snr_bin_errors_and_coverage_as_text_and_json()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5"), run = folder.File("run");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        var fit = CliRun.Run("fit", folder.Write("fit.toml", SmallFitRecord.FitConfig(data, run, iterations: 4, threads: 1, stepsPerUpdate: 60)));
        Assert.True(fit.ExitCode == 0, fit.Error);

        var text = CliRun.Run("compare", run, "--truth", data);
        Assert.True(text.ExitCode == 0, text.Error);
        Assert.Matches(@"galactic_binaries: 3 injected with SNR >= 7; found \d, missed \d; \d+ catalogued, \d+ spurious", text.Out);
        Assert.Contains("matching: same source when", text.Out);
        Assert.Contains("90 % interval coverage", text.Out);

        var json = CliRun.Run("compare", run, "--truth", data, "--json");
        Assert.Equal(0, json.ExitCode);
        var gb = Assert.Single(JsonDocument.Parse(json.Out).RootElement.GetProperty("classes").EnumerateArray());
        Assert.Equal("galactic_binaries", gb.GetProperty("class").GetString());
        Assert.Equal(0.5, gb.GetProperty("overlap_threshold").GetDouble());
        Assert.Equal(3, gb.GetProperty("detectable").GetInt32());
        int found = gb.GetProperty("found_detectable").GetInt32();
        Assert.Equal(3, found + gb.GetProperty("missed_count").GetInt32());
        Assert.Equal(gb.GetProperty("catalogued").GetInt32(), gb.GetProperty("found").GetArrayLength() + gb.GetProperty("spurious_count").GetInt32());
        Assert.Equal(8, gb.GetProperty("coverage").GetArrayLength());
        Assert.Equal(6, gb.GetProperty("snr_bins").GetArrayLength());
        foreach (var f in gb.GetProperty("found").EnumerateArray())
            Assert.True(f.GetProperty("overlap").GetDouble() >= 0.5);
    }

    [Fact]
    public void Compare_without_truth_is_refused_and_a_missing_truth_file_is_bad_input()
    {
        using var folder = new TempFolder();
        Assert.NotEqual(0, CliRun.Run("compare", folder.Path).ExitCode);
        var result = CliRun.Run("compare", folder.Path, "--truth", folder.File("none.h5"));
        Assert.Equal(2, result.ExitCode);
    }
}
