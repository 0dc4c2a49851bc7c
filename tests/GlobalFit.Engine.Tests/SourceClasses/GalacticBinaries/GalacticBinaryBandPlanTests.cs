using System.Diagnostics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryBandPlanTests
{
    // One month at 5 s: Δf = 1/(30 d) ≈ 3.86e-7 Hz, Nyquist 0.1 Hz; N = 32 at 4 mHz (EnvelopeLengthRule).
    private static readonly GalacticBinaryTemplateGenerator Month = new(30 * 86400.0, 5.0);

    private static GalacticBinaryBandSettings Settings => new() { MinFrequencyHz = 1e-3, MaxFrequencyHz = 4e-3, WindowBins = 256, MarginBins = 32 };

    [Fact]
    public void Cores_tile_the_band_without_gaps_and_neighbours_are_in_different_stages()
    {
        var plan = GalacticBinaryBandPlan.Create(Settings, Month);
        var windows = plan.Windows;
        Assert.Equal((int)Math.Floor(1e-3 / Month.FrequencyResolutionHz), windows[0].Core.First);
        Assert.Equal((int)Math.Ceiling(4e-3 / Month.FrequencyResolutionHz), windows[^1].Core.End);
        for (int i = 1; i < windows.Length; i++)
        {
            Assert.Equal(windows[i - 1].Core.End, windows[i].Core.First);
            Assert.NotEqual(windows[i - 1].Stage, windows[i].Stage);
        }
        Assert.All(windows.SkipLast(1), w => Assert.Equal(256, w.Core.Count));
        Assert.InRange(windows[^1].Core.Count, 256, 511);
        Assert.All(windows, w => Assert.Equal(w.Core.Count + 64, w.Padded.Count));
        Assert.Equal(windows.Length, plan.Stage(0).Count() + plan.Stage(1).Count());
    }

    // Padding 32 and N = 32 leave a drift margin of 32 − 16 = 16 bins towards each neighbour, none at the band edges,
    // and every template of a source in the margin still fits in the padded window.
    [Fact]
    public void The_source_range_reaches_into_the_neighbours_by_the_spare_padding()
    {
        var plan = GalacticBinaryBandPlan.Create(Settings, Month);
        Assert.Equal(32, plan.TemplateBins);
        var (first, middle, last) = (plan.Windows[0], plan.Windows[1], plan.Windows[^1]);
        Assert.Equal(first.Core.First, first.SourceRange.First);
        Assert.Equal(first.Core.End + 16, first.SourceRange.End);
        Assert.Equal(middle.Core.First - 16, middle.SourceRange.First);
        Assert.Equal(last.Core.End, last.SourceRange.End);
        var edge = Month.TemplateBins(middle.SourceEndHz - 1e-3 * middle.DfHz, Settings.MaxFrequencyDerivativeHzS);
        Assert.True(edge.End <= middle.Padded.End && edge.First >= middle.Padded.First);
    }

    [Fact]
    public void A_frequency_belongs_to_the_window_whose_core_holds_it()
    {
        var plan = GalacticBinaryBandPlan.Create(Settings, Month);
        foreach (var window in plan.Windows)
        {
            Assert.Equal(window.Index, plan.WindowOf(window.CoreStartHz + 0.25 * window.DfHz));
            Assert.Equal(window.Index, plan.WindowOf(window.CoreEndHz - 0.25 * window.DfHz));
            Assert.True(window.OwnsFrequency(window.CoreStartHz + 0.5 * window.DfHz));
        }
        Assert.Equal(-1, plan.WindowOf(0.9e-3));
        Assert.Equal(-1, plan.WindowOf(plan.Windows[^1].CoreEndHz + plan.DfHz));
        Assert.Equal(-1, plan.WindowOf(double.NaN));
    }

    // Linear cost: a year at 5 s over 0.1–20 mHz in windows of 256 bins is ~2 450 windows (N = 256 at 20 mHz over a
    // year, so padding 128); planning takes milliseconds (the bound is loose on purpose for a shared machine).
    [Fact]
    public void Planning_many_windows_is_cheap()
    {
        var year = new GalacticBinaryTemplateGenerator(365.25 * 86400.0, 5.0);
        var clock = Stopwatch.StartNew();
        var plan = GalacticBinaryBandPlan.Create(new GalacticBinaryBandSettings { MinFrequencyHz = 1e-4, MaxFrequencyHz = 2e-2, WindowBins = 256, MarginBins = 128 }, year);
        Assert.True(plan.Windows.Length > 2400);
        Assert.True(clock.Elapsed.TotalSeconds < 2);
        Assert.Equal(plan.Windows.Length - 1, plan.WindowOf(plan.Windows[^1].CoreEndHz - 0.5 * plan.DfHz));
        Assert.Equal(1234, plan.WindowOf(plan.Windows[1234].CoreStartHz + 0.5 * plan.DfHz));
    }

    [Theory]
    [InlineData(1e-3, 4e-3, 20000, 32, "window_bins")]
    [InlineData(1e-3, 0.2, 256, 32, "f_max_hz")]
    [InlineData(1e-3, 4e-3, 256, 8, "margin_bins")]
    [InlineData(1e-3, 4e-3, 16, 32, "window_bins")]
    [InlineData(4e-3, 1e-3, 256, 32, "f_max_hz")]
    [InlineData(1e-7, 4e-3, 256, 32, "f_min_hz")]
    public void Inconsistent_settings_are_refused_naming_the_key(double fMin, double fMax, int windowBins, int paddingBins, string key)
    {
        var settings = new GalacticBinaryBandSettings { MinFrequencyHz = fMin, MaxFrequencyHz = fMax, WindowBins = windowBins, MarginBins = paddingBins };
        var problem = Assert.ThrowsAny<ArgumentException>(() => GalacticBinaryBandPlan.Create(settings, Month));
        Assert.Equal(key, problem.ParamName);
    }

    [Fact]
    public void The_configuration_table_is_read_with_its_keys()
    {
        var table = ConfigDocument.Parse("""
            [galactic_binaries]
            f_min_hz = 2e-3
            f_max_hz = 3e-3
            window_bins = 128
            margin_bins = 40
            max_sources_per_window = 12
            temperatures = 3
            snr_prior_peak = 8
            """, "run.toml").GetTable("galactic_binaries")!;
        var (settings, plan) = GalacticBinaryBandSettings.FromConfig(table, Month);
        Assert.Equal(12, settings.MaxSourcesPerWindow);
        Assert.Equal(3, settings.TemperatureCount);
        Assert.Equal(8, settings.SnrPriorPeak);
        Assert.Equal(plan.Windows[0].Core.First - 40, plan.Windows[0].Padded.First);
    }

    [Fact]
    public void A_window_wider_than_the_band_is_reported_at_its_key_and_line()
    {
        var table = ConfigDocument.Parse("""
            [galactic_binaries]
            f_min_hz = 2e-3
            f_max_hz = 2.01e-3
            window_bins = 4096
            """, "run.toml").GetTable("galactic_binaries")!;
        var problem = Assert.Throws<InvalidInputException>(() => GalacticBinaryBandSettings.FromConfig(table, Month));
        Assert.Contains("window_bins", problem.Message);
        Assert.Contains("line 4", problem.Message);
        Assert.Contains("wider than the band", problem.Message);
    }

    [Fact]
    public void A_misspelt_key_is_refused()
    {
        var table = ConfigDocument.Parse("""
            [galactic_binaries]
            window_bin = 128
            """, "run.toml").GetTable("galactic_binaries")!;
        var problem = Assert.Throws<InvalidInputException>(() => GalacticBinaryBandSettings.FromConfig(table, Month));
        Assert.Contains("window_bins", problem.Message);
    }
}
