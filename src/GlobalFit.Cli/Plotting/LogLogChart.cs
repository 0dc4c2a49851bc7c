using ScottPlot;

namespace GlobalFit.Cli.Plotting;

/// <summary>A log-log line chart of curves against frequency, written as PNG.</summary>
/// <remarks>ScottPlot 5 has no native log axis, so the chart plots log10 of the data and labels the ticks
/// as decades.</remarks>
public sealed class LogLogChart
{
    private readonly Plot _plot;

    /// <summary>Creates an empty chart with a title and axis labels.</summary>
    public LogLogChart(string title, string xLabel, string yLabel)
    {
        // The font must be registered before the plot exists: a plot takes its fonts when it is created.
        PlotFonts.EnsureRegistered();
        _plot = new Plot();
        _plot.Title(title);
        _plot.XLabel(xLabel);
        _plot.YLabel(yLabel);
        foreach (ScottPlot.IAxis axis in new ScottPlot.IAxis[] { _plot.Axes.Bottom, _plot.Axes.Left })
        {
            axis.TickGenerator = new ScottPlot.TickGenerators.NumericAutomatic
            {
                MinorTickGenerator = new ScottPlot.TickGenerators.LogMinorTickGenerator(),
                IntegerTicksOnly = true,
                LabelFormatter = value => $"1e{value:0}",
            };
        }
        _plot.ShowLegend(Alignment.UpperRight);
    }

    /// <summary>Adds a curve; points where either coordinate is not positive and finite are skipped.</summary>
    public void AddCurve(string label, IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        var xs = new List<double>();
        var ys = new List<double>();
        for (int i = 0; i < x.Count; i++)
        {
            if (x[i] > 0 && y[i] > 0 && double.IsFinite(x[i]) && double.IsFinite(y[i]))
            {
                xs.Add(Math.Log10(x[i]));
                ys.Add(Math.Log10(y[i]));
            }
        }
        if (xs.Count == 0) return;
        var line = _plot.Add.ScatterLine(xs.ToArray(), ys.ToArray());
        line.LegendText = label;
        line.LineWidth = 2;
    }

    /// <summary>Encodes the chart as PNG bytes.</summary>
    public byte[] ToPng(int width = 1000, int height = 700) => _plot.GetImageBytes(width, height, ImageFormat.Png);
}
