using GlobalFit.Engine.Configuration;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>An invented population of extreme-mass-ratio inspirals (<c>[extreme_mass_ratio_inspirals.population]</c>):
/// how many, and the ranges their parameters are drawn from (see <see cref="ExtremeMassRatioInspiralPopulation"/> for
/// the distributions). The defaults are this program's own choices, not a published astrophysical model.</summary>
/// <param name="Count">Number of inspirals.</param>
/// <param name="CentralMassMinMsun">Lower end of the central mass M (log-uniform).</param>
/// <param name="CentralMassMaxMsun">Upper end of M.</param>
/// <param name="CompactMassMinMsun">Lower end of the compact mass μ (uniform).</param>
/// <param name="CompactMassMaxMsun">Upper end of μ; below <paramref name="CentralMassMinMsun"/>.</param>
/// <param name="SpinMin">Lower end of the spin χ (uniform).</param>
/// <param name="SpinMax">Upper end of χ, below 1.</param>
/// <param name="EccentricityMin">Lower end of e0 (uniform).</param>
/// <param name="EccentricityMax">Upper end of e0, below 1.</param>
/// <param name="PlungeTimeMinS">Earliest plunge, seconds after the start of the data (uniform); a plunge inside the
/// record ends the signal there.</param>
/// <param name="PlungeTimeMaxS">Latest plunge.</param>
/// <param name="DistanceMinMpc">Nearest luminosity distance (density ∝ D², uniform in Euclidean volume).</param>
/// <param name="DistanceMaxMpc">Farthest distance.</param>
public sealed record ExtremeMassRatioInspiralPopulationSettings(
    int Count,
    double CentralMassMinMsun, double CentralMassMaxMsun,
    double CompactMassMinMsun, double CompactMassMaxMsun,
    double SpinMin, double SpinMax,
    double EccentricityMin, double EccentricityMax,
    double PlungeTimeMinS, double PlungeTimeMaxS,
    double DistanceMinMpc, double DistanceMaxMpc)
{
    /// <summary>Keys of the population table.</summary>
    public static readonly string[] Keys =
    [
        "count", "central_mass_min_msun", "central_mass_max_msun", "compact_mass_min_msun", "compact_mass_max_msun",
        "spin_min", "spin_max", "eccentricity_min", "eccentricity_max", "plunge_time_min_s", "plunge_time_max_s",
        "distance_min_mpc", "distance_max_mpc",
    ];

    /// <summary>The defaults: 3 inspirals, M in [1e5, 1e7], μ in [5, 50], χ in [0, 0.95], e0 in [0, 0.4], plunge
    /// between half a year and four years, D in [500, 5000] Mpc.</summary>
    public static ExtremeMassRatioInspiralPopulationSettings Default { get; } =
        new(3, 1e5, 1e7, 5, 50, 0, 0.95, 0, 0.4, 1.6e7, 1.3e8, 500, 5000);

    /// <summary>Reads and validates the population table; errors name the key and its line.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown or a value out of range.</exception>
    public static ExtremeMassRatioInspiralPopulationSettings FromConfig(ConfigTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var d = Default;
        int count = (int)table.GetInteger("count", d.Count, 0, 10_000);
        double mMin = table.GetPositive("central_mass_min_msun", d.CentralMassMinMsun);
        double mMax = table.GetPositive("central_mass_max_msun", d.CentralMassMaxMsun);
        if (!(mMax >= mMin)) throw table.Invalid("central_mass_max_msun", $"must be at least central_mass_min_msun ({mMin}), got {mMax}");
        double muMin = table.GetPositive("compact_mass_min_msun", d.CompactMassMinMsun);
        double muMax = table.GetPositive("compact_mass_max_msun", d.CompactMassMaxMsun);
        if (!(muMax >= muMin)) throw table.Invalid("compact_mass_max_msun", $"must be at least compact_mass_min_msun ({muMin}), got {muMax}");
        if (!(muMax < mMin)) throw table.Invalid("compact_mass_max_msun", $"must stay below central_mass_min_msun ({mMin}), got {muMax}");
        double sMin = table.GetInRange("spin_min", d.SpinMin, 0, 0.999);
        double sMax = table.GetInRange("spin_max", d.SpinMax, 0, 0.999);
        if (!(sMax >= sMin)) throw table.Invalid("spin_max", $"must be at least spin_min ({sMin}), got {sMax}");
        double eMin = table.GetInRange("eccentricity_min", d.EccentricityMin, 0, 0.9);
        double eMax = table.GetInRange("eccentricity_max", d.EccentricityMax, 0, 0.9);
        if (!(eMax >= eMin)) throw table.Invalid("eccentricity_max", $"must be at least eccentricity_min ({eMin}), got {eMax}");
        double tMin = table.GetPositive("plunge_time_min_s", d.PlungeTimeMinS);
        double tMax = table.GetPositive("plunge_time_max_s", d.PlungeTimeMaxS);
        if (!(tMax >= tMin)) throw table.Invalid("plunge_time_max_s", $"must be at least plunge_time_min_s ({tMin}), got {tMax}");
        double dMin = table.GetPositive("distance_min_mpc", d.DistanceMinMpc);
        double dMax = table.GetPositive("distance_max_mpc", d.DistanceMaxMpc);
        if (!(dMax >= dMin)) throw table.Invalid("distance_max_mpc", $"must be at least distance_min_mpc ({dMin}), got {dMax}");
        table.RejectUnknownKeys(Keys);
        return new(count, mMin, mMax, muMin, muMax, sMin, sMax, eMin, eMax, tMin, tMax, dMin, dMax);
    }
}
