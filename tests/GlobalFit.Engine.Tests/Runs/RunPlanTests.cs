using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>A run configuration that cannot work is refused before anything starts, naming the key and its place.</summary>
public sealed class RunPlanTests(SharedFitData data) : IClassFixture<SharedFitData>
{
    [Fact]
    public void Every_default_is_written_out_and_the_resolved_configuration_reads_back_to_the_same_plan()
    {
        var plan = Plan("");
        string resolved = plan.ResolvedToml();
        foreach (string key in new[] { "seed = 99", "checkpoint_every_minutes = ", "max_worker_failures = ", "min_confidence = ", "stages = [[\"galactic_binaries.even\"], [\"galactic_binaries.odd\"], [\"noise\"]]",
                     "jump_probability = ", "snr_prior_peak = ", "fit_levels = ", "level_prior_min = " })
            Assert.Contains(key, resolved, StringComparison.Ordinal);
        var again = RunPlan.FromConfig(ConfigDocument.Parse(resolved, "run.toml"), "/");
        Assert.Equal(resolved, again.ResolvedToml());
    }

    [Fact]
    public void The_resolved_configuration_lists_every_key_each_section_accepts()
    {
        var resolved = ConfigDocument.Parse(Plan("").ResolvedToml(), "run.toml");
        foreach (string key in RunSettings.Keys) Assert.True(resolved.Has(key), key);
        var noise = resolved.GetTable("noise")!;
        foreach (string key in GlobalFit.Engine.SourceClasses.Noise.NoiseFitSettings.Keys) Assert.True(noise.Has(key), "noise." + key);
        var binaries = resolved.GetTable("galactic_binaries")!;
        foreach (string key in GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinaryBandSettings.Keys) Assert.True(binaries.Has(key), "galactic_binaries." + key);
    }

    [Fact]
    public void An_unknown_key_is_an_error_with_its_line_column_and_a_suggestion()
    {
        var error = Refused("iteratons = 5\n");
        Assert.Contains("line 1, column 1", error.Message, StringComparison.Ordinal);
        Assert.Contains("iterations", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_band_above_the_nyquist_frequency_is_refused_naming_the_key()
    {
        var error = Refused("", gbOverrides: "f_max_hz = 0.05\n");
        Assert.Contains("galactic_binaries.f_max_hz", error.Message, StringComparison.Ordinal);
        Assert.Contains("Nyquist", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_window_wider_than_the_band_is_refused_naming_the_key()
    {
        var error = Refused("", gbOverrides: "window_bins = 4096\n");
        Assert.Contains("window_bins", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_massive_black_hole_binary_section_plans_one_stage_per_binary_before_galactic_binaries_and_noise()
    {
        var plan = Plan("", extra: "[massive_black_hole_binaries]\ncount = 2\nf_max_hz = 0.02\n");
        Assert.Equal(
            ["massive_black_hole_binaries.01", "massive_black_hole_binaries.02", "galactic_binaries.even", "galactic_binaries.odd", "noise"],
            plan.Schedule.Stages.Select(s => Assert.Single(s)));
        var resolved = ConfigDocument.Parse(plan.ResolvedToml(), "run.toml").GetTable("massive_black_hole_binaries")!;
        foreach (string key in GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries.MassiveBlackHoleBinaryFitSettings.Keys)
            Assert.True(resolved.Has(key), "massive_black_hole_binaries." + key);
    }

    [Fact]
    public void A_massive_black_hole_binary_window_above_the_nyquist_frequency_is_refused_naming_the_key()
    {
        var error = Refused("", extra: "[massive_black_hole_binaries]\nf_max_hz = 10.0\n");
        Assert.Contains("massive_black_hole_binaries.f_max_hz", error.Message, StringComparison.Ordinal);
        Assert.Contains("Nyquist", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_schedule_that_misses_or_misnames_a_group_is_refused()
    {
        var misnamed = Refused("", extra: "[schedule]\nstages = [[\"galactic_binaries.evn\"], [\"galactic_binaries.odd\"], [\"noise\"]]\n");
        Assert.Contains("galactic_binaries.even", misnamed.Message, StringComparison.Ordinal);
        var missing = Refused("", extra: "[schedule]\nstages = [[\"galactic_binaries.even\", \"galactic_binaries.odd\"]]\n");
        Assert.Contains("missing: noise", missing.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_data_file_is_refused_naming_the_key()
    {
        var error = Assert.Throws<InvalidInputException>(() =>
            RunPlan.FromConfig(ConfigDocument.Parse("data = \"nowhere.h5\"\n", "fit.toml"), Path.GetTempPath()));
        Assert.Contains("data", error.Message, StringComparison.Ordinal);
        Assert.Contains("not found", error.Message, StringComparison.Ordinal);
    }

    private RunPlan Plan(string rootOverrides, string gbOverrides = "", string extra = "")
    {
        using var folder = new TemporaryRunFolder();
        string text = rootOverrides + SmallFitRecord.FitConfig(data.DataPath, folder.File("run"), 4, 1) + "\n" + extra;
        // An override replaces the fixture's line for the same key.
        foreach (string line in gbOverrides.Split('\n', StringSplitOptions.RemoveEmptyEntries))
            text = System.Text.RegularExpressions.Regex.Replace(text, "(?m)^" + line.Split(' ')[0] + " = .*$", line);
        return RunPlan.FromConfig(ConfigDocument.Parse(text, "fit.toml"), folder.Path);
    }

    private InvalidInputException Refused(string rootOverrides, string gbOverrides = "", string extra = "") =>
        Assert.Throws<InvalidInputException>(() => Plan(rootOverrides, gbOverrides, extra));
}
