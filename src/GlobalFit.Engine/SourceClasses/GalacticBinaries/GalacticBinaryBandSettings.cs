using GlobalFit.Engine.Configuration;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>How the galactic-binary analysis splits its frequency range into windows and how each window's sampler
/// runs: the <c>[galactic_binaries]</c> table of a run configuration.</summary>
/// <remarks>Checks that need the data record (Nyquist, bin spacing, template length) are made by
/// <see cref="GalacticBinaryBandPlan.Create"/>; <see cref="FromConfig"/> runs them too and reports the offending key
/// with its file position. Every property's XML name in brackets is its configuration key.</remarks>
public sealed record GalacticBinaryBandSettings
{
    /// <summary>Configuration keys of the table.</summary>
    public static readonly string[] Keys =
    [
        "f_min_hz", "f_max_hz", "window_bins", "margin_bins", "max_sources_per_window", "fdot_min_hz_s", "fdot_max_hz_s",
        "steps_per_update", "temperatures", "chains_per_temperature", "max_temperature", "jump_probability",
        "snr_prior_peak", "snr_max", "include_t", "fstat_cells_per_bin", "fstat_latitude_cells", "fstat_longitude_cells",
        "fisher_refresh_steps", "sample_interval", "split_merge_probability", "split_merge_bins", "catalogue_min_snr", "sky_prior",
    ];

    /// <summary>Value of <c>sky_prior</c> for the isotropic sky.</summary>
    public const string IsotropicSky = "isotropic";

    /// <summary>Value of <c>sky_prior</c> for <see cref="GalacticSkyDensity"/> from the built-in population model's defaults.</summary>
    public const string GalaxySky = "galaxy";

    /// <summary>Lower edge of the analysed range [<c>f_min_hz</c>].</summary>
    /// <value>Hz.</value>
    public double MinFrequencyHz { get; init; } = 1e-3;

    /// <summary>Upper edge of the analysed range [<c>f_max_hz</c>].</summary>
    /// <value>Hz.</value>
    public double MaxFrequencyHz { get; init; } = 4e-3;

    /// <summary>Width of one window's core [<c>window_bins</c>]; the last window takes what is left.</summary>
    /// <value>Frequency bins of the record.</value>
    public int WindowBins { get; init; } = 256;

    /// <summary>Bins added on each side of a core so that the templates of its sources fit [<c>margin_bins</c>].</summary>
    public int MarginBins { get; init; } = 64;

    /// <summary>Cap on the number of sources one window's sampler holds [<c>max_sources_per_window</c>].</summary>
    public int MaxSourcesPerWindow { get; init; } = 20;

    /// <summary>Lower edge of the uniform ḟ prior [<c>fdot_min_hz_s</c>].</summary>
    /// <value>Hz/s.</value>
    public double MinFrequencyDerivativeHzS { get; init; } = -1e-16;

    /// <summary>Upper edge of the uniform ḟ prior [<c>fdot_max_hz_s</c>].</summary>
    /// <value>Hz/s.</value>
    public double MaxFrequencyDerivativeHzS { get; init; } = 1e-15;

    /// <summary>Sampler steps per worker update [<c>steps_per_update</c>].</summary>
    public int StepsPerUpdate { get; init; } = 1000;

    /// <summary>Rungs of the temperature ladder [<c>temperatures</c>].</summary>
    public int TemperatureCount { get; init; } = 4;

    /// <summary>Chains per rung [<c>chains_per_temperature</c>].</summary>
    public int ChainsPerTemperature { get; init; } = 1;

    /// <summary>Hottest temperature of the initial ladder [<c>max_temperature</c>].</summary>
    public double MaxTemperature { get; init; } = 100.0;

    /// <summary>Probability that a step is a birth or death [<c>jump_probability</c>].</summary>
    public double JumpProbability { get; init; } = 0.2;

    /// <summary>Probability that a step is a split or merge (<see cref="GalacticBinarySplitMerge"/>)
    /// [<c>split_merge_probability</c>]; with <see cref="JumpProbability"/> at most 1, 0 turns the moves off.</summary>
    public double SplitMergeProbability { get; init; } = 0.1;

    /// <summary>Largest frequency separation of a split pair [<c>split_merge_bins</c>].</summary>
    /// <value>Frequency bins of the record.</value>
    public double SplitMergeBins { get; init; } = 4.0;

    /// <summary>Catalogue sources whose median optimal SNR lies below this are left out [<c>catalogue_min_snr</c>].</summary>
    /// <remarks>Default 5, common practice rather than a derived value: below it the sampler's confident sources are
    /// mostly blends of several weak binaries or noise fluctuations that match no single source, so a catalogue is
    /// thresholded there (0 keeps everything).</remarks>
    public double CatalogueMinSnr { get; init; } = 5.0;

    /// <summary>The sky prior [<c>sky_prior</c>]: <see cref="IsotropicSky"/> (default) or <see cref="GalaxySky"/>, the sky of
    /// the catalogue-loud binaries of the built-in population model with its default disc and chirp masses
    /// (<see cref="GalacticSkyDensity"/>); choose it when the binaries come from the Galaxy, as in the demo.</summary>
    public string SkyPrior { get; init; } = IsotropicSky;

    /// <summary>ρ*, the SNR at which the amplitude prior peaks [<c>snr_prior_peak</c>].</summary>
    public double SnrPriorPeak { get; init; } = 10.0;

    /// <summary>Upper edge of the SNR prior's support [<c>snr_max</c>].</summary>
    public double SnrMax { get; init; } = 10_000.0;

    /// <summary>Whether channel T takes part in the likelihood [<c>include_t</c>].</summary>
    public bool IncludeT { get; init; }

    /// <summary>F-statistic birth map: frequency cells per bin [<c>fstat_cells_per_bin</c>].</summary>
    public int FStatisticCellsPerBin { get; init; } = 2;

    /// <summary>F-statistic birth map: equal-area cells in sin β [<c>fstat_latitude_cells</c>].</summary>
    public int FStatisticLatitudeCells { get; init; } = 6;

    /// <summary>F-statistic birth map: cells in λ [<c>fstat_longitude_cells</c>].</summary>
    public int FStatisticLongitudeCells { get; init; } = 12;

    /// <summary>Observations between Fisher-matrix refreshes of the Fisher proposal [<c>fisher_refresh_steps</c>].</summary>
    public int FisherRefreshSteps { get; init; } = 20;

    /// <summary>Steps between the cold-chain samples an update returns [<c>sample_interval</c>].</summary>
    public int SampleInterval { get; init; } = 10;

    /// <summary>Reads <c>[galactic_binaries]</c> and validates it against the data record of <paramref name="generator"/>.</summary>
    /// <param name="table">The table.</param>
    /// <param name="generator">Template generator of the data record (duration, cadence, envelope rule).</param>
    /// <returns>The settings and the band plan they give.</returns>
    /// <exception cref="Physics.Files.InvalidInputException">A key is malformed, out of range or inconsistent with the record;
    /// the message names the key and its position.</exception>
    public static (GalacticBinaryBandSettings Settings, GalacticBinaryBandPlan Plan) FromConfig(ConfigTable table, GalacticBinaryTemplateGenerator generator)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(generator);
        var defaults = new GalacticBinaryBandSettings();
        var settings = new GalacticBinaryBandSettings
        {
            MinFrequencyHz = table.GetPositive("f_min_hz", defaults.MinFrequencyHz),
            MaxFrequencyHz = table.GetPositive("f_max_hz", defaults.MaxFrequencyHz),
            WindowBins = (int)table.GetInteger("window_bins", defaults.WindowBins, 1, 1 << 24),
            MarginBins = (int)table.GetInteger("margin_bins", defaults.MarginBins, 0, 1 << 20),
            MaxSourcesPerWindow = (int)table.GetInteger("max_sources_per_window", defaults.MaxSourcesPerWindow, 1, 1000),
            MinFrequencyDerivativeHzS = table.GetInRange("fdot_min_hz_s", defaults.MinFrequencyDerivativeHzS, -1e-10, 1e-10),
            MaxFrequencyDerivativeHzS = table.GetInRange("fdot_max_hz_s", defaults.MaxFrequencyDerivativeHzS, -1e-10, 1e-10),
            StepsPerUpdate = (int)table.GetInteger("steps_per_update", defaults.StepsPerUpdate, 1, 100_000_000),
            TemperatureCount = (int)table.GetInteger("temperatures", defaults.TemperatureCount, 1, 64),
            ChainsPerTemperature = (int)table.GetInteger("chains_per_temperature", defaults.ChainsPerTemperature, 1, 64),
            MaxTemperature = table.GetInRange("max_temperature", defaults.MaxTemperature, 1.0, 1e12),
            JumpProbability = table.GetInRange("jump_probability", defaults.JumpProbability, 0.0, 1.0),
            SplitMergeProbability = table.GetInRange("split_merge_probability", defaults.SplitMergeProbability, 0.0, 1.0),
            SplitMergeBins = table.GetInRange("split_merge_bins", defaults.SplitMergeBins, 0.01, 1e6),
            SnrPriorPeak = table.GetPositive("snr_prior_peak", defaults.SnrPriorPeak),
            SnrMax = table.GetPositive("snr_max", defaults.SnrMax),
            IncludeT = table.GetBool("include_t", defaults.IncludeT),
            FStatisticCellsPerBin = (int)table.GetInteger("fstat_cells_per_bin", defaults.FStatisticCellsPerBin, 1, 64),
            FStatisticLatitudeCells = (int)table.GetInteger("fstat_latitude_cells", defaults.FStatisticLatitudeCells, 1, 1024),
            FStatisticLongitudeCells = (int)table.GetInteger("fstat_longitude_cells", defaults.FStatisticLongitudeCells, 1, 1024),
            FisherRefreshSteps = (int)table.GetInteger("fisher_refresh_steps", defaults.FisherRefreshSteps, 0, 1_000_000),
            SampleInterval = (int)table.GetInteger("sample_interval", defaults.SampleInterval, 1, 1_000_000),
            CatalogueMinSnr = table.GetNonNegative("catalogue_min_snr", defaults.CatalogueMinSnr),
            SkyPrior = table.GetChoice("sky_prior", defaults.SkyPrior, IsotropicSky, GalaxySky),
        };
        table.RejectUnknownKeys(Keys);
        try
        {
            return (settings, GalacticBinaryBandPlan.Create(settings, generator));
        }
        catch (ArgumentException problem) when (problem.ParamName is not null && Array.IndexOf(Keys, problem.ParamName) >= 0)
        {
            throw table.Invalid(problem.ParamName, FirstSentence(problem.Message));
        }
    }

    // ArgumentException appends " (Parameter 'x')" to its message; the configuration error names the key itself.
    private static string FirstSentence(string message)
    {
        int cut = message.IndexOf(" (Parameter '", StringComparison.Ordinal);
        return cut < 0 ? message : message[..cut];
    }
}
