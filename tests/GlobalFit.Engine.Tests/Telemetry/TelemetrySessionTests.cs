using System.Diagnostics;
using System.Text.Json;
using GlobalFit.Engine.Telemetry;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Telemetry;

// Listeners are process-wide: a session also exports spans that other tests start on the same source, so every
// assertion here looks only at this test's own trace.
public class TelemetrySessionTests
{
    [Fact]
    public void Spans_of_a_real_iteration_reach_the_file_and_the_analysis_finds_the_last_worker()
    {
        using var run = new TemporaryRunFolder();
        ActivityTraceId trace;
        using (var session = TelemetrySession.Start(run.Path, otlpEndpoint: null))
        {
            using (var iteration = FitTelemetry.StartIteration(7, threads: 64))
            {
                Assert.NotNull(iteration);
                trace = iteration.TraceId;
                using (var stage = FitTelemetry.StartStage(iteration.Context, 7, 0, ["galactic_binaries.even"]))
                {
                    Assert.NotNull(stage);
                    var quick = FitTelemetry.StartWorkerUpdate(stage.Context, 7, 0, "galactic_binaries/0000", "galactic_binaries", "1.000-1.010 mHz");
                    var slow = FitTelemetry.StartWorkerUpdate(stage.Context, 7, 0, "galactic_binaries/0002", "galactic_binaries", "1.020-1.030 mHz");
                    FitTelemetry.RecordWorkerResult(quick, "galactic_binaries/0000", 3, 100, 0.25, 1.0, 0.1);
                    quick!.Stop();
                    Thread.Sleep(5);   // the slow worker must end measurably later than the quick one
                    FitTelemetry.RecordWorkerResult(slow, "galactic_binaries/0002", 4, 100, 0.3, 2.0, 0.1);
                    slow!.Stop();
                }
                FitTelemetry.IterationDuration.Record(10);
            }
        }

        string path = run.File(TelemetryJsonLines.FileName);
        var ours = File.ReadAllLines(path).Select(l => JsonDocument.Parse(l).RootElement)
            .Where(e => e.GetProperty("kind").GetString() == "span" && e.GetProperty("trace_id").GetString() == trace.ToHexString()).ToList();
        Assert.Equal(4, ours.Count);
        var worker = ours.Single(e => e.GetProperty("span_id").GetString() is { } id && e.GetProperty("attributes").TryGetProperty("globalfit.worker.sources", out var s) && s.GetInt32() == 4);
        var attributes = worker.GetProperty("attributes");
        Assert.Equal("fit.worker_update", worker.GetProperty("name").GetString());
        Assert.Equal(2.0, attributes.GetProperty("globalfit.worker.wall_ms").GetDouble());
        Assert.Equal(7, attributes.GetProperty("globalfit.iteration").GetInt64());
        Assert.Equal("galactic_binaries", attributes.GetProperty("globalfit.worker.class").GetString());
        Assert.Equal(JsonValueKind.Null, ours.Single(e => e.GetProperty("name").GetString() == "fit.iteration").GetProperty("parent_span_id").ValueKind);
        Assert.Contains(File.ReadAllLines(path), l => l.Contains("\"kind\":\"metric\"", StringComparison.Ordinal) && l.Contains("globalfit.worker.compute", StringComparison.Ordinal));

        var analysed = CriticalPathAnalysis.Read(path).Iterations.Single(i => i.TraceId == trace.ToHexString());
        Assert.Equal(7, analysed.Iteration);
        var stageFigures = Assert.Single(analysed.Stages);
        Assert.Equal("galactic_binaries/0002", stageFigures.CriticalWorkerId);
        Assert.True(stageFigures.LeadMs >= 4, $"lead {stageFigures.LeadMs} ms after a 5 ms sleep");
        Assert.Equal(3.0, analysed.WorkerComputeMs);
    }

    [Fact]
    public void A_missing_run_folder_is_bad_input()
    {
        using var run = new TemporaryRunFolder();
        string missing = run.File("nowhere");
        var error = Assert.Throws<InvalidInputException>(() => TelemetrySession.Start(missing, null));
        Assert.Equal(missing, error.InputSource);
    }

    // Nothing listens on this port (the discard range of the dynamic ports is not reserved, but a refused connection is
    // the expected case); the session must still start, export to the file and shut down within its bounds.
    [Fact]
    public void An_unreachable_collector_does_not_stop_the_file_export()
    {
        using var run = new TemporaryRunFolder();
        ActivityTraceId trace;
        var clock = Stopwatch.StartNew();
        using (TelemetrySession.Start(run.Path, new Uri("http://127.0.0.1:9")))
        {
            using var iteration = FitTelemetry.StartIteration(1, threads: 64);
            trace = iteration!.TraceId;
        }
        Assert.True(clock.Elapsed < TimeSpan.FromMilliseconds(4 * TelemetrySession.ShutdownTimeoutMilliseconds), $"took {clock.Elapsed}");
        Assert.Contains(File.ReadAllLines(run.File(TelemetryJsonLines.FileName)), l => l.Contains(trace.ToHexString(), StringComparison.Ordinal));
    }
}
