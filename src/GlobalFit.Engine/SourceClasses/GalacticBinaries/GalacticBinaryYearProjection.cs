using GlobalFit.Engine.Benchmarking;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>What a year-long galactic-binary fit of 0.3–15 mHz would take, projected from a short measured slice:
/// <c>globalfit bench --projection</c>.</summary>
/// <remarks>
/// <para>Measured: a <see cref="GalacticBinaryBandSlice"/> of four windows at 3 mHz, a Julian year at 5 s, the settings of
/// <c>configs/fit-year-multiday.toml</c> (256-bin windows, 96 margin bins, 25 sources, 500 steps, 6 temperatures),
/// 320 invented binaries per window (the density of 20,000 binaries in 3–3.5 mHz), run on this machine's cores (two
/// threads on the reference machine). The first iteration (each new window's greedy search) is timed apart from the
/// second (the steady state).</para>
/// <para>Assumptions, stated because the projection is only as good as they are: every window of 0.3–15 mHz costs what a
/// 3 mHz window costs (templates are longer above and source density falls; the two roughly offset); windows spread
/// evenly over C cores (a stage holds about 900 windows, so C ≤ 900 keeps every core busy); orchestration adds 3 % (the
/// measured 1–3 % of worker compute, README); the noise worker's update (about a second) is left out; cores scale
/// linearly from the measured thread count.</para>
/// </remarks>
public static class GalacticBinaryYearProjection
{
    /// <summary>Band of the projected fit, Hz.</summary>
    public const double FitMinHz = 3e-4;

    /// <summary>Band of the projected fit, Hz.</summary>
    public const double FitMaxHz = 1.5e-2;

    /// <summary>Orchestration overhead added to worker compute.</summary>
    public const double OrchestrationOverhead = 0.03;

    /// <summary>The year-multiday settings at 3 mHz.</summary>
    public static GalacticBinaryBandSettings YearSettings { get; } = new()
    {
        MinFrequencyHz = 3e-3,
        MaxFrequencyHz = 3.5e-3,
        WindowBins = 256,
        MarginBins = 96,
        MaxSourcesPerWindow = 25,
        StepsPerUpdate = 500,
        TemperatureCount = 6,
    };

    /// <summary>Measures the slice and projects <paramref name="iterations"/> iterations on <paramref name="cores"/> cores.</summary>
    /// <param name="iterations">Iterations of the projected fit, ≥ 1.</param>
    /// <param name="cores">Cores of the projected machine, ≥ 1.</param>
    /// <param name="threads">Threads the slice is measured on, ≥ 1.</param>
    /// <returns>The figures.</returns>
    public static IEnumerable<BenchFigure> Run(int iterations, int cores, int threads)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(iterations);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(cores);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(threads);
        var slice = new GalacticBinaryBandSlice(YearSettings, 365.25, 5.0, 4, 320, 2027);
        var first = slice.Run(1, YearSettings.StepsPerUpdate, threads);
        var steady = slice.Run(1, YearSettings.StepsPerUpdate, threads);
        double df = 1.0 / (365.25 * 86400.0);
        int windows = (int)Math.Ceiling((FitMaxHz - FitMinHz) / (YearSettings.WindowBins * df));
        double iterationSeconds = windows * steady.MachineCoreSecondsPerWindowUpdate / cores * (1 + OrchestrationOverhead);
        double firstExtra = windows * (first.MachineCoreSecondsPerWindowUpdate - steady.MachineCoreSecondsPerWindowUpdate) / cores;
        double fitHours = (iterations * iterationSeconds + Math.Max(firstExtra, 0)) / 3600.0;
        yield return new BenchFigure("galactic_binary_year_window_update_core_s", steady.MachineCoreSecondsPerWindowUpdate,
            $"one window-update of a year at 5 s (fit-year-multiday settings, 3 mHz, {threads} threads, steady state), core-seconds");
        yield return new BenchFigure("galactic_binary_year_first_window_update_core_s", first.MachineCoreSecondsPerWindowUpdate,
            "the same for a new window's first update (greedy search included), core-seconds");
        yield return new BenchFigure("galactic_binary_year_efficiency", steady.Efficiency,
            "template + likelihood kernel time over worker compute, year-long window (steady state)");
        yield return new BenchFigure("galactic_binary_year_projected_iteration_s", iterationSeconds,
            $"projected iteration of 0.3-15 mHz ({windows} windows) on {cores} cores, s");
        yield return new BenchFigure("galactic_binary_year_projected_fit_h", fitHours,
            $"projected {iterations}-iteration fit of 0.3-15 mHz on {cores} cores (first iterations' searches included), hours");
    }
}
