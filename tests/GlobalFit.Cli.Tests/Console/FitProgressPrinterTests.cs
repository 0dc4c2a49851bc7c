using System.Collections.Immutable;
using GlobalFit.Cli.Console;
using GlobalFit.Engine.Orchestration;

namespace GlobalFit.Cli.Tests.Console;

/// <summary>The progress line shows the change of ln L per iteration, not the huge absolute sum.</summary>
public class FitProgressPrinterTests
{
    private static IterationReport Report(long iteration, double logLikelihood) =>
        new(iteration, 3, TimeSpan.FromSeconds(1.5), logLikelihood, ImmutableSortedDictionary<string, int>.Empty.Add("galactic_binaries", 4),
            [], Checkpointed: false);

    [Fact]
    public void Progress_lines_show_the_change_of_ln_l_since_the_previous_iteration_and_never_the_sum()
    {
        var error = new StringWriter();
        var printer = new FitProgressPrinter(new CliContext(TextWriter.Null, error, OutputIsTerminal: false));
        // Sums of the size a year of data gives; the changes are +12.5 and −3.4 (to the sums' rounding, ~1e-9).
        printer.IterationCompleted(Report(1, -4_812_345.0));
        printer.IterationCompleted(Report(2, -4_812_332.5));
        printer.IterationCompleted(Report(3, -4_812_335.9));

        // Redirected output keeps the first and last lines only (the middle one falls inside the ten-second gap).
        string[] lines = error.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(2, lines.Length);
        Assert.Contains("ΔlnL n/a", lines[0], StringComparison.Ordinal);
        Assert.Contains("ΔlnL -3.4", lines[1], StringComparison.Ordinal);
        Assert.DoesNotContain("4812", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Every_iteration_on_a_terminal_shows_its_own_change()
    {
        var error = new StringWriter();
        var printer = new FitProgressPrinter(new CliContext(TextWriter.Null, error, OutputIsTerminal: true));
        printer.IterationCompleted(Report(1, -100.0));
        printer.IterationCompleted(Report(2, -87.5));
        Assert.Contains("ΔlnL +12.5", error.ToString(), StringComparison.Ordinal);
    }
}
