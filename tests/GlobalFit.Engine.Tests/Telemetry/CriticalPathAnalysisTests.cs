using GlobalFit.Engine.Telemetry;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Telemetry;

public class CriticalPathAnalysisTests
{
    private const string T0 = "2026-12-01T10:00:00.0000000+00:00";

    private static string At(double ms) => DateTimeOffset.Parse(T0).AddTicks((long)(ms * 10_000)).ToString("O");

    private static string Span(string name, string trace, string id, string? parent, double startMs, double durationMs, string attributes) =>
        $$"""{"kind":"span","name":"{{name}}","trace_id":"{{trace}}","span_id":"{{id}}","parent_span_id":{{(parent is null ? "null" : $"\"{parent}\"")}},"start_utc":"{{At(startMs)}}","duration_ms":{{durationMs}},"status":"unset","attributes":{{attributes}}}""";

    private static string Worker(string trace, string id, string stage, string worker, double start, double duration, double wall) =>
        Span("fit.worker_update", trace, id, stage, start, duration,
            $$"""{"globalfit.iteration":1,"globalfit.stage.index":0,"globalfit.worker.id":"{{worker}}","globalfit.worker.wall_ms":{{wall}}}""");

    // Iteration 1 (200 ms): stage 0 runs bands a, b, c ending at 40, 100 and 75 ms; stage 1 runs the noise worker alone.
    // Iteration 2 (100 ms): one stage where c ends last. Expected figures are worked out by hand in the asserts.
    private static readonly string[] Lines =
    [
        Span("fit.iteration", "t1", "i1", null, 0, 200, """{"globalfit.iteration":1}"""),
        Span("fit.stage", "t1", "s0", "i1", 0, 102, """{"globalfit.iteration":1,"globalfit.stage.index":0}"""),
        Worker("t1", "w1", "s0", "galactic_binaries/a", 0, 40, 35),
        Worker("t1", "w2", "s0", "galactic_binaries/b", 0, 100, 90),
        Worker("t1", "w3", "s0", "galactic_binaries/c", 5, 70, 60),
        Span("fit.stage", "t1", "s1", "i1", 105, 60, """{"globalfit.iteration":1,"globalfit.stage.index":1}"""),
        Worker("t1", "w4", "s1", "noise", 110, 50, 45),
        """{"kind":"metric","name":"globalfit.worker.compute","unit":"ms","tags":{"globalfit.worker.id":"noise"},"count":1,"sum":45}""",
        Span("fit.iteration", "t2", "i2", null, 300, 100, """{"globalfit.iteration":2}"""),
        Span("fit.stage", "t2", "s0", "i2", 300, 90, """{"globalfit.iteration":2,"globalfit.stage.index":0}"""),
        Worker("t2", "w1", "s0", "galactic_binaries/a", 300, 20, 20),
        Worker("t2", "w3", "s0", "galactic_binaries/c", 300, 80, 80),
    ];

    private static string WriteFile(TemporaryRunFolder run, IEnumerable<string> lines, string ending = "\n")
    {
        string path = run.File(TelemetryJsonLines.FileName);
        File.WriteAllText(path, string.Join('\n', lines) + ending);
        return path;
    }

    [Fact]
    public void Each_stage_names_the_worker_that_finished_last_its_lead_and_the_others_wait()
    {
        using var run = new TemporaryRunFolder();
        var report = CriticalPathAnalysis.Read(WriteFile(run, Lines));

        Assert.Equal([1L, 2L], report.Iterations.Select(i => i.Iteration));
        var first = report.Iterations[0];
        Assert.Equal(200, first.DurationMs);
        var bands = first.Stages[0];
        Assert.Equal((0, 3, "galactic_binaries/b", 90.0), (bands.StageIndex, bands.WorkerCount, bands.CriticalWorkerId, bands.CriticalWorkerWallMs));
        // Ends at 40, 75, 100 ms: lead 100 − 75; waits (100 − 40) + (100 − 75) = 85 over two workers. Times are whole
        // multiples of 100 ns in the file, so the arithmetic is exact to the tick (1e-9 ms allows for double rounding).
        Assert.Equal(25, bands.LeadMs!.Value, 1e-9);
        Assert.Equal(85, bands.TotalWaitMs, 1e-9);
        Assert.Equal(42.5, bands.MeanWaitMs!.Value, 1e-9);
        Assert.Equal(90, bands.SlowestWallMs);
        var noise = first.Stages[1];
        Assert.Equal(("noise", 1, (double?)null, 0.0, (double?)null), (noise.CriticalWorkerId, noise.WorkerCount, noise.LeadMs, noise.TotalWaitMs, noise.MeanWaitMs));
        // Overhead = 200 − (90 + 45) = 65 ms; compute = 35 + 90 + 60 + 45 = 230 ms.
        Assert.Equal(230, first.WorkerComputeMs, 1e-9);
        Assert.Equal(65, first.OverheadMs, 1e-9);
        Assert.Equal(65.0 / 230, first.OverheadFractionOfCompute!.Value, 1e-12);
    }

    // Two band updates that measured their parts (80 and 20 ms of compute) and a noise update that did not.
    [Fact]
    public void Worker_time_breakdown_sums_the_parts_of_the_updates_that_measured_them()
    {
        using var run = new TemporaryRunFolder();
        string Measured(string id, string worker, double wall, double kernel, double template, double fisher) =>
            Span("fit.worker_update", "t1", id, "s0", 0, wall + 1,
                $$"""{"globalfit.iteration":1,"globalfit.stage.index":0,"globalfit.worker.id":"{{worker}}","globalfit.worker.wall_ms":{{wall}},"globalfit.worker.kernel_ms":{{kernel}},"globalfit.worker.state_ms":1.5,"globalfit.worker.phase.template_ms":{{template}},"globalfit.worker.phase.template_count":10,"globalfit.worker.phase.fisher_ms":{{fisher}},"globalfit.worker.phase.fisher_count":3}""");
        string[] lines =
        [
            Span("fit.iteration", "t1", "i1", null, 0, 200, """{"globalfit.iteration":1}"""),
            Span("fit.stage", "t1", "s0", "i1", 0, 102, """{"globalfit.iteration":1,"globalfit.stage.index":0}"""),
            Measured("w1", "galactic_binaries/a", 80, 30, 25, 40),
            Measured("w2", "galactic_binaries/b", 20, 10, 8, 5),
            Worker("t1", "w3", "s0", "noise", 0, 50, 45),
        ];
        var report = CriticalPathAnalysis.Read(WriteFile(run, lines));

        var b = report.Iterations[0].Breakdown!;
        // Sums over the two measured updates only (the noise update carries no kernel_ms): compute 80 + 20, kernel 30 + 10.
        Assert.Equal((2, 100.0, 40.0, 3.0), (b.Updates, b.ComputeMs, b.KernelMs, b.StateMs));
        Assert.Equal(0.4, b.Efficiency!.Value, 1e-12);
        Assert.Equal([("template", 33.0, 20L), ("fisher", 45.0, 6L)], b.Phases.Select(p => (p.Name, p.Milliseconds, p.Count)));
        Assert.Equal(b, report.Summary.Breakdown! with { Phases = b.Phases });
    }

    [Fact]
    public void Files_without_worker_breakdowns_have_none()
    {
        using var run = new TemporaryRunFolder();
        var report = CriticalPathAnalysis.Read(WriteFile(run, Lines));
        Assert.All(report.Iterations, i => Assert.Null(i.Breakdown));
        Assert.Null(report.Summary.Breakdown);
    }

    [Fact]
    public void The_summary_counts_critical_workers_and_averages_the_overhead()
    {
        using var run = new TemporaryRunFolder();
        var summary = CriticalPathAnalysis.Read(WriteFile(run, Lines)).Summary;

        Assert.Equal(2, summary.IterationCount);
        Assert.Equal(["galactic_binaries/b", "galactic_binaries/c", "noise"], summary.MostOftenCritical.Select(c => c.WorkerId));
        Assert.All(summary.MostOftenCritical, c => Assert.Equal(1, c.Stages));
        // Iteration 2: overhead 100 − 80 = 20 ms of 100 ms, compute 100 ms.
        Assert.Equal(150, summary.MeanIterationMs!.Value, 1e-9);
        Assert.Equal((65 + 20) / 2.0, summary.MeanOverheadMs!.Value, 1e-9);
        Assert.Equal(100 * (65.0 / 200 + 20.0 / 100) / 2, summary.MeanOverheadPercentOfIteration!.Value, 1e-9);
        Assert.Equal(100 * (65.0 / 230 + 20.0 / 100) / 2, summary.MeanOverheadPercentOfCompute!.Value, 1e-9);
    }

    [Fact]
    public void Only_the_last_iterations_are_analysed_when_asked()
    {
        using var run = new TemporaryRunFolder();
        var report = CriticalPathAnalysis.Read(WriteFile(run, Lines), lastIterations: 1);
        Assert.Equal(2, Assert.Single(report.Iterations).Iteration);
        Assert.Equal("galactic_binaries/c", Assert.Single(report.Summary.MostOftenCritical).WorkerId);
    }

    [Fact]
    public void A_malformed_line_is_reported_with_file_and_line_number()
    {
        using var run = new TemporaryRunFolder();
        string path = WriteFile(run, [Lines[0], Lines[1], "{\"kind\":\"span\", oops", Lines[2]]);
        var error = Assert.Throws<InvalidInputException>(() => CriticalPathAnalysis.Read(path));
        Assert.Equal(path, error.InputSource);
        Assert.Equal("line 3", error.Location);
    }

    [Fact]
    public void A_span_without_its_worker_id_is_reported_with_its_line()
    {
        using var run = new TemporaryRunFolder();
        string path = WriteFile(run, [Lines[0], Lines[1], Lines[2].Replace("globalfit.worker.id", "worker", StringComparison.Ordinal)]);
        var error = Assert.Throws<InvalidInputException>(() => CriticalPathAnalysis.Read(path));
        Assert.Equal("line 3", error.Location);
        Assert.Contains("globalfit.worker.id", error.Problem);
    }

    [Fact]
    public void A_last_line_cut_short_by_a_crash_is_ignored()
    {
        using var run = new TemporaryRunFolder();
        string path = WriteFile(run, [.. Lines, Lines[0][..40]], ending: "");
        Assert.Equal(2, CriticalPathAnalysis.Read(path).Iterations.Count);
    }

    [Fact]
    public void A_missing_telemetry_file_is_bad_input_naming_the_path()
    {
        using var run = new TemporaryRunFolder();
        string path = run.File(TelemetryJsonLines.FileName);
        var error = Assert.Throws<InvalidInputException>(() => CriticalPathAnalysis.Read(path));
        Assert.Equal(path, error.InputSource);
    }
}
