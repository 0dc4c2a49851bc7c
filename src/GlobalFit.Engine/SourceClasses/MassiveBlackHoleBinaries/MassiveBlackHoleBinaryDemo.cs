using System.Globalization;
using GlobalFit.Engine.Evaluation;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary of the built-in demo: one invented binary (about 10⁶ M☉ detector-frame total mass at
/// 10⁵ Mpc, SNR about 150) merging on day 20 of the month, one worker to find and fit it, and the comparison of its row with
/// the truth.</summary>
/// <remarks>Its fit configuration runs the binary's stage before the galactic binaries' (see <see cref="FitToml"/>).</remarks>
internal sealed class MassiveBlackHoleBinaryDemo : IDemoPart
{
    /// <summary>Largest |median − truth| of t_c for a row to be the injected binary's: a day, far wider than the posterior
    /// (seconds at these SNRs) and far narrower than the month.</summary>
    private const double MatchToleranceS = 86_400;

    /// <summary>Optimal SNR from which a binary counts as detectable (common practice: 8 for a single-source detection).</summary>
    private const double DetectableSnr = 8.0;

    public string ScenarioToml => """
        [[massive_black_hole_binaries.binary]]
        id = "demo-merger"
        chirp_mass_msun = 4.0e5
        mass_ratio = 2.0
        spin1 = 0.4
        spin2 = -0.1
        tc_s = 1.728e6
        distance_mpc = 1.0e5
        beta_rad = 0.6
        lambda_rad = 2.2
        iota_rad = 1.1
        psi_rad = 0.8
        phi_ref_rad = 1.3
        """;

    // The schedule runs the binary's stage first. With the default order (galactic binaries first) the band workers of
    // the first iteration see the whole chirp and fit parts of it as binaries; the search then sees a residual with
    // those parts removed, and the joint fit stays in a worse mode (measured on the demo: ln L of the whole fit ~600
    // lower, chirp mass 8 % off). The demo has no other classes with groups, so the list is complete.
    public string FitToml => """
        [schedule]
        stages = [["massive_black_hole_binaries.01"], ["galactic_binaries.even"], ["galactic_binaries.odd"], ["noise"]]

        [massive_black_hole_binaries]
        count = 1
        f_min_hz = 1e-4
        f_max_hz = 0.02
        chirp_mass_min_msun = 1e5
        chirp_mass_max_msun = 2e6
        # The chains are cheap next to the search and the window templates: 1500 steps cost about 0.4 s per iteration.
        steps_per_update = 1500
        temperatures = 6
        # Half the default grid: the ascent after the grid finds the chirp mass anyway, and each search costs half as much.
        search_chirp_mass_step = 0.1
        """;

    public void Report(TextWriter output, IFitSourceClassPlan plan, double dfHz, IReadOnlyList<CatalogueRecord> sources, TruthTable? truth)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(sources);
        if (truth is null)
        {
            output.WriteLine($"demo: massive black-hole binaries: {sources.Count} catalogued; the data hold no truth table to compare with");
            return;
        }
        var settings = ((MassiveBlackHoleBinaryFitPlan)plan).Settings;
        var result = TruthComparison.Compare(sources, truth, MassiveBlackHoleBinaryParameters.CoalescenceTimeColumn, MatchToleranceS,
            settings.CoalescenceMinS, settings.CoalescenceMaxS, DetectableSnr);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"demo: massive black-hole binaries: {result.DetectableCount} injected with SNR >= {DetectableSnr}; found {result.Found.Length}, missed {result.Missed.Length}; {sources.Count} rows, {result.Spurious.Length} spurious"));
        foreach (var f in result.Found)
        {
            var row = sources.First(s => s.Id == f.EntryId);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {f.TruthId} -> {f.EntryId}: SNR injected {f.InjectedSnr:F1}, fitted {f.EntrySnr:F1}"));
            output.WriteLine("    parameter          truth          median         5%             95%            inside");
            int truthRow = truth.Ids.ToList().IndexOf(f.TruthId);
            for (int p = 0; p < row.ParameterNames.Length; p++)
            {
                double value = truth[truthRow, row.ParameterNames[p]];
                bool inside = value >= row.Lower[p] && value <= row.Upper[p];
                output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"    {row.ParameterNames[p],-18} {value,-14:G7} {row.Median[p],-14:G7} {row.Lower[p],-14:G7} {row.Upper[p],-14:G7} {(inside ? "yes" : "no")}"));
            }
        }
        foreach (var m in result.Missed)
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  missed {m.TruthId} merging at t = {m.Key:F0} s, SNR {m.InjectedSnr:F1}"));
        foreach (var s in result.Spurious)
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  spurious {s.Id}: t_c {s.Median[4]:F0} s, SNR {s.Snr:F1}"));
    }
}
