using System.Globalization;
using System.Text.Json;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Telemetry;

/// <summary>Reads <c>telemetry.jsonl</c> and finds, per iteration and stage, the worker that finished last, how long the
/// others waited for it, and how much of the iteration was orchestration rather than compute.</summary>
/// <remarks>
/// <para>Stages are the <c>fit.stage</c> spans whose parent is a <c>fit.iteration</c> span, worker updates the
/// <c>fit.worker_update</c> spans whose parent is a stage span; spans are linked by ids, so a file holding several runs or
/// a resumed run (iteration numbers repeating) is read correctly. A worker finishes when its span ends (the reply).
/// Spans whose parent never ended (a run killed mid-iteration) are left out, as are metric lines and lines of kinds this
/// version does not know.</para>
/// <para>A last line without its line feed is the remains of a write cut short by a crash and is ignored; any other line
/// that is not a JSON object, or a span missing a field the analysis needs, is an error naming the file and line.</para>
/// </remarks>
public static class CriticalPathAnalysis
{
    /// <summary>Analyses <paramref name="telemetryPath"/>.</summary>
    /// <param name="telemetryPath">A <c>telemetry.jsonl</c> file.</param>
    /// <param name="lastIterations">Analyse only the last this many iterations (by start time); null for all.</param>
    /// <returns>The report; its summary covers the iterations analysed.</returns>
    /// <exception cref="InvalidInputException">The file is missing, unreadable or has a malformed line (named).</exception>
    public static CriticalPathReport Read(string telemetryPath, int? lastIterations = null)
    {
        ArgumentException.ThrowIfNullOrEmpty(telemetryPath);
        if (lastIterations is < 0) throw new ArgumentOutOfRangeException(nameof(lastIterations), lastIterations, "must not be negative");
        var iterations = Analyse(ReadSpans(telemetryPath), telemetryPath);
        if (lastIterations is int last && iterations.Count > last) iterations = iterations.Skip(iterations.Count - last).ToList();
        return new CriticalPathReport(telemetryPath, iterations, Summarise(iterations));
    }

    /// <summary>Figures over <paramref name="iterations"/>.</summary>
    /// <param name="iterations">Analysed iterations.</param>
    /// <returns>The summary.</returns>
    public static CriticalPathSummary Summarise(IReadOnlyList<IterationCriticalPath> iterations)
    {
        ArgumentNullException.ThrowIfNull(iterations);
        var critical = iterations.SelectMany(i => i.Stages).Where(s => s.CriticalWorkerId is not null)
            .GroupBy(s => s.CriticalWorkerId!, StringComparer.Ordinal)
            .Select(g => new CriticalWorkerCount(g.Key, g.Count(), g.Select(s => s.CriticalWorkerLabel).FirstOrDefault(l => l is not null)))
            .OrderByDescending(c => c.Stages).ThenBy(c => c.WorkerId, StringComparer.Ordinal).ToList();
        if (iterations.Count == 0) return new CriticalPathSummary(0, critical, null, null, null, null);
        var withCompute = iterations.Where(i => i.OverheadFractionOfCompute is not null).ToList();
        return new CriticalPathSummary(
            iterations.Count,
            critical,
            iterations.Average(i => i.DurationMs),
            iterations.Average(i => i.OverheadMs),
            100 * iterations.Average(i => i.DurationMs > 0 ? i.OverheadMs / i.DurationMs : 0),
            withCompute.Count == 0 ? null : 100 * withCompute.Average(i => i.OverheadFractionOfCompute!.Value),
            WorkerTimeBreakdown.Sum(iterations.Select(i => i.Breakdown)));
    }

    private static List<TelemetrySpan> ReadSpans(string path)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, null, e is FileNotFoundException or DirectoryNotFoundException ? "telemetry file does not exist" : $"cannot be read: {e.Message}", e);
        }
        var lines = text.Split('\n');
        var spans = new List<TelemetrySpan>();
        for (int i = 0; i < lines.Length; i++)
        {
            string line = lines[i].TrimEnd('\r');
            if (string.IsNullOrWhiteSpace(line)) continue;
            bool unterminated = i == lines.Length - 1;
            JsonDocument document;
            try
            {
                document = JsonDocument.Parse(line);
            }
            catch (JsonException e)
            {
                if (unterminated) break;
                throw new InvalidInputException(path, Line(i + 1), $"not a JSON object: {e.Message}", e);
            }
            using (document)
            {
                var root = document.RootElement;
                if (root.ValueKind != JsonValueKind.Object || !root.TryGetProperty("kind", out var kind) || kind.ValueKind != JsonValueKind.String)
                    throw new InvalidInputException(path, Line(i + 1), "expected a JSON object with a text field 'kind'");
                if (kind.GetString() == "span") spans.Add(TelemetrySpan.Parse(root, path, i + 1));
            }
        }
        return spans;
    }

    private static List<IterationCriticalPath> Analyse(List<TelemetrySpan> spans, string path)
    {
        var children = spans.Where(s => s.ParentSpanId is not null).ToLookup(s => (s.TraceId, s.ParentSpanId!));
        var iterations = new List<IterationCriticalPath>();
        foreach (var iteration in spans.Where(s => s.Name == FitTelemetry.IterationSpan).OrderBy(s => s.StartUtc).ThenBy(s => s.Line))
        {
            long number = iteration.RequireLong(FitTelemetry.IterationAttribute, path);
            // Without the thread count (older files) a stage's least time is its slowest worker alone.
            double threads = iteration.OptionalDouble(FitTelemetry.ThreadsAttribute) ?? double.PositiveInfinity;
            var stages = new List<StageCriticalPath>();
            var breakdowns = new List<WorkerTimeBreakdown?>();
            double compute = 0;
            foreach (var stage in children[(iteration.TraceId, iteration.SpanId)].Where(s => s.Name == FitTelemetry.StageSpan))
            {
                int index = checked((int)stage.RequireLong(FitTelemetry.StageIndexAttribute, path));
                var updates = children[(stage.TraceId, stage.SpanId)].Where(s => s.Name == FitTelemetry.WorkerUpdateSpan).ToList();
                breakdowns.AddRange(updates.Select(Breakdown));
                var workers = updates
                    .Select(w => (Id: w.RequireText(FitTelemetry.WorkerIdAttribute, path), End: w.EndUtc,
                                  WallMs: w.OptionalDouble(FitTelemetry.WorkerWallMsAttribute) ?? w.DurationMs,
                                  Label: w.OptionalText(FitTelemetry.WorkerLabelAttribute)))
                    .OrderByDescending(w => w.End).ThenBy(w => w.Id, StringComparer.Ordinal).ToList();
                stages.Add(Stage(index, workers, threads));
                compute += workers.Sum(w => w.WallMs);
            }
            stages.Sort((a, b) => a.StageIndex.CompareTo(b.StageIndex));
            double overhead = iteration.DurationMs - stages.Sum(s => s.LeastMs);
            iterations.Add(new IterationCriticalPath(number, iteration.TraceId, iteration.StartUtc, iteration.DurationMs, stages, compute, overhead,
                compute > 0 ? overhead / compute : null, WorkerTimeBreakdown.Sum(breakdowns)));
        }
        return iterations;
    }

    // A worker update's own breakdown: its globalfit.worker.phase.NAME_ms/_count pairs, kernel and state times; null for an
    // update that did not measure its parts (no kernel_ms attribute).
    private static WorkerTimeBreakdown? Breakdown(TelemetrySpan span)
    {
        if (span.OptionalDouble(FitTelemetry.WorkerKernelMsAttribute) is not double kernel) return null;
        var phases = new List<WorkerPhaseTotal>();
        foreach (var (name, _) in span.Attributes)
        {
            if (!name.StartsWith(FitTelemetry.WorkerPhaseAttributePrefix, StringComparison.Ordinal) || !name.EndsWith("_ms", StringComparison.Ordinal)) continue;
            string phase = name[FitTelemetry.WorkerPhaseAttributePrefix.Length..^3];
            double ms = span.OptionalDouble(name) ?? 0;
            double count = span.OptionalDouble(FitTelemetry.WorkerPhaseAttributePrefix + phase + "_count") ?? 0;
            phases.Add(new WorkerPhaseTotal(phase, ms, (long)count));
        }
        return new WorkerTimeBreakdown(1, span.OptionalDouble(FitTelemetry.WorkerWallMsAttribute) ?? span.DurationMs, kernel,
            span.OptionalDouble(FitTelemetry.WorkerStateMsAttribute) ?? 0, phases);
    }

    private static StageCriticalPath Stage(int index, List<(string Id, DateTimeOffset End, double WallMs, string? Label)> byFinishDescending, double threads)
    {
        if (byFinishDescending.Count == 0) return new StageCriticalPath(index, 0, null, 0, null, 0, null, 0, 0);
        double slowest = byFinishDescending.Max(w => w.WallMs);
        double least = Math.Max(slowest, byFinishDescending.Sum(w => w.WallMs) / threads);
        var last = byFinishDescending[0];
        double totalWait = byFinishDescending.Skip(1).Sum(w => (last.End - w.End).TotalMilliseconds);
        int others = byFinishDescending.Count - 1;
        return new StageCriticalPath(index, byFinishDescending.Count, last.Id, last.WallMs,
            others == 0 ? null : (last.End - byFinishDescending[1].End).TotalMilliseconds,
            totalWait, others == 0 ? null : totalWait / others, slowest, least, last.Label);
    }

    private static string Line(int number) => string.Create(CultureInfo.InvariantCulture, $"line {number}");
}
