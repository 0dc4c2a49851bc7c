using System.Globalization;
using GlobalFit.Engine.Configuration;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Files;

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
    /// <param name="root">The file's root table.</param>
    /// <param name="classes">The source classes whose sections the file may hold, by id, in injection order (the
    /// registry's <c>Simulated</c> list).</param>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown, missing, mistyped or out of range.</exception>
    public static SimulationScenario FromConfig(ConfigTable root, IReadOnlyList<KeyValuePair<string, ISimulatedSourceClass>> classes)
    {
        ArgumentNullException.ThrowIfNull(root);
        ArgumentNullException.ThrowIfNull(classes);
        string name = root.GetString("name", "unnamed scenario");
        long seed = root.GetInteger("seed", 1, 0, long.MaxValue);
        var observation = ObservationSettings.FromConfig(root.GetTable("observation") ?? throw root.InvalidTable("the [observation] table is required"));
        var noise = NoiseSettings.FromConfig(root.GetTable("noise"));
        var sources = new List<ISourceInjection>();
        foreach (var (id, simulation) in classes)
            if (root.GetTable(id) is { } section)
                sources.Add(simulation.ReadScenario(section, observation));
        root.RejectUnknownKeys(["name", "seed", "observation", "noise", .. classes.Select(c => c.Key)]);
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
        acceleration_asd = {TomlText.Number(Noise.Instrument.AccelerationAsd)}
        oms_asd = {TomlText.Number(Noise.Instrument.OmsAsd)}
        arm_length_m = {TomlText.Number(Noise.Instrument.ArmLengthM)}

        [noise.foreground]
        enabled = {(Noise.Foreground is null ? "false" : "true")}
        fit_years = {TomlText.Number(Noise.Foreground?.ObservationYears ?? 1.0)}
        amplitude = {TomlText.Number(Noise.Foreground?.AmplitudeScale ?? 1.0)}

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
        // Errors about the length name the key the user wrote.
        string durationKey = table.Has("duration_days") ? "duration_days" : "duration_s";
        double samples = Math.Floor(duration / cadence);
        if (samples < 16)
            throw table.Invalid("cadence_s", $"duration {duration} s at cadence {cadence} s gives {samples} points per channel; at least 16 are needed");
        if (samples > int.MaxValue / 4)
            throw table.Invalid(durationKey, $"duration {duration} s at cadence {cadence} s gives {NumberText.Significant(samples, 4)} points per channel, more than this build handles ({int.MaxValue / 4})");
        if (duration > 20 * PhysicalConstants.JulianYearS)
            throw table.Invalid(durationKey, "durations beyond 20 years are outside the orbit model's intended range");
        double needed = SimulationMemory.EstimatedBytes(samples);
        if (needed > SimulationMemory.AvailableBytes)
            throw table.Invalid(durationKey, string.Create(CultureInfo.InvariantCulture,
                $"{NumberText.Significant(samples, 4)} points per channel need about {needed / (1 << 30):F1} GiB to simulate, more than the {SimulationMemory.AvailableBytes / (double)(1 << 30):F1} GiB available; shorten the record or raise cadence_s"));
        table.RejectUnknownKeys(["duration_s", "duration_days", "cadence_s", "start_s"]);
        return new ObservationSettings(duration, cadence, start);
    }
}

/// <summary>Instrument noise levels and the optional Galactic confusion foreground of a scenario.</summary>
/// <param name="Instrument">Acceleration and optical-metrology levels and the arm length.</param>
/// <param name="Foreground">The confusion foreground (published fit and amplitude), or null for none.</param>
public sealed record NoiseSettings(InstrumentNoiseSettings Instrument, GalacticConfusionSettings? Foreground)
{
    /// <summary>Default levels (<see cref="InstrumentNoiseSettings.Default"/>, the allocation used by Robson, Cornish
    /// &amp; Liu 2019) with the foreground fitted for one year.</summary>
    public static NoiseSettings Default { get; } = new(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));

    /// <summary>The A/E/T noise model these settings describe.</summary>
    public AetNoiseModel Model() => new(Instrument, Foreground);

    /// <summary>Reads <c>[noise]</c> and <c>[noise.foreground]</c>; a missing table means the defaults.</summary>
    public static NoiseSettings FromConfig(ConfigTable? table)
    {
        if (table is null) return Default;
        var d = InstrumentNoiseSettings.Default;
        double acc = table.GetPositive("acceleration_asd", d.AccelerationAsd);
        double oms = table.GetPositive("oms_asd", d.OmsAsd);
        double arm = table.GetPositive("arm_length_m", d.ArmLengthM);
        var foreground = Default.Foreground;
        if (table.GetTable("foreground") is { } f)
        {
            bool enabled = f.GetBool("enabled", true);
            double years = f.GetDouble("fit_years", 1.0);
            if (!GalacticConfusionSettings.SupportedObservationYears.Contains(years))
                throw f.Invalid("fit_years", $"the published foreground fit exists for 0.5, 1, 2 and 4 years only, got {years}");
            double amplitude = f.GetNonNegative("amplitude", 1.0);
            f.RejectUnknownKeys(["enabled", "fit_years", "amplitude"]);
            foreground = enabled && amplitude > 0 ? new GalacticConfusionSettings(years, amplitude) : null;
        }
        table.RejectUnknownKeys(["acceleration_asd", "oms_asd", "arm_length_m", "foreground"]);
        return new NoiseSettings(new InstrumentNoiseSettings(acc, oms, arm), foreground);
    }
}
