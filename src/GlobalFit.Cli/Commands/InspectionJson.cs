using GlobalFit.Engine.Inspection;

namespace GlobalFit.Cli.Commands;

/// <summary>The JSON shape of <c>globalfit inspect --json</c> (snake_case keys, units in the names).</summary>
internal static class InspectionJson
{
    public static Dictionary<string, object?> From(ObservationInspection r, string? png)
    {
        var data = r.Observation.Data;
        return new Dictionary<string, object?>
        {
            ["file"] = r.Path,
            ["format_version"] = r.Observation.FormatVersion,
            ["generator"] = r.Observation.Provenance.Generator,
            ["provenance"] = r.Observation.Provenance.Entries,
            ["start_s"] = data.T0Seconds,
            ["cadence_s"] = data.DtSeconds,
            ["points_per_channel"] = data.Count,
            ["duration_s"] = data.Count * data.DtSeconds,
            ["gaps"] = r.Observation.Gaps.Select(g => new[] { g.StartSeconds, g.EndSeconds }).ToArray(),
            ["noise_model"] = r.ModelDescription,
            ["channels"] = r.Channels.Select(c => new Dictionary<string, object>
            {
                ["channel"] = c.Channel,
                ["rms"] = c.RmsValue,
                ["band_low_hz"] = c.BandLowHz,
                ["band_high_hz"] = c.BandHighHz,
                ["bins"] = c.BinsCompared,
                ["mean_estimate_over_model"] = c.MeanRatio,
                ["mean_ratio_standard_error"] = c.RatioStandardError,
                ["chi_square_per_bin"] = c.ChiSquarePerBin,
            }).ToArray(),
            ["cross_channels"] = r.CrossChannels.Select(x => new Dictionary<string, object>
            {
                ["pair"] = x.Pair,
                ["mean_coherence"] = x.MeanCoherence,
                ["expected_for_independent"] = x.ExpectedForIndependent,
            }).ToArray(),
            ["injected"] = r.Observation.Truth.Select(t => new Dictionary<string, object>
            {
                ["class"] = t.ClassId,
                ["count"] = t.RowCount,
                ["sources"] = Enumerable.Range(0, t.RowCount).Select(row =>
                {
                    var source = new Dictionary<string, object> { ["id"] = t.Ids[row] };
                    for (int c = 0; c < t.ColumnCount; c++) source[t.Columns[c]] = t[row, c];
                    return source;
                }).ToArray(),
            }).ToArray(),
            ["png"] = png,
        };
    }
}
