using System.Text.Json;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>The names and schemas a user meets after one small fit: the run folder's folders, the truth and catalogue
/// columns, one status schema for <c>status --json</c> and <c>status.json</c>, and the foreground the fit chose.</summary>
public class InterfaceNamesTests
{
    [Fact]
    public void A_small_fit_uses_our_names_one_status_schema_and_the_foreground_of_the_files_scenario()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5"), run = folder.File("run");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        var fit = CliRun.Run("fit", folder.Write("fit.toml", SmallFitRecord.FitConfig(data, run, iterations: 2, threads: 1, stepsPerUpdate: 20)));
        Assert.True(fit.ExitCode == 0, fit.Error);

        // Run folder: samples/ and checkpoints/, not chains/ or checkpoint/.
        Assert.True(Directory.Exists(Path.Combine(run, "samples")));
        Assert.True(Directory.Exists(Path.Combine(run, "checkpoints")));
        Assert.False(Directory.Exists(Path.Combine(run, "chains")));
        Assert.False(Directory.Exists(Path.Combine(run, "checkpoint")));

        // Item 4: a month's nearest foreground fit is half a year, but the file's scenario simulated the one-year fit,
        // and the run configuration sets none; the fit takes the scenario's and says so.
        Assert.Contains("confusion foreground of the 1-year fit (from the scenario recorded in the observation file)", fit.Error + fit.Out);
        string resolved = File.ReadAllText(Path.Combine(run, "run.toml"));
        Assert.Contains("[noise.foreground]\nenabled = true\nfit_years = 1.0\n", resolved);
        Assert.Contains("margin_bins = 48", resolved);
        Assert.Contains("checkpoint_every_iterations = 1", resolved);

        // Truth and catalogue name the amplitude `amplitude`, and catalogue rows are sources.
        var inspect = JsonDocument.Parse(CliRun.Run("inspect", data, "--json").Out).RootElement;
        Assert.Equal(15.0, inspect.GetProperty("cadence_s").GetDouble());
        string csv = CliRun.Run("catalogue", run).Out;
        string[] header = csv.Split('\n')[0].Split(',');
        // Item 7: numbers with a lower-case, two-digit exponent (2.5e-22), never .NET's 2.5E-022 or 2.5E-22.
        Assert.Matches(@"\de-\d\d", csv);
        Assert.DoesNotContain("E-", csv, StringComparison.Ordinal);
        Assert.Matches(@"written by .* at \d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ", CliRun.Run("inspect", data).Out);
        Assert.Contains("amplitude", header);

        // Truth and catalogue hold the same parameter columns in the same order, fddot_hz_s2 beside fdot_hz_s.
        var truthColumns = ObservationFile.Read(data).FindTruth("galactic_binaries")!.Columns.Where(c => c != "snr").ToList();
        // The galactic binaries come first; the noise row's columns follow theirs.
        var catalogueColumns = header.Skip(4).Where(c => !c.EndsWith("_lo", StringComparison.Ordinal) && !c.EndsWith("_hi", StringComparison.Ordinal)).Take(truthColumns.Count).ToList();
        Assert.Equal(truthColumns, catalogueColumns);
        Assert.Equal("fddot_hz_s2", truthColumns[truthColumns.IndexOf("fdot_hz_s") + 1]);
        var catalogue = JsonDocument.Parse(CliRun.Run("catalogue", run, "--format", "json").Out).RootElement;
        Assert.Equal(2, catalogue.GetProperty("format_version").GetInt32());
        Assert.True(catalogue.TryGetProperty("sources", out _));

        // status --json and status.json: the same keys; times in UTC with a Z; slowest workers slowest first.
        var file = JsonDocument.Parse(File.ReadAllText(Path.Combine(run, "status.json"))).RootElement;
        var printed = JsonDocument.Parse(CliRun.Run("status", run, "--json").Out).RootElement;
        Assert.Equal(file.EnumerateObject().Select(p => p.Name).Order(), printed.EnumerateObject().Select(p => p.Name).Order());
        Assert.Contains("last_iteration_s", printed.EnumerateObject().Select(p => p.Name));
        Assert.EndsWith("Z", printed.GetProperty("updated_utc").GetString(), StringComparison.Ordinal);
        var span = File.ReadLines(Path.Combine(run, "telemetry.jsonl")).Select(l => JsonDocument.Parse(l).RootElement)
            .First(e => e.GetProperty("kind").GetString() == "span");
        Assert.EndsWith("Z", span.GetProperty("start_utc").GetString(), StringComparison.Ordinal);
        var times = printed.GetProperty("slowest_workers").EnumerateArray().Select(w => w.GetProperty("compute_ms").GetDouble()).ToList();
        Assert.NotEmpty(times);
        Assert.Equal(times.OrderDescending(), times);
    }
}
