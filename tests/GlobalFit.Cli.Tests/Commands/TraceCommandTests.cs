using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary><c>trace RUN</c> on a hand-written telemetry file (the analysis itself is tested in
/// GlobalFit.Engine.Tests/Telemetry).</summary>
public class TraceCommandTests
{
    private static string Span(string name, string trace, string id, string? parent, string start, double durationMs, string attributes) =>
        "{\"kind\":\"span\",\"name\":\"" + name + "\",\"trace_id\":\"" + trace + "\",\"span_id\":\"" + id + "\",\"parent_span_id\":"
        + (parent is null ? "null" : "\"" + parent + "\"") + ",\"start_utc\":\"2026-12-01T10:00:" + start + "Z\",\"duration_ms\":" + durationMs
        + ",\"status\":\"unset\",\"attributes\":{" + attributes + "}}";

    private static string Worker(string trace, string id, string stage, string worker, string start, double duration, double wall) =>
        Span("fit.worker_update", trace, id, stage, start, duration, $"\"globalfit.worker.id\":\"{worker}\",\"globalfit.worker.wall_ms\":{wall}"
            + (Labels.TryGetValue(worker, out var label) ? $",\"globalfit.worker.label\":\"{label}\"" : ""));

    // The labels the fit writes: each band's core frequency range; the noise worker's label is left out, as in files
    // written before labels existed.
    private static readonly Dictionary<string, string> Labels = new()
    {
        ["galactic_binaries/0000"] = "2.9700-2.9900 mHz",
        ["galactic_binaries/0001"] = "2.9900-3.0100 mHz",
    };

    // Iteration 1: bands 0000 and 0001 end at 0.4 s and 1.0 s, then the noise worker alone. Iteration 2: band 0000 last.
    private static readonly string[] Lines =
    [
        Span("fit.iteration", "t1", "i1", null, "00.000", 1500, "\"globalfit.iteration\":1"),
        Span("fit.stage", "t1", "s0", "i1", "00.000", 1000, "\"globalfit.stage.index\":0"),
        Worker("t1", "w1", "s0", "galactic_binaries/0000", "00.000", 400, 380),
        Worker("t1", "w2", "s0", "galactic_binaries/0001", "00.000", 1000, 950),
        Span("fit.stage", "t1", "s1", "i1", "01.000", 400, "\"globalfit.stage.index\":1"),
        Worker("t1", "w3", "s1", "noise", "01.000", 400, 390),
        Span("fit.iteration", "t2", "i2", null, "02.000", 800, "\"globalfit.iteration\":2"),
        Span("fit.stage", "t2", "s0", "i2", "02.000", 700, "\"globalfit.stage.index\":0"),
        Worker("t2", "w1", "s0", "galactic_binaries/0000", "02.000", 700, 690),
        Worker("t2", "w2", "s0", "galactic_binaries/0001", "02.000", 300, 290),
    ];

    private static TempFolder RunWith(params string[] lines)
    {
        var run = new TempFolder();
        run.Write("telemetry.jsonl", string.Join('\n', lines) + "\n");
        return run;
    }

    // A band update that measured its parts: 200 ms compute of which 50 ms kernel (template 40 + likelihood 10).
    private static readonly string[] MeasuredLines =
    [
        Span("fit.iteration", "t1", "i1", null, "00.000", 300, "\"globalfit.iteration\":1"),
        Span("fit.stage", "t1", "s0", "i1", "00.000", 250, "\"globalfit.stage.index\":0"),
        Span("fit.worker_update", "t1", "w1", "s0", "00.000", 210, "\"globalfit.worker.id\":\"galactic_binaries/0000\",\"globalfit.worker.wall_ms\":200,"
            + "\"globalfit.worker.kernel_ms\":50,\"globalfit.worker.state_ms\":4,\"globalfit.worker.phase.template_ms\":40,\"globalfit.worker.phase.template_count\":1000,"
            + "\"globalfit.worker.phase.likelihood_ms\":10,\"globalfit.worker.phase.likelihood_count\":1000,\"globalfit.worker.phase.fisher_ms\":120,\"globalfit.worker.phase.fisher_count\":30"),
    ];

    [Fact]
    public void Text_and_json_show_where_the_measured_worker_time_went_and_the_kernel_efficiency()
    {
        using var run = RunWith(MeasuredLines);
        var text = CliRun.Run("trace", run.Path);
        Assert.Equal(0, text.ExitCode);
        Assert.Contains("kernel      50.0 ms of 200.0 ms compute in 1 measured update(s): efficiency 25.0 %", text.Out);
        Assert.Contains("worker time   1 measured update(s), 200.0 ms compute; kernel (template + likelihood) 50.0 ms = efficiency 25.0 %", text.Out);
        // Largest part first, with its share of compute and its time per run: 120 ms / 30 = 4000 µs.
        Assert.Matches(@"fisher\s+120\.0 ms\s+60\.0 %, 30 × 4000\.00 µs", text.Out);
        Assert.Matches(@"state_serialisation\s+4\.0 ms\s+2\.0 %", text.Out);

        var json = CliRun.Run("trace", run.Path, "--json");
        using var document = JsonDocument.Parse(json.Out);
        var time = document.RootElement.GetProperty("summary").GetProperty("worker_time");
        Assert.Equal(0.25, time.GetProperty("efficiency").GetDouble(), 12);
        Assert.Equal(4, time.GetProperty("state_serialisation_ms").GetDouble());
        var fisher = time.GetProperty("phases").EnumerateArray().Single(p => p.GetProperty("phase").GetString() == "fisher");
        Assert.Equal((120.0, 30L), (fisher.GetProperty("ms").GetDouble(), fisher.GetProperty("count").GetInt64()));
        Assert.Equal(JsonValueKind.Object, document.RootElement.GetProperty("iterations")[0].GetProperty("worker_time").ValueKind);
    }

    [Fact]
    public void Text_output_names_the_last_worker_of_each_stage_its_lead_and_the_wait_of_the_others()
    {
        using var run = RunWith(Lines);
        var result = CliRun.Run("trace", run.Path);

        Assert.Equal(0, result.ExitCode);
        Assert.Contains("iteration 1   1500.0 ms, orchestration overhead 160.0 ms", result.Out);   // 1500 − (950 + 390)
        // Stages count from 1 like iterations; a band's id comes with its frequency range.
        Assert.Contains("stage 1   last: galactic_binaries/0001 [2.9900-3.0100 mHz] (compute 950.0 ms), 600.0 ms after the other, which waited 600.0 ms", result.Out);
        Assert.Contains("stage 2   last: noise (compute 390.0 ms), the only worker", result.Out);
        Assert.DoesNotContain("stage 0", result.Out);
        Assert.Contains("summary       2 iterations", result.Out);
        Assert.Contains("galactic_binaries/0000 [2.9700-2.9900 mHz]", result.Out.Split("summary")[1]);
        Assert.Equal("", result.Error);
    }

    [Fact]
    public void Json_output_carries_every_iteration_and_the_summary()
    {
        using var run = RunWith(Lines);
        var result = CliRun.Run("trace", run.Path, "--json", "--last", "1");

        Assert.Equal(0, result.ExitCode);
        using var json = JsonDocument.Parse(result.Out);
        var iteration = Assert.Single(json.RootElement.GetProperty("iterations").EnumerateArray());
        Assert.Equal(2, iteration.GetProperty("iteration").GetInt64());
        Assert.Equal("2026-12-01T10:00:02Z", iteration.GetProperty("start_utc").GetString()); // UTC with Z, as everywhere
        var stage = iteration.GetProperty("stages")[0];
        Assert.Equal(1, stage.GetProperty("stage").GetInt32());
        Assert.Equal("galactic_binaries/0000", stage.GetProperty("last_worker").GetString());
        Assert.Equal("2.9700-2.9900 mHz", stage.GetProperty("last_worker_label").GetString());
        Assert.Equal(400, stage.GetProperty("lead_ms").GetDouble(), 1e-9);
        Assert.Equal(1, json.RootElement.GetProperty("summary").GetProperty("iterations").GetInt32());
    }

    [Fact]
    public void A_missing_run_folder_exits_2_naming_it()
    {
        using var folder = new TempFolder();
        string missing = folder.File("no-such-run");
        var result = CliRun.Run("trace", missing);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains(missing, result.Error);
    }

    [Fact]
    public void A_run_without_telemetry_exits_2_naming_the_file()
    {
        using var run = new TempFolder();
        var result = CliRun.Run("trace", run.Path);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains(Path.Combine(run.Path, "telemetry.jsonl"), result.Error);
    }

    [Fact]
    public void A_malformed_telemetry_line_exits_2_naming_file_and_line()
    {
        using var run = RunWith(Lines[0], "not json", Lines[1]);
        var result = CliRun.Run("trace", run.Path);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("telemetry.jsonl: line 2", result.Error);
    }

    [Fact]
    public void A_last_count_below_one_is_refused()
    {
        using var run = RunWith(Lines);
        var result = CliRun.Run("trace", run.Path, "--last", "0");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--last", result.Error);
    }
}
