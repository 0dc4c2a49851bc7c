using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary><c>catalogue</c> and <c>resume</c> refuse a data file other than the one the run was fitted to, with exit 2
/// and one line naming the file and the override; <c>--accept-new-data</c> goes on with a warning.</summary>
public sealed class DataIdentityCommandTests
{
    [Fact]
    public void Catalogue_and_resume_refuse_a_changed_data_file_unless_it_is_accepted()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5"), run = folder.File("run");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", Scenarios.TwoDays), "--out", data).ExitCode);
        string config = folder.Write("fit.toml", $"data = \"{data}\"\nrun_folder = \"{run}\"\niterations = 1\n[noise]\nsteps_per_update = 5\n");
        Assert.Equal(0, CliRun.Run("fit", config).ExitCode);
        Assert.Equal(0, CliRun.Run("catalogue", run).ExitCode);

        // One bit in the middle of the file, inside the channel samples: still a valid observation, no longer the same.
        byte[] bytes = File.ReadAllBytes(data);
        bytes[bytes.Length / 2] ^= 1;
        File.WriteAllBytes(data, bytes);

        // As a killed fit leaves it: status.json still says running, and no process holds the lock.
        string statusFile = Path.Combine(run, "status.json");
        File.WriteAllText(statusFile, File.ReadAllText(statusFile).Replace("\"completed\"", "\"running\"", StringComparison.Ordinal));

        foreach (var refused in new[] { CliRun.Run("catalogue", run), CliRun.Run("resume", run) })
        {
            Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
            string line = Assert.Single(refused.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
            Assert.Contains(data, line, StringComparison.Ordinal);
            Assert.Contains("--accept-new-data", line, StringComparison.Ordinal);
        }
        // After the refused resume the run is reported as stopped, not as running.
        var status = CliRun.Run("status", run, "--json");
        Assert.Equal("stopped", System.Text.Json.JsonDocument.Parse(status.Out).RootElement.GetProperty("state").GetString());
        var accepted = CliRun.Run("catalogue", run, "--accept-new-data");
        Assert.Equal(0, accepted.ExitCode);
        Assert.Contains("warning:", accepted.Error, StringComparison.Ordinal);
    }
}
