using GlobalFit.Engine.Configuration;
using GlobalFit.Physics.Constants;

namespace GlobalFit.Engine.Simulation;

/// <summary>A simulation scenario: what to observe and which noise to put in it. Read from a TOML file
/// by <see cref="FromConfig"/>, which validates every key.</summary>
/// <param name="Name">Free-form scenario name, written into the data file's provenance.</param>
/// <param name="Seed">Run seed; every random stream of the simulation derives from it.</param>
/// <param name="Observation">Duration, cadence and start time.</param>
/// <param name="Noise">Instrument noise levels and the optional confusion foreground.</param>
/// <param name="Sources">Injected sources, one entry per source class present in the file, in registration order.</param>
public sealed record SimulationScenario(string Name, ulong Seed, ObservationSettings Observation, NoiseSettings Noise, IReadOnlyList<ISourceInjection> Sources)
{
    /// <summary>Builds a scenario from a parsed configuration file, rejecting unknown keys and invalid values.</summary>
    /// <exception cref="Physics.Input.InvalidInputException">A key is unknown, missing, mistyped or out of range.</exception>
    public static SimulationScenario FromConfig(ConfigTable root)
    {
        string name = root.GetString("name", "unnamed scenario");
        long seed = root.GetInteger("seed", 1, 0, long.MaxValue);
        var observation = ObservationSettings.FromConfig(root.GetTable("observation") ?? throw root.InvalidTable("the [observation] table is required"));
        var noise = NoiseSettings.FromConfig(root.GetTable("noise"), root);
        var sources = new List<ISourceInjection>();
        foreach (var sourceClass in SimulatedSourceClasses.All)
            if (root.GetTable(sourceClass.ClassId) is { } section)
                sources.Add(sourceClass.ReadScenario(section, observation));
        root.RejectUnknownKeys(["name", "seed", "observation", "noise", .. SimulatedSourceClasses.All.Select(c => c.ClassId)]);
        return new SimulationScenario(name, (ulong)seed, observation, noise, sources);
    }

    /// <summary>The scenario as TOML with every default written out, for provenance and reruns.</summary>
    public string ToToml() =>
        $"""
        name = {TomlText.String(Name)}
        seed = {Seed}

        [observation]
        duration_s = {TomlText.Number(Observation.DurationS)}
        cadence_s = {TomlText.Number(Observation.CadenceS)}
        start_s = {TomlText.Number(Observation.StartS)}

        [noise]
        acceleration_asd = {TomlText.Number(Noise.AccelerationAsd)}
        oms_asd = {TomlText.Number(Noise.OmsAsd)}
        arm_length_m = {TomlText.Number(Noise.ArmLengthM)}

        [noise.foreground]
        enabled = {(Noise.ForegroundEnabled ? "true" : "false")}
        fit_years = {TomlText.Number(Noise.ForegroundFitYears)}
        amplitude = {TomlText.Number(Noise.ForegroundAmplitude)}

        """ + string.Concat(Sources.Select(s => "\n" + s.ToToml()));
}

/// <summary>The observation's time axis.</summary>
/// <param name="DurationS">Record length in seconds.</param>
/// <param name="CadenceS">Sampling interval in seconds.</param>
/// <param name="StartS">Time of the first sample in seconds.</param>
public sealed record ObservationSettings(double DurationS, double CadenceS, double StartS)
{
    /// <summary>Number of samples per channel, <c>floor(duration / cadence)</c>.</summary>
    public int SampleCount => (int)Math.Floor(DurationS / CadenceS);

    /// <summary>Reads <c>[observation]</c>: <c>duration_s</c> or <c>duration_days</c> (one of them), <c>cadence_s</c>, <c>start_s</c>.</summary>
    public static ObservationSettings FromConfig(ConfigTable table)
    {
        if (table.Has("duration_s") && table.Has("duration_days"))
            throw table.Invalid("duration_days", "give either duration_s or duration_days, not both");
        double duration = table.Has("duration_days")
            ? table.GetPositive("duration_days", 1) * 86_400.0
            : table.Has("duration_s") ? table.GetPositive("duration_s", 1)
            : throw table.InvalidTable("required key 'duration_s' (or 'duration_days') is missing");
        double cadence = table.GetPositive("cadence_s", 5.0);
        double start = table.GetDouble("start_s", 0.0);
        if (!double.IsFinite(start)) throw table.Invalid("start_s", "must be finite");
        double samples = Math.Floor(duration / cadence);
        if (samples < 16)
            throw table.Invalid("cadence_s", $"duration {duration} s at cadence {cadence} s gives {samples} samples; at least 16 are needed");
        if (samples > int.MaxValue / 4)
            throw table.Invalid("duration_s", $"duration {duration} s at cadence {cadence} s gives {samples:E3} samples per channel, more than this build handles ({int.MaxValue / 4})");
        if (duration > 20 * PhysicalConstants.JulianYearS)
            throw table.Invalid(table.Has("duration_days") ? "duration_days" : "duration_s", "durations beyond 20 years are outside the orbit model's intended range");
        table.RejectUnknownKeys(["duration_s", "duration_days", "cadence_s", "start_s"]);
        return new ObservationSettings(duration, cadence, start);
    }
}

/// <summary>Instrument noise levels and the optional galactic confusion foreground.</summary>
/// <param name="AccelerationAsd">Test-mass acceleration noise at its flat level, m s^-2 Hz^-1/2.</param>
/// <param name="OmsAsd">Optical-metrology displacement noise at its flat level, m Hz^-1/2.</param>
/// <param name="ArmLengthM">Arm length, m.</param>
/// <param name="ForegroundEnabled">Whether the confusion foreground is added.</param>
/// <param name="ForegroundFitYears">Observation time of the published foreground fit to use (0.5, 1, 2 or 4 yr).</param>
/// <param name="ForegroundAmplitude">Multiplier of the published foreground PSD (1 = as published).</param>
public sealed record NoiseSettings(double AccelerationAsd, double OmsAsd, double ArmLengthM, bool ForegroundEnabled, double ForegroundFitYears, double ForegroundAmplitude)
{
    /// <summary>Default levels: 3e-15 m s^-2 Hz^-1/2, 15e-12 m Hz^-1/2, 2.5e9 m arms (reference sheet §D.1), foreground on with the 1-yr fit.</summary>
    public static NoiseSettings Default { get; } = new(3e-15, 15e-12, 2.5e9, true, 1.0, 1.0);

    /// <summary>Reads <c>[noise]</c> and <c>[noise.foreground]</c>; a missing table means the defaults.</summary>
    public static NoiseSettings FromConfig(ConfigTable? table, ConfigTable root)
    {
        if (table is null) return Default;
        var d = Default;
        double acc = table.GetPositive("acceleration_asd", d.AccelerationAsd);
        double oms = table.GetPositive("oms_asd", d.OmsAsd);
        double arm = table.GetPositive("arm_length_m", d.ArmLengthM);
        bool enabled = d.ForegroundEnabled;
        double years = d.ForegroundFitYears, amplitude = d.ForegroundAmplitude;
        if (table.GetTable("foreground") is { } foreground)
        {
            enabled = foreground.GetBool("enabled", enabled);
            years = foreground.GetDouble("fit_years", years);
            if (Array.IndexOf(ForegroundFitYearsAllowed, years) < 0)
                throw foreground.Invalid("fit_years", $"the published foreground fit exists for 0.5, 1, 2 and 4 years only, got {years}");
            amplitude = foreground.GetNonNegative("amplitude", amplitude);
            foreground.RejectUnknownKeys(["enabled", "fit_years", "amplitude"]);
        }
        table.RejectUnknownKeys(["acceleration_asd", "oms_asd", "arm_length_m", "foreground"]);
        return new NoiseSettings(acc, oms, arm, enabled, years, amplitude);
    }

    /// <summary>Observation times (years) for which the foreground fit of Robson, Cornish &amp; Liu 2019 is tabulated.</summary>
    public static readonly double[] ForegroundFitYearsAllowed = [0.5, 1.0, 2.0, 4.0];
}
