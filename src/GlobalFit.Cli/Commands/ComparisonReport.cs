using System.Collections.Immutable;
using System.Globalization;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary>Text and JSON forms of <see cref="ClassComparison"/> results.</summary>
internal static class ComparisonReport
{
    public static void Write(TextWriter o, ImmutableArray<ClassComparison> results)
    {
        if (results.IsEmpty) o.WriteLine("compare: the run fitted no class with sources to compare");
        foreach (var r in results)
        {
            o.WriteLine(I($"{r.ClassId}: {r.Detectable} injected with SNR >= {r.DetectableSnr:0.#}; found {r.FoundDetectable}, missed {r.Missed.Length}; {r.Catalogued} catalogued, {r.Spurious.Length} spurious ({r.NotCovered} injections outside the fit left out)"));
            o.WriteLine($"  matching: {r.Rule}");
            o.WriteLine("  injected SNR   injected  found  not found  spurious");
            foreach (var b in r.SnrBins)
            {
                string range = double.IsPositiveInfinity(b.High) ? I($">= {b.Low:0.#}") : I($"{b.Low:0.#}-{b.High:0.#}");
                o.WriteLine(I($"  {range,-12} {b.Injected,9} {b.Found,6} {b.NotFound,10} {b.Spurious,9}"));
            }
            o.WriteLine("  90 % interval coverage (fraction of found truths inside, ± binomial standard error):");
            o.WriteLine("    " + string.Join("  ", r.Coverage.Select(c => c.Count == 0 ? $"{c.Parameter} -" : I($"{c.Parameter} {c.Fraction:F2}±{c.StandardError:F2}"))));
            if (r.Found.Length > 0)
            {
                bool convergence = r.Found.Any(f => f.Convergence is not null);
                o.WriteLine("  found (median - truth in posterior sigma" + (convergence ? "; largest split R-hat, smallest bulk ESS and the sky mode holding most samples, with its fraction" : "") + "):");
                o.WriteLine("    truth          source     SNR inj  SNR fit  conf  overlap  " + string.Join(" ", r.ParameterColumns.Select(c => Short(c).PadLeft(7)))
                    + (convergence ? "   R-hat     ESS  sky mode" : ""));
                foreach (var f in r.Found)
                    o.WriteLine(I($"    {f.TruthId,-14} {f.SourceId,-10} {f.InjectedSnr,7:F1}  {f.SourceSnr,7:F1}  {f.Confidence,4:F2}  {f.Overlap,7:F2}  ")
                        + string.Join(" ", f.ErrorsInSigma.Select(e => SigmaText(e).PadLeft(7))) + ConvergenceText(f.Convergence));
            }
            foreach (var m in r.Missed)
                o.WriteLine(I($"  missed {m.TruthId}, SNR {m.InjectedSnr:F1}: ") + Parameters(r.ParameterColumns, m.Parameters));
            foreach (var s in r.Spurious)
                o.WriteLine(I($"  spurious {s.Id}, SNR {s.Snr:F1}, confidence {s.Confidence:F2}: ") + Parameters(r.ParameterColumns, [.. r.ParameterColumns.Select(c => s.Median[s.ParameterNames.IndexOf(c)])]));
        }
    }

    public static Dictionary<string, object?> Json(string run, string truth, ImmutableArray<ClassComparison> results) => new()
    {
        ["run"] = run,
        ["truth"] = Path.GetFullPath(truth),
        ["classes"] = results.Select(r => new Dictionary<string, object?>
        {
            ["class"] = r.ClassId,
            ["matching_rule"] = r.Rule,
            ["overlap_threshold"] = r.Threshold,
            ["detectable_snr"] = r.DetectableSnr,
            ["not_covered"] = r.NotCovered,
            ["detectable"] = r.Detectable,
            ["catalogued"] = r.Catalogued,
            ["found_detectable"] = r.FoundDetectable,
            ["missed_count"] = r.Missed.Length,
            ["spurious_count"] = r.Spurious.Length,
            ["snr_bins"] = r.SnrBins.Select(b => new Dictionary<string, object>
            {
                ["snr_min"] = b.Low, ["snr_max"] = b.High, ["injected"] = b.Injected, ["found"] = b.Found, ["not_found"] = b.NotFound, ["spurious"] = b.Spurious,
            }).ToList(),
            ["coverage"] = r.Coverage.Select(c => new Dictionary<string, object>
            {
                ["parameter"] = c.Parameter, ["inside"] = c.Inside, ["count"] = c.Count, ["fraction"] = c.Fraction, ["standard_error"] = c.StandardError,
            }).ToList(),
            ["found"] = r.Found.Select(f => new Dictionary<string, object?>
            {
                ["truth_id"] = f.TruthId, ["source_id"] = f.SourceId, ["injected_snr"] = f.InjectedSnr, ["source_snr"] = f.SourceSnr,
                ["confidence"] = f.Confidence, ["overlap"] = f.Overlap,
                ["errors_in_sigma"] = r.ParameterColumns.Select((c, i) => (c, i)).ToDictionary(x => x.c, x => f.ErrorsInSigma[x.i]),
                ["inside_interval"] = r.ParameterColumns.Select((c, i) => (c, i)).ToDictionary(x => x.c, x => f.InsideInterval[x.i]),
                ["convergence"] = f.Convergence is not { } report ? null : new Dictionary<string, object>
                {
                    ["max_split_rhat"] = report.MaxSplitRhat,
                    ["min_ess"] = report.MinEffectiveSampleSize,
                    ["sky_modes"] = report.ModeNames.Select((m, i) => (m, i)).ToDictionary(x => x.m, x => (object)report.ModeFractions[x.i]),
                },
            }).ToList(),
            ["missed"] = r.Missed.Select(m => new Dictionary<string, object>
            {
                ["truth_id"] = m.TruthId, ["injected_snr"] = m.InjectedSnr,
                ["parameters"] = r.ParameterColumns.Select((c, i) => (c, i)).ToDictionary(x => x.c, x => m.Parameters[x.i]),
            }).ToList(),
            ["spurious"] = r.Spurious.Select(s => new Dictionary<string, object>
            {
                ["source_id"] = s.Id, ["snr"] = s.Snr, ["confidence"] = s.Confidence,
                ["median"] = s.ParameterNames.Select((c, i) => (c, i)).ToDictionary(x => x.c, x => s.Median[x.i]),
            }).ToList(),
        }).ToList(),
    };

    // "   1.003    412  north_above 0.97": the worst R̂ and ESS over the parameters and the most populated sky mode.
    private static string ConvergenceText(GlobalFit.Engine.Fitting.SourceConvergence? c)
    {
        if (c is null) return "";
        string mode = c.ModeNames.IsEmpty ? "-" : c.ModeNames[c.ModeFractions.IndexOf(c.ModeFractions.Max())];
        string fraction = c.ModeNames.IsEmpty ? "" : I($" {c.ModeFractions.Max():F2}");
        return I($"  {c.MaxSplitRhat,6:F3} {c.MinEffectiveSampleSize,7:F0}  {mode}{fraction}");
    }

    // Errors in σ to one decimal; beyond ±9999.9 (an interval of almost no width) in exponent form, which keeps the column.
    internal static string SigmaText(double error) =>
        double.IsNaN(error) ? "-"
        : Math.Abs(error) >= 9999.95 ? (error > 0 ? "+" : "") + NumberText.Significant(error, 1)
        : (Math.Round(error, 1) == 0 ? 0.0 : error).ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture);

    private static string Parameters(ImmutableArray<string> columns, ImmutableArray<double> values) =>
        string.Join(", ", columns.Select((c, i) => $"{c} {NumberText.Significant(values[i], 4)}"));

    // Column headers short enough for a terminal: the name without its unit.
    private static string Short(string column)
    {
        int cut = column.IndexOf('_', StringComparison.Ordinal);
        return cut > 0 ? column[..cut] : column;
    }

    private static string I(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
