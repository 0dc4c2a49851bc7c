using System.CommandLine;
using System.Globalization;
using System.Text;
using GlobalFit.Cli.Console;
using GlobalFit.Cli.Plotting;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit sensitivity</c>: the noise PSDs of A, E, T and the sky-averaged sensitivity curve,
/// as CSV and optionally as a PNG chart.</summary>
public static class SensitivityCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var years = new Option<double?>("--foreground-fit-years") { Description = "Observation time in years for the confusion foreground fit (0.5, 1, 2 or 4); omit for instrument noise only" };
        var output = new Option<string>("--out") { Description = "CSV file to write", Required = true };
        var png = new Option<string?>("--png") { Description = "Also draw the curve into this PNG file" };
        var fMin = new Option<double>("--f-min") { Description = "Lowest frequency, Hz", DefaultValueFactory = _ => 1e-5 };
        var fMax = new Option<double>("--f-max") { Description = "Highest frequency, Hz", DefaultValueFactory = _ => 1.0 };
        var points = new Option<int>("--points") { Description = "Number of log-spaced frequencies", DefaultValueFactory = _ => 400 };
        var force = new Option<bool>("--force") { Description = "Replace existing output files" };
        var json = new Option<bool>("--json") { Description = "Print a JSON summary instead of text" };
        var oms = new Option<double?>("--oms-asd") { Description = $"Optical-metrology noise level, m Hz^-1/2 (default {InstrumentNoiseSettings.DefaultOmsAsd})" };
        var acceleration = new Option<double?>("--acceleration-asd") { Description = $"Test-mass acceleration noise level, m s^-2 Hz^-1/2 (default {InstrumentNoiseSettings.DefaultAccelerationAsd})" };
        var scenario = new Option<string?>("--scenario") { Description = "Take the noise (levels, arm length, foreground) from this scenario file" };
        var command = new Command("sensitivity", "Write the A/E/T noise PSDs and the sky-averaged sensitivity curve (the plot analysts draw first)")
        {
            years, output, png, fMin, fMax, points, force, json, oms, acceleration, scenario,
        };
        command.SetAction(parse => Run(context, new Request(
            parse.GetValue(years), parse.GetValue(output)!, parse.GetValue(png), parse.GetValue(fMin),
            parse.GetValue(fMax), parse.GetValue(points), parse.GetValue(force), parse.GetValue(json),
            parse.GetValue(oms), parse.GetValue(acceleration), parse.GetValue(scenario))));
        return command;
    }

    private sealed record Request(double? Years, string Output, string? Png, double FMin, double FMax, int Points, bool Force, bool Json,
        double? OmsAsd, double? AccelerationAsd, string? Scenario);

    // The instrument and foreground: a scenario's noise, or the defaults with the levels and foreground asked for.
    private static (InstrumentNoiseSettings Instrument, GalacticConfusionSettings? Foreground) Noise(Request r)
    {
        if (r.Scenario is not null)
        {
            if (r.OmsAsd is not null || r.AccelerationAsd is not null || r.Years is not null)
                throw new InvalidInputException("--scenario", null, "takes every noise setting from the scenario; leave out --oms-asd, --acceleration-asd and --foreground-fit-years");
            var noise = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Load(r.Scenario)).Noise;
            return (noise.Instrument, noise.Foreground);
        }
        foreach (var (name, value) in new[] { ("--oms-asd", r.OmsAsd), ("--acceleration-asd", r.AccelerationAsd) })
            if (value is { } v && !(v > 0 && double.IsFinite(v)))
                throw new InvalidInputException(name, null, $"must be positive and finite, got {v}");
        var instrument = new InstrumentNoiseSettings(
            accelerationAsd: r.AccelerationAsd ?? InstrumentNoiseSettings.DefaultAccelerationAsd,
            omsAsd: r.OmsAsd ?? InstrumentNoiseSettings.DefaultOmsAsd);
        GalacticConfusionSettings? foreground = null;
        if (r.Years is double y)
        {
            if (!GalacticConfusionSettings.SupportedObservationYears.Contains(y))
                throw new InvalidInputException("--foreground-fit-years", null, $"the published foreground fit exists for 0.5, 1, 2 and 4 years only, got {y}");
            foreground = new GalacticConfusionSettings(y);
        }
        return (instrument, foreground);
    }

    private static int Run(CliContext context, Request r)
    {
        if (!(r.FMin > 0) || !(r.FMax > r.FMin) || !double.IsFinite(r.FMax))
            throw new InvalidInputException("--f-min/--f-max", null, $"need 0 < f-min < f-max, got {r.FMin} and {r.FMax}");
        if (r.Points < 2 || r.Points > 1_000_000)
            throw new InvalidInputException("--points", null, $"must be between 2 and 1000000, got {r.Points}");
        var (instrument, foreground) = Noise(r);
        string csvPath = OutputPaths.CheckWritable(r.Output, r.Force, "--out");
        string? pngPath = r.Png is null ? null : OutputPaths.CheckWritable(r.Png, r.Force, "--png");

        var noise = new AetNoiseModel(instrument, foreground);
        var curve = new SensitivityCurve(instrument, foreground);
        var table = SensitivityTable.Compute(noise, curve, r.FMin, r.FMax, r.Points);

        AtomicFile.Write(csvPath, overwrite: true, stream => stream.Write(Encoding.UTF8.GetBytes(table.ToCsv())));
        if (pngPath is not null)
        {
            var chart = Chart(table, foreground is not null);
            byte[] bytes = chart.ToPng();
            AtomicFile.Write(pngPath, overwrite: true, stream => stream.Write(bytes));
        }

        var (fBest, sBest) = table.Minimum();
        if (r.Json)
        {
            context.Out.WriteLine(CliJson.Serialize(new Dictionary<string, object?>
            {
                ["csv"] = csvPath,
                ["csv_holds"] = CsvHolds,
                ["png"] = pngPath,
                ["png_holds"] = pngPath is null ? null : ChartHolds,
                ["foreground_fit_years"] = foreground?.ObservationYears,
                ["acceleration_asd"] = instrument.AccelerationAsd,
                ["oms_asd"] = instrument.OmsAsd,
                ["points"] = r.Points,
                ["most_sensitive_frequency_hz"] = fBest,
                ["most_sensitive_strain_asd"] = Math.Sqrt(sBest),
            }));
        }
        else
        {
            context.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"wrote {r.Points} frequencies from {NumberText.Significant(r.FMin, 3)} to {NumberText.Significant(r.FMax, 3)} Hz to {csvPath}: {CsvHolds}"));
            if (pngPath is not null) context.Out.WriteLine($"wrote chart to {pngPath}: {ChartHolds}");
            context.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"most sensitive at {fBest * 1e3:F2} mHz: sqrt(S_n) = {NumberText.Scientific(Math.Sqrt(sBest), 2)} /sqrt(Hz)"));
        }
        return ExitCodes.Success;
    }

    /// <summary>What the CSV holds, as the command says it.</summary>
    internal const string CsvHolds = "power spectral densities (PSD, 1/Hz; strain PSDs S_n and A/E/T PSDs in fractional frequency)";

    /// <summary>What the chart holds, as the command and the chart say it.</summary>
    internal const string ChartHolds = "strain amplitude spectral densities (ASD = sqrt(PSD), 1/sqrt(Hz))";

    internal static LogLogChart Chart(SensitivityTable table, bool withForeground)
    {
        var chart = new LogLogChart("Sky-averaged sensitivity: strain ASD = √PSD", "frequency [Hz]", "strain ASD √S_n [1/√Hz]");
        chart.AddCurve("ASD, instrument + foreground (exact sky average)", table.FrequencyHz, table.ExactStrainPsd.Select(Math.Sqrt).ToArray());
        chart.AddCurve("ASD, approximate transfer function (Robson et al. 2019)", table.FrequencyHz, table.RobsonStrainPsd.Select(Math.Sqrt).ToArray());
        if (withForeground)
            // Drawn only where it matters (above 0.1 % of the total); its exponential cut-off would otherwise
            // stretch the axis over twenty decades.
            chart.AddCurve("ASD, confusion foreground", table.FrequencyHz,
                table.ForegroundStrainPsd.Select((s, i) => s > 1e-3 * table.ExactStrainPsd[i] ? Math.Sqrt(s) : double.NaN).ToArray());
        return chart;
    }
}
