using ScottPlot;

namespace GlobalFit.Cli.Plotting;

/// <summary>A log-log line chart of curves against frequency, written as PNG, with the legend beside the data area
/// rather than over it.</summary>
/// <remarks>ScottPlot 5 has no native log axis, so the chart plots log10 of the data and labels the ticks
/// as decades. What was drawn is kept in <see cref="Series"/> and <see cref="Band"/> so tests can check a chart
/// without reading pixels.</remarks>
public sealed class LogLogChart
{
    private readonly Plot _plot;
    private readonly List<ChartSeries> _series = [];

    /// <summary>Creates an empty chart with a title and axis labels.</summary>
    public LogLogChart(string title, string xLabel, string yLabel)
    {
        // The font must be registered before the plot exists: a plot takes its fonts when it is created.
        PlotFonts.EnsureRegistered();
        _plot = new Plot();
        Title = title;
        YLabel = yLabel;
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
        // Outside the data area: a legend inside hides the curves wherever they happen to run.
        _plot.ShowLegend(Edge.Right);
    }

    /// <summary>The chart's title.</summary>
    public string Title { get; }

    /// <summary>The label of the value axis.</summary>
    public string YLabel { get; }

    /// <summary>The curves drawn so far, in order.</summary>
    public IReadOnlyList<ChartSeries> Series => _series;

    /// <summary>The shaded frequency band, if one was marked.</summary>
    public (double LowHz, double HighHz, string Label)? Band { get; private set; }

    /// <summary>Always true: the legend sits to the right of the data area, never over it.</summary>
    public bool LegendOutsideData => true;

    /// <summary>Adds a curve in the next default colour, solid; points where either coordinate is not positive and
    /// finite are skipped.</summary>
    public void AddCurve(string label, IReadOnlyList<double> x, IReadOnlyList<double> y) =>
        AddCurve(label, x, y, null, dashed: false);

    /// <summary>Adds a curve in a given colour and line pattern; points where either coordinate is not positive and
    /// finite are skipped.</summary>
    /// <param name="label">Legend text.</param>
    /// <param name="x">Frequencies.</param>
    /// <param name="y">Values.</param>
    /// <param name="hexColor">Colour as <c>#rrggbb</c>, or null for the next default colour.</param>
    /// <param name="dashed">Dashed rather than solid.</param>
    public void AddCurve(string label, IReadOnlyList<double> x, IReadOnlyList<double> y, string? hexColor, bool dashed)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
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
        line.LineWidth = dashed ? 2.5f : 1.5f;
        if (hexColor is not null) line.Color = Color.FromHex(hexColor);
        if (dashed) line.LinePattern = LinePattern.Dashed;
        _series.Add(new ChartSeries(label, line.Color.ToHex(), dashed));
    }

    /// <summary>Shades the frequency band [<paramref name="lowHz"/>, <paramref name="highHz"/>] behind the curves.</summary>
    /// <param name="lowHz">Lower edge, positive.</param>
    /// <param name="highHz">Upper edge, above the lower.</param>
    /// <param name="label">Legend text saying what the band is.</param>
    /// <exception cref="ArgumentOutOfRangeException">The edges are not positive, finite and increasing.</exception>
    public void MarkBand(double lowHz, double highHz, string label)
    {
        if (!(lowHz > 0) || !(highHz > lowHz) || !double.IsFinite(highHz))
            throw new ArgumentOutOfRangeException(nameof(highHz), $"a band needs 0 < low < high, finite; got {lowHz} to {highHz}");
        var span = _plot.Add.HorizontalSpan(Math.Log10(lowHz), Math.Log10(highHz));
        span.LegendText = label;
        span.FillStyle.Color = Colors.Gray.WithAlpha(0.15);
        span.LineStyle.Width = 0;
        _plot.MoveToBack(span);
        Band = (lowHz, highHz, label);
    }

    /// <summary>Encodes the chart as PNG bytes.</summary>
    public byte[] ToPng(int width = 1000, int height = 700) => _plot.GetImageBytes(width, height, ImageFormat.Png);
}

/// <summary>One curve of a <see cref="LogLogChart"/>.</summary>
/// <param name="Label">Its legend text.</param>
/// <param name="Color">Its colour as hex text.</param>
/// <param name="Dashed">Whether it is dashed.</param>
public sealed record ChartSeries(string Label, string Color, bool Dashed);
