using GlobalFit.Engine.Configuration;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Writes <see cref="GalacticBinaryBandSettings"/> back out under the keys <see cref="GalacticBinaryBandSettings.FromConfig"/>
/// reads, so <c>RUN/run.toml</c> records every value the run used.</summary>
public static class GalacticBinaryBandSettingsWriter
{
    /// <summary>Writes every key of <paramref name="settings"/>.</summary>
    /// <param name="settings">The settings.</param>
    /// <param name="writer">A writer positioned in the <c>[galactic_binaries]</c> section.</param>
    public static void Write(GalacticBinaryBandSettings settings, ResolvedConfigWriter writer)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(writer);
        writer.Key("f_min_hz", settings.MinFrequencyHz);
        writer.Key("f_max_hz", settings.MaxFrequencyHz);
        writer.Key("window_bins", settings.WindowBins);
        writer.Key("margin_bins", settings.MarginBins);
        writer.Key("max_sources_per_window", settings.MaxSourcesPerWindow);
        writer.Key("fdot_min_hz_s", settings.MinFrequencyDerivativeHzS);
        writer.Key("fdot_max_hz_s", settings.MaxFrequencyDerivativeHzS);
        writer.Key("steps_per_update", settings.StepsPerUpdate);
        writer.Key("temperatures", settings.TemperatureCount);
        writer.Key("chains_per_temperature", settings.ChainsPerTemperature);
        writer.Key("max_temperature", settings.MaxTemperature);
        writer.Key("jump_probability", settings.JumpProbability);
        writer.Key("split_merge_probability", settings.SplitMergeProbability);
        writer.Key("split_merge_bins", settings.SplitMergeBins);
        writer.Key("snr_prior_peak", settings.SnrPriorPeak);
        writer.Key("snr_max", settings.SnrMax);
        writer.Key("include_t", settings.IncludeT);
        writer.Key("fstat_cells_per_bin", settings.FStatisticCellsPerBin);
        writer.Key("fstat_latitude_cells", settings.FStatisticLatitudeCells);
        writer.Key("fstat_longitude_cells", settings.FStatisticLongitudeCells);
        writer.Key("fisher_refresh_steps", settings.FisherRefreshSteps);
        writer.Key("sample_interval", settings.SampleInterval);
        writer.Key("catalogue_min_snr", settings.CatalogueMinSnr);
        writer.Key("sky_prior", settings.SkyPrior);
    }
}
