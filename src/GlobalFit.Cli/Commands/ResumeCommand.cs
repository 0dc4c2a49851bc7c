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
        var command = new Command("resume", "Continue a stopped fit exactly where its last checkpoint left it, or extend a finished one") { run, otlp, iterations };
        command.SetAction(parse => FitCommand.Run(context, options => FitRunner.Resume(parse.GetValue(run)!, options, parse.GetValue(iterations)), parse.GetValue(otlp)));
        return command;
    }
}
