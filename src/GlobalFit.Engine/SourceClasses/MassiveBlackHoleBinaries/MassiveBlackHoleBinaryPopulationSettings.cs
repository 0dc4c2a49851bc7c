using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.Cosmology;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>An invented population of massive black-hole binaries (<c>[massive_black_hole_binaries.population]</c>).
/// Detector-frame chirp mass log-uniform, mass ratio, both aligned spins and redshift uniform in their ranges, merger
/// times uniform in a window; sky position isotropic, inclination isotropic (cos ι uniform), polarisation and phase
/// uniform. The luminosity distance follows from the redshift in <see cref="FlatLambdaCdm.Planck2018"/>. The shapes are
/// invented for testing, not a population model.</summary>
/// <param name="Count">Number of binaries.</param>
/// <param name="ChirpMassMinMsun">Lower end of the detector-frame chirp mass.</param>
/// <param name="ChirpMassMaxMsun">Upper end of the detector-frame chirp mass.</param>
/// <param name="MassRatioMin">Lower end of q = m1/m2 (at least 1).</param>
/// <param name="MassRatioMax">Upper end of q.</param>
/// <param name="SpinMin">Lower end of each aligned spin.</param>
/// <param name="SpinMax">Upper end of each aligned spin.</param>
/// <param name="RedshiftMin">Lower end of the redshift.</param>
/// <param name="RedshiftMax">Upper end of the redshift.</param>
/// <param name="MergerStartS">Earliest merger time t_c on the data's time axis.</param>
/// <param name="MergerEndS">Latest merger time t_c.</param>
public sealed record MassiveBlackHoleBinaryPopulationSettings(
    int Count, double ChirpMassMinMsun, double ChirpMassMaxMsun, double MassRatioMin, double MassRatioMax,
    double SpinMin, double SpinMax, double RedshiftMin, double RedshiftMax, double MergerStartS, double MergerEndS)
{
    /// <summary>Keys of the population table.</summary>
    public static readonly string[] Keys =
    [
        "count", "chirp_mass_min_msun", "chirp_mass_max_msun", "mass_ratio_min", "mass_ratio_max", "spin_min", "spin_max",
        "redshift_min", "redshift_max", "merger_start_s", "merger_end_s",
    ];

    /// <summary>Largest mass ratio accepted; IMRPhenomD was calibrated up to q = 18 (Khan et al. 2016, PRD 93, 044007),
    /// so 20 leaves a little room and no more.</summary>
    public const double MaximumMassRatio = 20;

    /// <summary>Reads and validates the table; merger times default to the whole observation.</summary>
    /// <param name="table">The <c>[massive_black_hole_binaries.population]</c> table.</param>
    /// <param name="observation">The record the binaries are injected into.</param>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown or a value is invalid; the message names it.</exception>
    public static MassiveBlackHoleBinaryPopulationSettings FromConfig(ConfigTable table, ObservationSettings observation)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(observation);
        int count = (int)table.GetInteger("count", 1, 0, 100_000);
        double mMin = table.GetPositive("chirp_mass_min_msun", 1e5);
        double mMax = table.GetPositive("chirp_mass_max_msun", 1e6);
        if (!(mMax >= mMin)) throw table.Invalid("chirp_mass_max_msun", $"must be at least chirp_mass_min_msun ({mMin}), got {mMax}");
        double qMin = table.GetInRange("mass_ratio_min", 1, 1, MaximumMassRatio);
        double qMax = table.GetInRange("mass_ratio_max", 5, 1, MaximumMassRatio);
        if (!(qMax >= qMin)) throw table.Invalid("mass_ratio_max", $"must be at least mass_ratio_min ({qMin}), got {qMax}");
        double sMin = table.GetInRange("spin_min", -0.9, -1, 1);
        double sMax = table.GetInRange("spin_max", 0.9, -1, 1);
        if (!(sMax >= sMin)) throw table.Invalid("spin_max", $"must be at least spin_min ({sMin}), got {sMax}");
        double zMin = table.GetInRange("redshift_min", 1, 1e-3, 20);
        double zMax = table.GetInRange("redshift_max", 5, 1e-3, 20);
        if (!(zMax >= zMin)) throw table.Invalid("redshift_max", $"must be at least redshift_min ({zMin}), got {zMax}");
        double start = table.GetDouble("merger_start_s", observation.StartS);
        if (!double.IsFinite(start)) throw table.Invalid("merger_start_s", $"must be finite, got {start}");
        double end = table.GetDouble("merger_end_s", observation.StartS + observation.SampleCount * observation.CadenceS);
        if (!double.IsFinite(end) || !(end >= start)) throw table.Invalid("merger_end_s", $"must be finite and at least merger_start_s ({start}), got {end}");
        table.RejectUnknownKeys(Keys);
        return new MassiveBlackHoleBinaryPopulationSettings(count, mMin, mMax, qMin, qMax, sMin, sMax, zMin, zMax, start, end);
    }

    /// <summary>The table as TOML lines with every value written out (no header).</summary>
    public string ToTomlBody() => $"""
        count = {Count}
        chirp_mass_min_msun = {TomlText.Number(ChirpMassMinMsun)}
        chirp_mass_max_msun = {TomlText.Number(ChirpMassMaxMsun)}
        mass_ratio_min = {TomlText.Number(MassRatioMin)}
        mass_ratio_max = {TomlText.Number(MassRatioMax)}
        spin_min = {TomlText.Number(SpinMin)}
        spin_max = {TomlText.Number(SpinMax)}
        redshift_min = {TomlText.Number(RedshiftMin)}
        redshift_max = {TomlText.Number(RedshiftMax)}
        merger_start_s = {TomlText.Number(MergerStartS)}
        merger_end_s = {TomlText.Number(MergerEndS)}

        """;
}
