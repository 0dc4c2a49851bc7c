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
        # 600 steps on 8 rungs up to temperature 10: with 4 rungs up to 100 no swap between neighbouring rungs was accepted
        # (rates 0.00-0.01 in a window of five SNR 8-20 binaries), so the hot chains never reached the cold one; 8 rungs
        # up to 10 swap at 0.30-0.45.
        steps_per_update = 600
        # The binaries come from the Galaxy: its sky is the prior that puts f0 where the Doppler ridge has the truth.
        sky_prior = "galaxy"
        temperatures = 8
        max_temperature = 10
        max_sources_per_window = 12
        # A coarser F-statistic map than the default: the map is rebuilt every update and dominates its cost.
        fstat_cells_per_bin = 1
        fstat_latitude_cells = 4
        fstat_longitude_cells = 8
        """;
}
