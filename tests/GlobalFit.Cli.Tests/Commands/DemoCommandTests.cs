using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class DemoCommandTests
{
    [Fact]
    public void Demo_simulates_fits_and_compares_in_its_own_folder_runs_again_and_refuses_a_foreign_one()
    {
        using var folder = new TempFolder();
        string demo = folder.File("demo");
        // Two iterations instead of the default 24 keep this under a minute; the full demo is the README's command.
        var first = CliRun.Run("demo", "--out", demo, "--iterations", "2");
        Assert.Equal(0, first.ExitCode);
        Assert.Contains("mean estimate/model", first.Out);
        Assert.Matches(@"galactic_binaries: \d+ injected with SNR >= 7; found \d+, missed \d+; \d+ catalogued, \d+ spurious", first.Out);
        Assert.Contains("matching: same source when the noise-weighted overlap", first.Out);
        foreach (string file in new[] { "data.h5", "noise.png", "fit.toml", "run/run.toml", "run/catalogue.csv", "run/catalogue.h5", "run/telemetry.jsonl" })
            Assert.True(File.Exists(Path.Combine(demo, file)), file);
        Assert.Equal(0, CliRun.Run("demo", "--out", demo, "--iterations", "2").ExitCode);

        string foreign = folder.File("mine");
        Directory.CreateDirectory(foreign);
        File.WriteAllText(Path.Combine(foreign, "thesis.tex"), "do not touch");
        var refused = CliRun.Run("demo", "--out", foreign);
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains("was not made by the demo", refused.Error);
        Assert.Single(Directory.GetFiles(foreign));
    }
}
