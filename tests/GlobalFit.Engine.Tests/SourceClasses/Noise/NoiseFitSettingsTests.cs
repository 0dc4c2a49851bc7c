using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.Noise;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.SourceClasses.Noise;

public class NoiseFitSettingsTests
{
    // One year at 5 s: Nyquist 0.1 Hz.
    private static readonly FitDataShape Year = new("year.h5", 6_311_520, 5.0, 0.0);

    private static ConfigTable NoiseTable(string body) => ConfigDocument.Parse("[noise]\n" + body, "run.toml").GetTable("noise")!;

    [Fact]
    public void Defaults_follow_the_data_record()
    {
        var settings = NoiseFitSettings.FromConfig(NoiseTable(""), Year);
        Assert.Equal(1.0, settings.ForegroundFitYears);
        Assert.Equal(0.03, settings.MaxFrequencyHz);
        var short30Days = new FitDataShape("month.h5", 259_200, 10.0, 0.0);
        Assert.Equal(0.5, NoiseFitSettings.FromConfig(NoiseTable(""), short30Days).ForegroundFitYears);
        var coarse = new FitDataShape("coarse.h5", 100_000, 30.0, 0.0);
        Assert.Equal(0.9 / 60.0, NoiseFitSettings.FromConfig(NoiseTable(""), coarse).MaxFrequencyHz, 1e-15);
    }

    [Fact]
    public void Nearest_fit_duration_picks_the_tabulated_value_closest_to_the_record()
    {
        Assert.Equal(2.0, NoiseFitSettings.NearestFitYears(2.4 * PhysicalConstants.JulianYearS));
        Assert.Equal(4.0, NoiseFitSettings.NearestFitYears(10 * PhysicalConstants.JulianYearS));
    }

    [Theory]
    [InlineData("f_max_hzz = 0.01", "f_max_hzz")]
    [InlineData("f_max_hz = 0.2", "f_max_hz")]
    [InlineData("[noise.foreground]\nfit_years = 3", "foreground.fit_years")]
    [InlineData("foreground_fit_years = 1", "foreground_fit_years")]
    [InlineData("[noise.foreground]\nenable = true", "foreground.enable")]
    [InlineData("f_min_hz = 0.05\nf_max_hz = 0.02", "f_min_hz")]
    [InlineData("level_prior_max = 0.5", "level_prior_max")]
    [InlineData("acceleration_asd = -1.0", "acceleration_asd")]
    [InlineData("fit_levels = 3", "fit_levels")]
    public void Configuration_errors_name_the_key(string body, string key)
    {
        var error = Assert.Throws<InvalidInputException>(() => NoiseFitSettings.FromConfig(NoiseTable(body), Year));
        Assert.Contains($"noise.{key}", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_fit_range_must_stay_below_the_first_transfer_null()
    {
        // 0.065 Hz is below Nyquist (0.1 Hz) but above π f* ≈ 0.05996 Hz where S_A and S_T vanish.
        var error = Assert.Throws<InvalidInputException>(() => NoiseFitSettings.FromConfig(NoiseTable("f_max_hz = 0.065"), Year));
        Assert.Contains("noise.f_max_hz", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Resolved_settings_read_back_to_the_same_settings()
    {
        var settings = NoiseFitSettings.FromConfig(NoiseTable("include_t = false\ntemperatures = 2\n[noise.foreground]\namplitude = 1.5"), Year);
        var writer = new ResolvedConfigWriter();
        writer.Section("noise");
        settings.WriteResolved(writer);
        var table = ConfigDocument.Parse(writer.ToString(), "resolved.toml").GetTable("noise")!;
        Assert.Equal(settings with { ForegroundFitYearsOrigin = "set in the run configuration" }, NoiseFitSettings.FromConfig(table, Year));
        Assert.Equal(NoiseFitSettings.Keys.Length, table.Keys.Count());
        Assert.Equal(NoiseFitSettings.ForegroundKeys.Length, table.GetTable("foreground")!.Keys.Count());
    }

    [Fact]
    public void The_foreground_fit_defaults_to_the_scenario_recorded_in_the_data_file_and_says_so()
    {
        // A month: the fit nearest its length is half a year, but the file's scenario simulated the one-year fit.
        var month = new FitDataShape("month.h5", 259_200, 10.0, 0.0);
        var recorded = NoiseFitSettings.FromConfig(NoiseTable(""), month with { ScenarioForegroundFitYears = 1.0 });
        Assert.Equal((1.0, "from the scenario recorded in the observation file"), (recorded.ForegroundFitYears, recorded.ForegroundFitYearsOrigin));
        var nearest = NoiseFitSettings.FromConfig(NoiseTable(""), month);
        Assert.Equal(0.5, nearest.ForegroundFitYears);
        Assert.StartsWith("nearest the record's length", nearest.ForegroundFitYearsOrigin, StringComparison.Ordinal);
        var set = NoiseFitSettings.FromConfig(NoiseTable("[noise.foreground]\nfit_years = 2"), month with { ScenarioForegroundFitYears = 1.0 });
        Assert.Equal((2.0, "set in the run configuration"), (set.ForegroundFitYears, set.ForegroundFitYearsOrigin));
    }

    [Fact]
    public void Fitted_bins_exclude_dc_and_nyquist()
    {
        var settings = new NoiseFitSettings { MinFrequencyHz = 1e-9, MaxFrequencyHz = 0.05 };
        var shape = new FitDataShape("s.h5", 1000, 10.0, 0.0);
        var bins = settings.FittedBins(shape);
        Assert.Equal(1, bins.First);
        Assert.Equal(shape.BinCount - 1, bins.End); // one past the last bin kept, N/2 − 1
    }
}
