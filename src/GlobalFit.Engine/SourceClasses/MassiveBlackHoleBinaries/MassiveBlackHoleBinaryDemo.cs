namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary of the built-in demo: one invented binary (about 10⁶ M☉ detector-frame total mass at
/// 10⁵ Mpc, SNR about 130) merging on day 20 of the month, and one worker to find and fit it; <c>globalfit compare</c> reports
/// it against the truth with <see cref="MassiveBlackHoleBinaryMatcher"/>.</summary>
internal sealed class MassiveBlackHoleBinaryDemo : IDemoPart
{
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

    public string FitToml => """
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
}
