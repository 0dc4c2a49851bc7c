using System.CommandLine;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit resume RUN</c>: continue a stopped fit from its newest intact checkpoint.</summary>
public static class ResumeCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var run = new Argument<string>("run") { Description = "The run folder" };
        var otlp = FitCommand.OtlpOption();
        var command = new Command("resume", "Continue a stopped fit exactly where its last checkpoint left it") { run, otlp };
        command.SetAction(parse => FitCommand.Run(context, options => FitRunner.Resume(parse.GetValue(run)!, options), parse.GetValue(otlp)));
        return command;
    }
}
