using System.CommandLine;
using GlobalFit.Cli.Commands;
using GlobalFit.Cli.Console;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli;

/// <summary>The <c>globalfit</c> command tree and its error policy: bad input exits with
/// <see cref="ExitCodes.BadInput"/> and a message naming the file and place; bugs exit with
/// <see cref="ExitCodes.InternalError"/>, one line on the terminal and the stack trace in a crash log.</summary>
public static class CommandLineApp
{
    /// <summary>Parses <paramref name="args"/>, runs the chosen command and returns the exit code.</summary>
    public static int Run(string[] args, CliContext context)
    {
        var root = new RootCommand(
            "globalfit: joint fitting of overlapping gravitational-wave sources in space-interferometer TDI data.")
        {
            SimulateCommand.Create(context),
            InspectCommand.Create(context),
            SensitivityCommand.Create(context),
            FitCommand.Create(context),
            ResumeCommand.Create(context),
            StatusCommand.Create(context),
            CatalogueCommand.Create(context),
            CompareCommand.Create(context),
            TraceCommand.Create(context),
            DemoCommand.Create(context),
            BenchCommand.Create(context),
        };
        if (EmptyArgument(args) is string empty)
        {
            context.Error.WriteLine($"error: {empty} is an empty string; every argument and option value of globalfit names a file, folder or value");
            return ExitCodes.BadInput;
        }
        ParseResult parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            foreach (var error in parse.Errors) context.Error.WriteLine($"error: {error.Message}");
            context.Error.WriteLine("Run 'globalfit --help' (or 'globalfit COMMAND --help') for usage.");
            return ExitCodes.BadInput;
        }
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = context.Out, Error = context.Error, EnableDefaultExceptionHandler = false });
        }
        catch (InvalidInputException e)
        {
            context.Error.WriteLine($"error: {e.Message}");
            return ExitCodes.BadInput;
        }
        catch (FileWriteException e)
        {
            context.Error.WriteLine($"error: {e.Message}");
            return ExitCodes.WriteFailed;
        }
        catch (OperationCanceledException)
        {
            context.Error.WriteLine("interrupted");
            return ExitCodes.Interrupted;
        }
        catch (Exception e)
        {
            // A bug: one line for the user, the stack trace in a file they can attach to a report.
            string? log = CrashReport.Write(e, args);
            context.Error.WriteLine($"error: internal error ({e.GetType().Name}: {e.Message}); {(log is null ? "no crash log could be written" : $"details in {log}")}");
            return ExitCodes.InternalError;
        }
    }

    // No command takes an empty value, and an empty path would otherwise reach the file system's argument checks.
    private static string? EmptyArgument(string[] args)
    {
        for (int i = 0; i < args.Length; i++)
            if (string.IsNullOrWhiteSpace(args[i]))
                return i > 0 && args[i - 1].StartsWith("--", StringComparison.Ordinal) ? $"the value of {args[i - 1]}" : $"argument {i + 1}";
        return null;
    }
}
