using System.CommandLine;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.Runs;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit catalogue RUN --format csv|json|h5</c>: export a run's catalogue (sources with medians, 90 %
/// intervals, SNR and confidence, plus posterior samples in JSON and HDF5), also while the fit is still running.</summary>
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
        var command = new Command("catalogue", "Export the catalogue of a run from its stored samples") { run, format, output, force };
        command.SetAction(parse => Run(context, parse.GetValue(run)!, parse.GetValue(format)!, parse.GetValue(output), parse.GetValue(force)));
        return command;
    }

    private static int Run(CliContext context, string runFolder, string format, string? output, bool force)
    {
        var layout = RunFolderLayout.OpenExisting(runFolder);
        if (format == "h5" && output is null) throw new InvalidInputException("--out", null, "the h5 format needs a file: --out FILE.h5");
        string? target = output is null ? null : Console.OutputPaths.CheckWritable(output, force, "--out");
        var plan = RunPlan.Load(layout.ResolvedConfig);
        var records = RunCatalogue.Build(plan, layout, message => context.Error.WriteLine($"warning: {message}"));
        switch (format)
        {
            case "csv" when target is null: context.Out.Write(CatalogueCsvWriter.Format(records)); break;
            case "csv": CatalogueCsvWriter.Write(target, records, overwrite: force); break;
            case "json" when target is null: context.Out.WriteLine(CatalogueJsonWriter.Format(records)); break;
            case "json": CatalogueJsonWriter.Write(target, records, overwrite: force); break;
            default: CatalogueHdf5Writer.Write(target!, records, overwrite: force); break;
        }
        if (target is not null) context.Error.WriteLine($"wrote {target}: {records.Length} sources");
        return ExitCodes.Success;
    }
}
