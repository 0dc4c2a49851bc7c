using System.Text.Json;
using GlobalFit.Cli.Commands;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Engine.Inspection;

namespace GlobalFit.Cli.Tests.Plotting;

/// <summary>What the charts draw, checked on the chart model rather than on pixels: the inspect chart tells A from E
/// and estimate from model, shades the band its statistics use and keeps the legend off the data; the sensitivity
/// chart and CSV say whether they hold an ASD or a PSD.</summary>
public class ChartContentTests
{
    [Fact]
    public void The_inspect_chart_draws_each_channel_in_its_own_colour_marks_the_compared_band_and_keeps_the_legend_aside()
    {
        using var folder = new TempFolder();
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("s.toml", Scenarios.TwoDays), "--out", folder.File("d.h5")).ExitCode);
        var report = ObservationInspection.Run(folder.File("d.h5"));

        var chart = InspectCommand.Chart(report);

        var byLabel = chart.Series.ToDictionary(s => s.Label);
        Assert.NotEqual(byLabel["A estimate"].Color, byLabel["E estimate"].Color);
        Assert.NotEqual(byLabel["A model"].Color, byLabel["E model"].Color);
        Assert.Equal(byLabel["A estimate"].Color, byLabel["A model"].Color);
        Assert.All(chart.Series, s => Assert.Equal(s.Label.EndsWith("model", StringComparison.Ordinal), s.Dashed));
        Assert.Equal(6, chart.Series.Select(s => (s.Color, s.Dashed)).Distinct().Count());
        var band = Assert.NotNull(chart.Band);
        Assert.Equal(report.Channels[0].BandLowHz, band.LowHz);
        Assert.Equal(report.Channels[0].BandHighHz, band.HighHz);
        Assert.Contains("mHz", band.Label, StringComparison.Ordinal);
        Assert.True(chart.LegendOutsideData);
        Assert.True(chart.ToPng().Length > 10_000);
    }

    [Fact]
    public void The_sensitivity_chart_says_it_draws_asds_and_the_csv_says_it_holds_psds()
    {
        using var folder = new TempFolder();
        string csv = folder.File("curve.csv"), png = folder.File("curve.png");
        var text = CliRun.Run("sensitivity", "--out", csv, "--f-min", "1e-3", "--f-max", "1e-2", "--points", "3", "--png", png);
        Assert.Equal(0, text.ExitCode);
        Assert.Contains($"{csv}: power spectral densities (PSD, 1/Hz", text.Out, StringComparison.Ordinal);
        Assert.Contains($"{png}: strain amplitude spectral densities (ASD = sqrt(PSD)", text.Out, StringComparison.Ordinal);
        Assert.All(File.ReadAllLines(csv)[0].Split(',').Skip(1), column => Assert.Contains("psd", column, StringComparison.Ordinal));

        var json = JsonDocument.Parse(CliRun.Run("sensitivity", "--out", csv, "--png", png, "--force", "--points", "3", "--json").Out).RootElement;
        Assert.StartsWith("power spectral densities", json.GetProperty("csv_holds").GetString(), StringComparison.Ordinal);
        Assert.StartsWith("strain amplitude spectral densities", json.GetProperty("png_holds").GetString(), StringComparison.Ordinal);

        var table = SensitivityTable.Compute(new Physics.Noise.AetNoiseModel(Physics.Noise.InstrumentNoiseSettings.Default), new Physics.Noise.SensitivityCurve(Physics.Noise.InstrumentNoiseSettings.Default, null), 1e-3, 1e-2, 3);
        var chart = SensitivityCommand.Chart(table, withForeground: false);
        Assert.Contains("ASD", chart.Title, StringComparison.Ordinal);
        Assert.Contains("ASD", chart.YLabel, StringComparison.Ordinal);
        Assert.All(chart.Series, s => Assert.StartsWith("ASD", s.Label, StringComparison.Ordinal));
    }
}
