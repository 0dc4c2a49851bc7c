using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Cli.Bench;

/// <summary>Quick timing of the engine's own per-iteration work for a year-long fit of 1000 band windows:
/// cutting one worker's residual, swapping in one worker's template, and cutting the noise worker's full residual.
/// Multiply by the workers per iteration to compare with worker compute (the BenchmarkDotNet version is
/// tests/GlobalFit.Benchmarks/Engine/ResidualBookBenchmarks.cs).</summary>
public static class OrchestrationBench
{
    /// <summary>Runs the measurements and returns their figures.</summary>
    public static IEnumerable<BenchFigure> Run()
    {
        var workload = new OrchestrationWorkload();
        var (id, _) = workload.Windows[500];
        var template = workload.Book.Template(id);
        double cut = QuickTimer.BestSeconds(() => workload.Book.ResidualFor(id), 200);
        double replace = QuickTimer.BestSeconds(() => workload.Book.Replace(id, template), 200);
        double full = QuickTimer.BestSeconds(() => workload.Book.ResidualFor(OrchestrationWorkload.NoiseWorkerId), 5);
        yield return new BenchFigure("residual_cut_us", cut * 1e6, "cut one band worker's residual (384 bins, A/E, with its inverse PSDs) from a year-long book of 1000 windows");
        yield return new BenchFigure("template_commit_us", replace * 1e6, "swap one band worker's template into the book");
        yield return new BenchFigure("full_residual_year_ms", full * 1e3, "data minus 1000 templates over 0.1-30 mHz for a year at 5 s (the noise worker's input)");
    }
}
