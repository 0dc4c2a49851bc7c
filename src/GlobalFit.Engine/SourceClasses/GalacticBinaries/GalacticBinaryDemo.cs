namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The galactic binaries of the built-in demo: an invented population over 1–8 mHz (a few loud enough to be
/// resolved over a weak crowd), fitted between 2 and 5 mHz.</summary>
internal sealed class GalacticBinaryDemo : IDemoPart
{
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
        # 900 steps: the one-month sky ridge needs them for split R-hat near 1 (measured: 300 left R-hat 1.1-2.1).
        steps_per_update = 900
        # The binaries come from the Galaxy: its sky is the prior that puts f0 where the Doppler ridge has the truth.
        sky_prior = "galaxy"
        temperatures = 4
        max_sources_per_window = 12
        # A coarser F-statistic map than the default: the map is rebuilt every update and dominates its cost.
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        """;
}
