using System.Globalization;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The galactic binaries of the built-in demo: an invented population over 1–8 mHz (a few loud enough to be
/// resolved over a weak crowd), fitted between 2 and 5 mHz, and the found / missed / spurious comparison.</summary>
internal sealed class GalacticBinaryDemo : IDemoPart
{
    /// <summary>Optimal SNR from which an injected binary counts as detectable (common practice: a threshold of 7 is
    /// the usual choice for resolvable galactic binaries).</summary>
    private const double DetectableSnr = 7.0;

    public string ScenarioToml => """
        [galactic_binaries.population]
        count = 4000
        f_min_hz = 1e-3
        f_max_hz = 8e-3
        """;

    public string FitToml => """
        [galactic_binaries]
        f_min_hz = 2e-3
        f_max_hz = 5e-3
        window_bins = 256
        margin_bins = 64
        steps_per_update = 300
        temperatures = 4
        max_sources_per_window = 12
        # A coarser F-statistic map than the default: the map is rebuilt every update and dominates its cost.
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        """;

    public void Report(TextWriter output, IFitSourceClassPlan plan, double dfHz, IReadOnlyList<CatalogueRecord> sources, TruthTable? truth)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(sources);
        if (truth is null)
        {
            output.WriteLine($"demo: galactic binaries: {sources.Count} catalogued; the data hold no truth table to compare with");
            return;
        }
        var band = plan.Groups.SelectMany(g => g.Workers).ToList();
        double low = band.Min(w => w.Bins.First) * dfHz, high = band.Max(w => w.Bins.End) * dfHz;
        // Four bins: over a month f0 and sky position are degenerate, and a source caught in a secondary sky mode has
        // its f0 moved by up to the orbital Doppler shift (v/c ≈ 1e-4, 1.3 bins at 5 mHz) on either side of the truth;
        // the f0 posterior itself is a small fraction of a bin wide. A source farther away is another signal.
        var result = TruthComparison.Compare(sources, truth, "f0_hz", 4 * dfHz, low, high, DetectableSnr);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"demo: galactic binaries {low * 1e3:F2}-{high * 1e3:F2} mHz: {result.DetectableCount} injected with SNR >= {DetectableSnr}; found {result.Found.Length}, missed {result.Missed.Length}; {sources.Count} catalogue entries, {result.Spurious.Length} spurious"));
        output.WriteLine("  found (median - truth in posterior sigma):");
        output.WriteLine("    truth          entry      SNR inj  SNR fit  conf    f0     fdot   amplitude    beta   lambda");
        foreach (var f in result.Found)
        {
            string E(string name) => f.ErrorsInSigma.TryGetValue(name, out double v) ? (Math.Round(v, 1) == 0 ? 0.0 : v).ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture).PadLeft(6) : "     -";
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"    {f.TruthId,-14} {f.EntryId,-10} {f.InjectedSnr,7:F1}  {f.EntrySnr,7:F1}  {f.Confidence,4:F2}  {E("f0_hz")} {E("fdot_hz_s")} {E("amplitude")} {E("beta_rad")} {E("lambda_rad")}"));
        }
        foreach (var m in result.Missed)
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  missed {m.TruthId} at {m.Key * 1e3:F5} mHz, SNR {m.InjectedSnr:F1}"));
        foreach (var s in result.Spurious)
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  spurious {s.Id} at {s.Median[s.ParameterNames.IndexOf("f0_hz")] * 1e3:F5} mHz, SNR {s.Snr:F1}, confidence {s.Confidence:F2}"));
    }
}
