using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>An invented population of Galactic white-dwarf binaries: how many, their frequency and chirp-mass
/// distributions, and a simple exponential disc for their positions.</summary>
/// <param name="Count">Number of binaries.</param>
/// <param name="MinFrequencyHz">Lowest gravitational-wave frequency.</param>
/// <param name="MaxFrequencyHz">Highest gravitational-wave frequency.</param>
/// <param name="FrequencyPower">Exponent a of dN/df ∝ f^a; −11/3 is the steady state of binaries driven by
/// gravitational radiation alone (time spent per frequency interval ∝ 1/ḟ ∝ f^−11/3, Peters 1964).</param>
/// <param name="ChirpMassMeanMsun">Mean of the (truncated) normal chirp-mass distribution.</param>
/// <param name="ChirpMassSdMsun">Its standard deviation.</param>
/// <param name="ChirpMassMinMsun">Lower truncation.</param>
/// <param name="ChirpMassMaxMsun">Upper truncation.</param>
/// <param name="DiscScaleLengthKpc">Radial scale length of the exponential disc.</param>
/// <param name="DiscScaleHeightKpc">Vertical scale height of the exponential disc.</param>
/// <param name="SunRadiusKpc">Distance of the Sun from the Galactic centre.</param>
public sealed record GalacticPopulationSettings(
    int Count, double MinFrequencyHz, double MaxFrequencyHz, double FrequencyPower,
    double ChirpMassMeanMsun, double ChirpMassSdMsun, double ChirpMassMinMsun, double ChirpMassMaxMsun,
    double DiscScaleLengthKpc, double DiscScaleHeightKpc, double SunRadiusKpc)
{
    /// <summary>Keys of the <c>[galactic_binaries.population]</c> table.</summary>
    public static readonly string[] Keys =
    [
        "count", "f_min_hz", "f_max_hz", "frequency_power", "chirp_mass_mean_msun", "chirp_mass_sd_msun",
        "chirp_mass_min_msun", "chirp_mass_max_msun", "disc_scale_length_kpc", "disc_scale_height_kpc", "sun_radius_kpc",
    ];

    /// <summary>The model with every key at its default (count 1000, 0.5–5 mHz).</summary>
    public static GalacticPopulationSettings Defaults { get; } = new(1000, 5e-4, 5e-3, -11.0 / 3.0, 0.35, 0.1, 0.15, 1.0, 2.5, 0.3, 8.0);

    /// <summary>Reads and validates <c>[galactic_binaries.population]</c>.</summary>
    public static GalacticPopulationSettings FromConfig(ConfigTable table)
    {
        int count = (int)table.GetInteger("count", 1000, 0, 10_000_000);
        double fMin = table.GetPositive("f_min_hz", 5e-4);
        double fMax = table.GetPositive("f_max_hz", 5e-3);
        if (!(fMax > fMin)) throw table.Invalid("f_max_hz", $"must exceed f_min_hz ({fMin}), got {fMax}");
        double power = table.GetInRange("frequency_power", -11.0 / 3.0, -20, 20);
        double mean = table.GetPositive("chirp_mass_mean_msun", 0.35);
        double sd = table.GetPositive("chirp_mass_sd_msun", 0.1);
        double mMin = table.GetPositive("chirp_mass_min_msun", 0.15);
        double mMax = table.GetPositive("chirp_mass_max_msun", 1.0);
        if (!(mMax > mMin)) throw table.Invalid("chirp_mass_max_msun", $"must exceed chirp_mass_min_msun ({mMin}), got {mMax}");
        double length = table.GetPositive("disc_scale_length_kpc", 2.5);
        double height = table.GetPositive("disc_scale_height_kpc", 0.3);
        double sun = table.GetPositive("sun_radius_kpc", 8.0);
        table.RejectUnknownKeys(Keys);
        return new GalacticPopulationSettings(count, fMin, fMax, power, mean, sd, mMin, mMax, length, height, sun);
    }
}
