using System.CommandLine;
using System.Globalization;
using GlobalFit.Cli.Console;
using GlobalFit.Cli.Plotting;
using GlobalFit.Engine.Inspection;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit inspect DATA.h5</c>: what an observation file holds and whether its noise matches the model.</summary>
public static class InspectCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("data") { Description = "Observation file (HDF5)" };
        var png = new Option<string?>("--png") { Description = "Draw Welch PSD estimates against the model into this PNG file" };
        var force = new Option<bool>("--force") { Description = "Replace an existing PNG file" };
        var json = new Option<bool>("--json") { Description = "Print the report as JSON" };
        var command = new Command("inspect", "Summarise an observation file: time axis, channels, gaps, noise against its model, injected sources")
        {
            file, png, force, json,
        };
        command.SetAction(parse => Run(context, parse.GetValue(file)!, parse.GetValue(png), parse.GetValue(force), parse.GetValue(json)));
        return command;
    }

    /// <summary>Inspects <paramref name="path"/>; shared with <c>demo</c>.</summary>
    public static int Run(CliContext context, string path, string? pngPath, bool force, bool json)
    {
        string? png = pngPath is null ? null : OutputPaths.CheckWritable(pngPath, force, "--png");
        var report = ObservationInspection.Run(path);
        if (png is not null) WriteChart(report, png);
        if (json) context.Out.WriteLine(CliJson.Serialize(InspectionJson.From(report, png)));
        else WriteText(context.Out, report, png);
        return ExitCodes.Success;
    }

    private static void WriteText(TextWriter o, ObservationInspection r, string? png)
    {
        var data = r.Observation.Data;
        var p = r.Observation.Provenance;
        string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
        o.WriteLine(I($"file          {r.Path}"));
        o.WriteLine(I($"format        version {r.Observation.FormatVersion}, written by {p.Generator} at {UtcText.Format(p.CreatedUtc)}"));
        if (p.Entries.TryGetValue("scenario_name", out var name)) o.WriteLine($"scenario      {name}");
        o.WriteLine(I($"time axis     start {data.T0Seconds} s, cadence {data.DtSeconds} s, {data.Count} points = {data.Count * data.DtSeconds / 86400:F3} days"));
        o.WriteLine(I($"gaps          {r.Observation.Gaps.Count} ({r.Observation.Gaps.TotalSeconds / 3600:F2} h in total)"));
        o.WriteLine($"noise model   {r.ModelDescription}");
        if (r.Channels.Count > 0)
            o.WriteLine(I($"Welch/model   {r.Welch[0].SegmentCount} segments of {r.Welch[0].SegmentLength} points, band {NumberText.Significant(r.Channels[0].BandLowHz * 1e3, 3)}–{NumberText.Significant(r.Channels[0].BandHighHz * 1e3, 3)} mHz"));
        foreach (var c in r.Channels)
            o.WriteLine(I($"  {c.Channel}  rms {NumberText.Scientific(c.RmsValue, 2)}   mean estimate/model {c.MeanRatio:F4} ± {c.RatioStandardError:F4}   chi²/bin {c.ChiSquarePerBin:F3} over {c.BinsCompared} bins"));
        foreach (var x in r.CrossChannels)
            o.WriteLine(I($"  {x.Pair} mean coherence {x.MeanCoherence:F4} (independent noise: {x.ExpectedForIndependent:F4})"));
        if (r.Injected.Count == 0) o.WriteLine("injected      none");
        foreach (var s in r.Injected)
        {
            string snr = s.SnrMin is null ? "" : I($", optimal SNR {s.SnrMin:F1} … {s.SnrMax:F1} (median {s.SnrMedian:F1})");
            o.WriteLine($"injected      {s.ClassId}: {s.Count}{snr}");
        }
        if (png is not null) o.WriteLine($"chart         {png}");
    }

    private static void WriteChart(ObservationInspection r, string png)
    {
        byte[] bytes = Chart(r).ToPng();
        AtomicFile.Write(png, overwrite: true, stream => stream.Write(bytes));
    }

    // One colour per channel (blue, orange and green stay apart for the common colour-vision deficiencies); the Welch
    // estimate solid, the model dashed; the band the statistics compare shaded; the legend beside the data.
    internal static readonly IReadOnlyDictionary<AetChannel, string> ChannelColors = new Dictionary<AetChannel, string>
    {
        [AetChannel.A] = "#1F77B4",
        [AetChannel.E] = "#FF7F0E",
        [AetChannel.T] = "#2CA02C",
    };

    internal static LogLogChart Chart(ObservationInspection r)
    {
        var chart = new LogLogChart("Welch estimate against the noise model", "frequency [Hz]", "PSD [1/Hz] (fractional frequency)");
        if (r.Channels.Count > 0)
            chart.MarkBand(r.Channels[0].BandLowHz, r.Channels[0].BandHighHz,
                $"band the statistics compare ({NumberText.Significant(r.Channels[0].BandLowHz * 1e3, 3)}–{NumberText.Significant(r.Channels[0].BandHighHz * 1e3, 3)} mHz)");
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            var welch = r.Welch[c];
            var f = welch.FrequenciesHz();
            chart.AddCurve($"{channels[c]} estimate", f, welch.Psd, ChannelColors[channels[c]], dashed: false);
            chart.AddCurve($"{channels[c]} model", f, f.Select(x => r.Model.Psd(channels[c], x)).ToArray(), ChannelColors[channels[c]], dashed: true);
        }
        return chart;
    }
}
