using System.CommandLine;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit catalogue RUN --format csv|json|h5</c>: export a run's catalogue (sources with medians, 90 %
/// intervals, SNR and confidence, plus posterior samples in JSON and HDF5, and the noise posterior as the row
/// <c>noise</c>), also while the fit is still running.</summary>
public static class CatalogueCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "The run folder" };
        var format = new Option<string>("--format") { Description = "csv, json or h5", DefaultValueFactory = _ => "csv" };
        format.AcceptOnlyFromAmong("csv", "json", "h5");
        var output = new Option<string?>("--out") { Description = "File to write (default: print CSV/JSON; h5 needs --out)" };
        var force = new Option<bool>("--force") { Description = "Replace an existing output file" };
        var burnIn = new Option<long?>("--burn-in") { Description = "Iterations whose samples are left out (default: the run's burn_in)" };
        burnIn.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<long?>() is < 0) r.AddError("--burn-in must be at least 0");
        });
        var minConfidence = new Option<double?>("--min-confidence") { Description = "Leave out sources present in a smaller fraction of the samples (default: the run's min_confidence)" };
        minConfidence.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<double?>() is { } v && !(v is >= 0 and <= 1)) r.AddError("--min-confidence must lie in [0, 1]");
        });
        var minSnr = new Option<double?>("--min-snr") { Description = "Leave out sources whose median SNR lies below this (on top of each class's catalogue_min_snr)" };
        minSnr.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<double?>() is { } v && !(v >= 0 && double.IsFinite(v))) r.AddError("--min-snr must be finite and at least 0");
        });
        var noSamples = new Option<bool>("--no-samples") { Description = "JSON without the posterior samples (summaries and sample counts only)" };
        var acceptNewData = ResumeCommand.AcceptNewDataOption();
        var command = new Command("catalogue", "Export the catalogue of a run from its stored samples") { run, format, output, force, burnIn, minConfidence, minSnr, noSamples, acceptNewData };
        command.SetAction(parse => Run(context, parse.GetValue(run)!, parse.GetValue(format)!, parse.GetValue(output), parse.GetValue(force),
            parse.GetValue(burnIn), parse.GetValue(minConfidence), parse.GetValue(minSnr), parse.GetValue(noSamples), parse.GetValue(acceptNewData)));
        return command;
    }

    private static int Run(CliContext context, string runFolder, string format, string? output, bool force, long? burnIn, double? minConfidence, double? minSnr, bool noSamples, bool acceptNewData)
    {
        var layout = RunFolderLayout.OpenExisting(runFolder);
        if (format == "h5" && output is null) throw new InvalidInputException("--out", null, "the h5 format needs a file: --out FILE.h5");
        if (noSamples && format != "json") throw new InvalidInputException("--no-samples", null, "applies to --format json only (CSV holds no samples; HDF5 keeps them by its layout)");
        string? target = output is null ? null : Console.OutputPaths.CheckWritable(output, force, "--out");
        var plan = RunPlan.Load(layout.ResolvedConfig);
        Action<string> warn = message => context.Error.WriteLine($"warning: {message}");
        // The catalogue is built from stored samples alone, but it describes the data file the run names: a different
        // file there would pair the samples with data they were not drawn from.
        DataIdentity.Verify(layout, plan.Settings.DataPath, acceptNewData, warn);
        var records = RunCatalogue.Build(plan, layout, warn, burnIn, minConfidence);
        // A row without an SNR (the noise posterior) is not a source an SNR floor applies to.
        if (minSnr is { } floor) records = [.. records.Where(r => double.IsNaN(r.Snr) || r.Snr >= floor)];
        switch (format)
        {
            case "csv" when target is null: context.Out.Write(CatalogueCsvWriter.Format(records)); break;
            case "csv": CatalogueCsvWriter.Write(target, records, overwrite: force); break;
            case "json" when target is null: context.Out.WriteLine(CatalogueJsonWriter.Format(records, includeSamples: !noSamples)); break;
            case "json": CatalogueJsonWriter.Write(target, records, overwrite: force, includeSamples: !noSamples); break;
            default: CatalogueHdf5Writer.Write(target!, records, overwrite: force); break;
        }
        if (target is not null) context.Error.WriteLine($"wrote {target}: {records.Length} rows");
        return ExitCodes.Success;
    }
}
