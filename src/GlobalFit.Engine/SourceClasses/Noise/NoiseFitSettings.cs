using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>How the noise worker models and fits the noise: the <c>[noise]</c> table of a run configuration. Every
/// property's configuration key is given in brackets.</summary>
/// <remarks>
/// <para>The fitted levels are ASD multipliers relative to the starting values <see cref="AccelerationAsd"/> and
/// <see cref="OmsAsd"/> inside the sampler; samples report them back as ASDs. Their prior is uniform on
/// [<see cref="LevelPriorMin"/>, <see cref="LevelPriorMax"/>] times the starting value; the foreground amplitude's
/// prior is uniform on [0, <see cref="ForegroundAmplitudeMax"/>].</para>
/// <para>Instrument details not listed here (arm length, TDI generation) are the defaults of
/// <see cref="InstrumentNoiseSettings"/>.</para>
/// </remarks>
public sealed record NoiseFitSettings
{
    /// <summary>Configuration keys of the table (<c>foreground</c> is the <c>[noise.foreground]</c> sub-table).</summary>
    public static readonly string[] Keys =
    [
        "fit_levels", "foreground", "acceleration_asd", "oms_asd",
        "f_min_hz", "f_max_hz", "include_t", "steps_per_update", "temperatures", "max_temperature", "sample_interval",
        "level_prior_min", "level_prior_max",
    ];

    /// <summary>Keys of <c>[noise.foreground]</c>: the names a scenario uses for the same quantities, plus the prior's edge.</summary>
    public static readonly string[] ForegroundKeys = ["enabled", "fit_years", "amplitude", "amplitude_max"];

    /// <summary>Upper edge of the default analysed range when the record's Nyquist frequency allows it.</summary>
    public const double DefaultMaxFrequencyHz = 0.03;

    /// <summary>Whether the levels are sampled [<c>fit_levels</c>]; when false they stay at the starting values.</summary>
    public bool FitLevels { get; init; } = true;

    /// <summary>Whether the model includes the Galactic confusion foreground in A and E [<c>foreground.enabled</c>].</summary>
    public bool Foreground { get; init; } = true;

    /// <summary>Which tabulated foreground shape to use [<c>foreground.fit_years</c>].</summary>
    /// <value>Years: 0.5, 1, 2 or 4; the default is the one of the scenario the observation file records it was simulated
    /// with, else the value nearest the record's duration (<see cref="ForegroundFitYearsOrigin"/> says which).</value>
    public double ForegroundFitYears { get; init; } = 1.0;

    /// <summary>Where <see cref="ForegroundFitYears"/> came from, in words, for <c>fit</c> and <c>inspect</c> to say.</summary>
    public string ForegroundFitYearsOrigin { get; init; } = "set in the run configuration";

    /// <summary>Starting (or fixed) test-mass acceleration ASD of both channel groups [<c>acceleration_asd</c>].</summary>
    /// <value>m s⁻² Hz^-1/2.</value>
    public double AccelerationAsd { get; init; } = InstrumentNoiseSettings.DefaultAccelerationAsd;

    /// <summary>Starting (or fixed) optical-metrology ASD of both channel groups [<c>oms_asd</c>].</summary>
    /// <value>m Hz^-1/2.</value>
    public double OmsAsd { get; init; } = InstrumentNoiseSettings.DefaultOmsAsd;

    /// <summary>Starting (or fixed) foreground amplitude, a multiplier of the published fit's PSD
    /// [<c>foreground.amplitude</c>].</summary>
    public double ForegroundAmplitude { get; init; } = 1.0;

    /// <summary>Lower edge of the fitted range [<c>f_min_hz</c>].</summary>
    /// <value>Hz.</value>
    public double MinFrequencyHz { get; init; } = 1e-4;

    /// <summary>Upper edge of the fitted range [<c>f_max_hz</c>].</summary>
    /// <value>Hz; the default is the lower of 0.9 × Nyquist and <see cref="DefaultMaxFrequencyHz"/>.</value>
    public double MaxFrequencyHz { get; init; } = DefaultMaxFrequencyHz;

    /// <summary>Whether channel T is fitted, with its own levels [<c>include_t</c>].</summary>
    public bool IncludeT { get; init; } = true;

    /// <summary>Sampler steps per update [<c>steps_per_update</c>].</summary>
    public int StepsPerUpdate { get; init; } = 50;

    /// <summary>Rungs of the temperature ladder [<c>temperatures</c>]; the noise posterior is unimodal, so one suffices.</summary>
    public int TemperatureCount { get; init; } = 1;

    /// <summary>Hottest temperature of the ladder when there is more than one rung [<c>max_temperature</c>].</summary>
    public double MaxTemperature { get; init; } = 10.0;

    /// <summary>Sampler steps between the cold-chain samples an update returns, counted over the worker's life
    /// [<c>sample_interval</c>].</summary>
    public int SampleInterval { get; init; } = 5;

    /// <summary>Lower edge of each level's uniform prior, as a multiple of its starting ASD [<c>level_prior_min</c>].</summary>
    public double LevelPriorMin { get; init; } = 0.1;

    /// <summary>Upper edge of each level's uniform prior, as a multiple of its starting ASD [<c>level_prior_max</c>].</summary>
    public double LevelPriorMax { get; init; } = 10.0;

    /// <summary>Upper edge of the foreground amplitude's uniform prior on [0, max] [<c>foreground.amplitude_max</c>].</summary>
    public double ForegroundAmplitudeMax { get; init; } = 10.0;

    /// <summary>The π f* frequency where the A/E/T transfer functions first vanish; the fit must stay below it.</summary>
    /// <value>Hz (≈ 0.05996 for the default arm).</value>
    public static double FirstTransferNullHz => Math.PI * InstrumentNoiseSettings.Default.TransferFrequencyHz;

    /// <summary>Reads <c>[noise]</c> and checks it against the data record.</summary>
    /// <param name="table">The table.</param>
    /// <param name="shape">The data record.</param>
    /// <returns>The settings, defaults filled in.</returns>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown, malformed, out of range or
    /// inconsistent with the record; the message names the key.</exception>
    public static NoiseFitSettings FromConfig(ConfigTable table, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(shape);
        var defaults = new NoiseFitSettings();
        double defaultMax = Math.Min(0.9 * shape.NyquistHz, DefaultMaxFrequencyHz);
        var foreground = table.GetTable("foreground") ?? ConfigDocument.Parse("[foreground]\n", table.SourceName).GetTable("foreground")!;
        var (defaultYears, origin) = shape.ScenarioForegroundFitYears is { } recorded
            ? (recorded, "from the scenario recorded in the observation file")
            : (NearestFitYears(shape.DurationS), "nearest the record's length (the observation file records no scenario with a foreground)");
        if (foreground.Has("fit_years")) origin = "set in the run configuration";
        var settings = new NoiseFitSettings
        {
            FitLevels = table.GetBool("fit_levels", defaults.FitLevels),
            Foreground = foreground.GetBool("enabled", defaults.Foreground),
            ForegroundFitYears = foreground.GetDouble("fit_years", defaultYears),
            ForegroundFitYearsOrigin = origin,
            AccelerationAsd = table.GetPositive("acceleration_asd", defaults.AccelerationAsd),
            OmsAsd = table.GetPositive("oms_asd", defaults.OmsAsd),
            ForegroundAmplitude = foreground.GetNonNegative("amplitude", defaults.ForegroundAmplitude),
            MinFrequencyHz = table.GetPositive("f_min_hz", defaults.MinFrequencyHz),
            MaxFrequencyHz = table.GetPositive("f_max_hz", defaultMax),
            IncludeT = table.GetBool("include_t", defaults.IncludeT),
            StepsPerUpdate = (int)table.GetInteger("steps_per_update", defaults.StepsPerUpdate, 1, 100_000_000),
            TemperatureCount = (int)table.GetInteger("temperatures", defaults.TemperatureCount, 1, 64),
            MaxTemperature = table.GetInRange("max_temperature", defaults.MaxTemperature, 1.0, 1e12),
            SampleInterval = (int)table.GetInteger("sample_interval", defaults.SampleInterval, 1, 1_000_000),
            LevelPriorMin = table.GetPositive("level_prior_min", defaults.LevelPriorMin),
            LevelPriorMax = table.GetPositive("level_prior_max", defaults.LevelPriorMax),
            ForegroundAmplitudeMax = foreground.GetPositive("amplitude_max", defaults.ForegroundAmplitudeMax),
        };
        table.RejectUnknownKeys(Keys);
        foreground.RejectUnknownKeys(ForegroundKeys);
        string? problemKey = settings.FindProblem(shape, out string problem);
        if (problemKey is not null)
        {
            if (problemKey.StartsWith("foreground.", StringComparison.Ordinal)) throw foreground.Invalid(problemKey["foreground.".Length..], problem);
            throw table.Invalid(problemKey, problem);
        }
        return settings;
    }

    /// <summary>Checks the settings against <paramref name="shape"/> (the checks <see cref="FromConfig"/> makes).</summary>
    /// <param name="shape">The data record.</param>
    /// <exception cref="ArgumentException">A value is inconsistent; <see cref="ArgumentException.ParamName"/> is its key.</exception>
    public void Validate(FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(shape);
        string? key = FindProblem(shape, out string problem);
        if (key is not null) throw new ArgumentException(problem, key);
    }

    /// <summary>The bins of [<see cref="MinFrequencyHz"/>, <see cref="MaxFrequencyHz"/>] on the record's grid,
    /// without the DC bin and, for an even record, without the real-valued Nyquist bin (whose statistics differ).</summary>
    /// <param name="shape">The data record.</param>
    public BinWindow FittedBins(FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(shape);
        long first = Math.Max(1, (long)Math.Ceiling(MinFrequencyHz / shape.DfHz - 1e-9));
        long last = Math.Min(shape.BinCount - 1, (long)Math.Floor(MaxFrequencyHz / shape.DfHz + 1e-9));
        if (shape.SampleCount % 2 == 0 && last == shape.BinCount - 1) last--;
        return new BinWindow((int)first, (int)Math.Max(0, last - first + 1));
    }

    /// <summary>Writes every key, defaults included (the caller has written the <c>[noise]</c> header).</summary>
    /// <param name="writer">The writer.</param>
    public void WriteResolved(ResolvedConfigWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Key("fit_levels", FitLevels);
        writer.Key("acceleration_asd", AccelerationAsd);
        writer.Key("oms_asd", OmsAsd);
        writer.Key("f_min_hz", MinFrequencyHz);
        writer.Key("f_max_hz", MaxFrequencyHz);
        writer.Key("include_t", IncludeT);
        writer.Key("steps_per_update", (long)StepsPerUpdate);
        writer.Key("temperatures", (long)TemperatureCount);
        writer.Key("max_temperature", MaxTemperature);
        writer.Key("sample_interval", (long)SampleInterval);
        writer.Key("level_prior_min", LevelPriorMin);
        writer.Key("level_prior_max", LevelPriorMax);
        writer.Section("noise.foreground");
        writer.Key("enabled", Foreground);
        writer.Key("fit_years", ForegroundFitYears);
        writer.Key("amplitude", ForegroundAmplitude);
        writer.Key("amplitude_max", ForegroundAmplitudeMax);
    }

    /// <summary>The tabulated foreground duration nearest <paramref name="durationS"/> (the shorter one on a tie).</summary>
    /// <param name="durationS">Record length.</param>
    /// <returns>Years, one of <see cref="GalacticConfusionSettings.SupportedObservationYears"/>.</returns>
    public static double NearestFitYears(double durationS)
    {
        double years = durationS / PhysicalConstants.JulianYearS;
        double best = GalacticConfusionSettings.SupportedObservationYears[0];
        foreach (double candidate in GalacticConfusionSettings.SupportedObservationYears)
            if (Math.Abs(candidate - years) < Math.Abs(best - years)) best = candidate;
        return best;
    }

    // Returns the key of the first inconsistent value (null when all are fine) and what is wrong with it.
    private string? FindProblem(FitDataShape shape, out string problem)
    {
        problem = "";
        if (!GalacticConfusionSettings.SupportedObservationYears.Contains(ForegroundFitYears))
        {
            problem = $"must be one of {string.Join(", ", GalacticConfusionSettings.SupportedObservationYears)} (the durations the foreground fit tabulates), got {ForegroundFitYears}";
            return "foreground.fit_years";
        }
        if (MaxFrequencyHz > shape.NyquistHz)
        {
            problem = $"must not exceed the Nyquist frequency {shape.NyquistHz} Hz of the data, got {MaxFrequencyHz}";
            return "f_max_hz";
        }
        if (MaxFrequencyHz >= FirstTransferNullHz)
        {
            problem = $"must lie below {FirstTransferNullHz:G6} Hz, where the A/E/T transfer functions vanish, got {MaxFrequencyHz}";
            return "f_max_hz";
        }
        if (!(MinFrequencyHz < MaxFrequencyHz))
        {
            problem = $"must lie below f_max_hz = {MaxFrequencyHz}, got {MinFrequencyHz}";
            return "f_min_hz";
        }
        if (FittedBins(shape).Count < 2)
        {
            problem = $"[{MinFrequencyHz}, {MaxFrequencyHz}] Hz holds fewer than two bins of spacing {shape.DfHz} Hz";
            return "f_min_hz";
        }
        if (!(LevelPriorMin < 1.0))
        {
            problem = $"must lie below 1 so that the starting levels are inside the prior, got {LevelPriorMin}";
            return "level_prior_min";
        }
        if (!(LevelPriorMax > 1.0) || !double.IsFinite(LevelPriorMax))
        {
            problem = $"must be finite and above 1 so that the starting levels are inside the prior, got {LevelPriorMax}";
            return "level_prior_max";
        }
        if (!(ForegroundAmplitudeMax > ForegroundAmplitude) || !double.IsFinite(ForegroundAmplitudeMax))
        {
            problem = $"must be finite and above amplitude = {ForegroundAmplitude}, got {ForegroundAmplitudeMax}";
            return "foreground.amplitude_max";
        }
        if (TemperatureCount > 1 && !(MaxTemperature > 1.0))
        {
            problem = $"must exceed 1 when temperatures > 1, got {MaxTemperature}";
            return "max_temperature";
        }
        return null;
    }
}
