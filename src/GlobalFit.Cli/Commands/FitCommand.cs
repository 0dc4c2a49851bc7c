using System.CommandLine;
using GlobalFit.Cli.Console;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Cli.Commands;

/// <summary><c>globalfit fit CONFIG.toml</c>: run a global fit described by a run configuration.</summary>
public static class FitCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var config = new Argument<string>("config") { Description = "Run configuration (TOML); see configs/ for examples" };
        var otlp = OtlpOption();
        var command = new Command("fit", "Fit the sources and noise of an observation jointly, as a run configuration describes") { config, otlp };
        command.SetAction(parse => Run(context, options => FitRunner.Start(parse.GetValue(config)!, options), parse.GetValue(otlp)));
        return command;
    }

    /// <summary>The <c>--otlp-endpoint</c> option shared with <c>resume</c>.</summary>
    internal static Option<Uri?> OtlpOption() => new("--otlp-endpoint")
    {
        Description = "Also export spans and metrics to this OpenTelemetry (OTLP) collector, e.g. http://localhost:4317",
        CustomParser = result =>
        {
            string text = result.Tokens[0].Value;
            if (Uri.TryCreate(text, UriKind.Absolute, out var uri) && (uri.Scheme == Uri.UriSchemeHttp || uri.Scheme == Uri.UriSchemeHttps)) return uri;
            result.AddError($"--otlp-endpoint must be an http or https URL, got '{text}'");
            return null;
        },
    };

    /// <summary>Runs a fit (fresh or resumed) with progress, Ctrl-C handling and the exit-code policy.</summary>
    /// <param name="context">Where to write.</param>
    /// <param name="fit">Starts or resumes the fit.</param>
    /// <param name="otlp">OTLP endpoint or null.</param>
    /// <param name="completed">Receives the outcome of a completed run (with its catalogue), e.g. for the demo's comparison.</param>
    internal static int Run(CliContext context, Func<FitRunOptions, FitOutcome> fit, Uri? otlp, Action<FitOutcome>? completed = null)
    {
        var printer = new FitProgressPrinter(context);
        using var interrupt = new InterruptSignal();
        var outcome = fit(new FitRunOptions(printer, otlp, interrupt.Token));
        printer.EndLine();
        switch (outcome.Kind)
        {
            case FitOutcomeKind.Completed:
                context.Out.WriteLine($"fit complete: {outcome.IterationsCompleted} iterations; catalogue written ({string.Join(", ", outcome.Catalogue.GroupBy(r => r.ClassId).Select(g => $"{g.Key} {g.Count()}"))}) (checkpoint at iteration {outcome.CheckpointIteration})");
                completed?.Invoke(outcome);
                return ExitCodes.Success;
            case FitOutcomeKind.Interrupted:
                context.Error.WriteLine($"interrupted after {outcome.IterationsCompleted} iterations; checkpoint at iteration {outcome.CheckpointIteration}; continue with 'globalfit resume RUN'");
                return ExitCodes.Interrupted;
            case FitOutcomeKind.WriteFailed:
                context.Error.WriteLine($"error: the fit stopped: {outcome.Message}");
                context.Error.WriteLine($"the last good checkpoint (iteration {outcome.CheckpointIteration}) is kept; free space or fix the permissions and run 'globalfit resume RUN'");
                return ExitCodes.WriteFailed;
            default:
                context.Error.WriteLine($"error: the fit stopped: {outcome.Message}");
                context.Error.WriteLine($"the last complete iteration ({outcome.CheckpointIteration}) is checkpointed; fix the cause and run 'globalfit resume RUN'");
                return ExitCodes.FitFailed;
        }
    }
}
