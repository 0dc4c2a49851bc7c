using System.CommandLine;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit resume RUN [--iterations N]</c>: continue a stopped fit from its newest intact checkpoint, or
/// extend a stopped or finished one to N iterations.</summary>
public static class ResumeCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "The run folder" };
        var otlp = FitCommand.OtlpOption();
        var iterations = new Option<long?>("--iterations") { Description = "New total of iterations: extends a finished or stopped run (written into run.toml)" };
        iterations.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<long?>() is < 1) r.AddError("--iterations must be at least 1");
        });
        var acceptNewData = AcceptNewDataOption();
        var command = new Command("resume", "Continue a stopped fit exactly where its last checkpoint left it, or extend a finished one") { run, otlp, iterations, acceptNewData };
        command.SetAction(parse => FitCommand.Run(context,
            options => FitRunner.Resume(parse.GetValue(run)!, options with { AcceptNewData = parse.GetValue(acceptNewData) }, parse.GetValue(iterations)), parse.GetValue(otlp)));
        return command;
    }

    /// <summary><c>--accept-new-data</c>, shared with <c>catalogue</c>.</summary>
    internal static Option<bool> AcceptNewDataOption() =>
        new("--accept-new-data") { Description = "Go on although the data file is not the one the run was fitted to (its size or SHA-256 changed)" };
}
