using System.Globalization;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>How the massive black-hole binary workers fit: the <c>[massive_black_hole_binaries]</c> table of a run
/// configuration, checked against the data record. Every property's key is given in brackets.</summary>
/// <remarks>A value that exists is valid: <see cref="FromConfig"/> checks every key and names it in its error.</remarks>
public sealed record MassiveBlackHoleBinaryFitSettings
{
    /// <summary>Configuration keys of the table.</summary>
    public static readonly string[] Keys =
    [
        "count", "f_min_hz", "f_max_hz", "include_t", "chirp_mass_min_msun", "chirp_mass_max_msun", "mass_ratio_max", "spin_max",
        "distance_min_mpc", "distance_max_mpc", "tc_min_s", "tc_max_s", "steps_per_update", "sample_interval", "temperatures",
        "max_temperature", "phase_step_rad", "recentre_threshold", "search_chirp_mass_step", "search_updates",
    ];

    /// <summary>Upper edge of the default window when the record's Nyquist frequency allows it: above the ringdown of a
    /// 10⁶ M☉ binary (about 0.02 Hz), below which the fit's lightest default masses still chirp.</summary>
    public const double DefaultMaxFrequencyHz = 0.05;

    /// <summary>Number of binaries, one worker each [<c>count</c>]; 1 … 20.</summary>
    public int Count { get; init; } = 1;

    /// <summary>Lower edge of every worker's window [<c>f_min_hz</c>].</summary>
    /// <value>Hz.</value>
    public double MinFrequencyHz { get; init; } = 1e-4;

    /// <summary>Upper edge of every worker's window [<c>f_max_hz</c>].</summary>
    /// <value>Hz; default the lower of <see cref="DefaultMaxFrequencyHz"/> and 0.9 × Nyquist.</value>
    public double MaxFrequencyHz { get; init; } = DefaultMaxFrequencyHz;

    /// <summary>Whether the likelihood uses channel T [<c>include_t</c>].</summary>
    public bool IncludeT { get; init; }

    /// <summary>Prior range of the detector-frame chirp mass [<c>chirp_mass_min_msun</c>, <c>chirp_mass_max_msun</c>].</summary>
    /// <value>Solar masses.</value>
    public double ChirpMassMinMsun { get; init; } = 1e5;

    /// <inheritdoc cref="ChirpMassMinMsun"/>
    public double ChirpMassMaxMsun { get; init; } = 1e7;

    /// <summary>Largest mass ratio of the prior [<c>mass_ratio_max</c>].</summary>
    public double MassRatioMax { get; init; } = 10;

    /// <summary>Largest |spin| of the prior [<c>spin_max</c>].</summary>
    public double SpinMax { get; init; } = 0.99;

    /// <summary>Prior range of the luminosity distance [<c>distance_min_mpc</c>, <c>distance_max_mpc</c>].</summary>
    /// <value>Mpc.</value>
    public double DistanceMinMpc { get; init; } = 10;

    /// <inheritdoc cref="DistanceMinMpc"/>
    public double DistanceMaxMpc { get; init; } = 3e5;

    /// <summary>Prior range of t_c [<c>tc_min_s</c>, <c>tc_max_s</c>].</summary>
    /// <value>s on the data's time axis; default the record's span (binaries that merge while the data are taken).</value>
    public double CoalescenceMinS { get; init; }

    /// <inheritdoc cref="CoalescenceMinS"/>
    public double CoalescenceMaxS { get; init; }

    /// <summary>Sampler steps per update [<c>steps_per_update</c>].</summary>
    public int StepsPerUpdate { get; init; } = 400;

    /// <summary>Every this many steps one cold sample is kept [<c>sample_interval</c>].</summary>
    public int SampleInterval { get; init; } = 10;

    /// <summary>Rungs of the temperature ladder [<c>temperatures</c>].</summary>
    public int Temperatures { get; init; } = 6;

    /// <summary>Temperature of the hottest rung [<c>max_temperature</c>].</summary>
    public double MaxTemperature { get; init; } = 100;

    /// <summary>ε of the relative-binning rule [<c>phase_step_rad</c>]; the default 0.2 rad is that of
    /// <see cref="MassiveBlackHoleBinaryHeterodynedLikelihood"/>, where its accuracy is measured.</summary>
    /// <value>rad.</value>
    public double PhaseStepRad { get; init; } = DefaultPhaseStepRad;

    /// <summary>Default of <see cref="PhaseStepRad"/>.</summary>
    public const double DefaultPhaseStepRad = 0.2;

    /// <summary>Gain in ln Λ of the update's best cold sample over the reference that moves the reference there
    /// [<c>recentre_threshold</c>].</summary>
    public double RecentreThreshold { get; init; } = 1.0;

    /// <summary>Step of ln 𝓜 between the search's grid points [<c>search_chirp_mass_step</c>].</summary>
    public double SearchChirpMassStep { get; init; } = 0.05;

    /// <summary>Updates during which each worker searches its residual again and may restart its chains at a better seed
    /// [<c>search_updates</c>]; 1 searches only once.</summary>
    public int SearchUpdates { get; init; } = 3;

    /// <summary>The window every worker reads and writes.</summary>
    public BinWindow Window(FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(shape);
        int first = Math.Max(1, (int)Math.Ceiling(MinFrequencyHz / shape.DfHz));
        int last = Math.Min(shape.BinCount - 2, (int)Math.Floor(MaxFrequencyHz / shape.DfHz));
        return new BinWindow(first, last - first + 1);
    }

    /// <summary>The prior of every worker.</summary>
    public MassiveBlackHoleBinaryPrior Prior() => new(CoalescenceMinS, CoalescenceMaxS, ChirpMassMinMsun, ChirpMassMaxMsun, MassRatioMax,
        SpinMax, DistanceMinMpc, DistanceMaxMpc);

    /// <summary>Reads and checks the table.</summary>
    /// <param name="section">The <c>[massive_black_hole_binaries]</c> table.</param>
    /// <param name="shape">The data record.</param>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown, malformed or cannot work with the data; the
    /// message names it.</exception>
    public static MassiveBlackHoleBinaryFitSettings FromConfig(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(shape);
        double nyquist = shape.NyquistHz;
        double fMin = section.GetPositive("f_min_hz", 1e-4);
        double fMax = section.GetPositive("f_max_hz", Math.Min(DefaultMaxFrequencyHz, 0.9 * nyquist));
        if (!(fMax < nyquist))
            throw section.Invalid("f_max_hz", Text($"must lie below the Nyquist frequency {nyquist:G4} Hz of the data, got {fMax:G4}"));
        if (!(fMax > fMin + 2 * shape.DfHz))
            throw section.Invalid("f_max_hz", Text($"must exceed f_min_hz ({fMin:G4}) by at least two bins, got {fMax:G4}"));
        if (!(fMin >= shape.DfHz))
            throw section.Invalid("f_min_hz", Text($"must be at least one bin ({shape.DfHz:G4} Hz), got {fMin:G4}"));
        double mMin = section.GetPositive("chirp_mass_min_msun", 1e5);
        double mMax = section.GetPositive("chirp_mass_max_msun", 1e7);
        if (!(mMax > mMin)) throw section.Invalid("chirp_mass_max_msun", Text($"must exceed chirp_mass_min_msun ({mMin:G4}), got {mMax:G4}"));
        double qMax = section.GetInRange("mass_ratio_max", 10, 1, MassiveBlackHoleBinaryPopulationSettings.MaximumMassRatio);
        if (!(qMax > 1)) throw section.Invalid("mass_ratio_max", "must exceed 1 (q = m1/m2 ≥ 1 is sampled)");
        double spinMax = section.GetInRange("spin_max", 0.99, 1e-3, 1);
        double dMin = section.GetPositive("distance_min_mpc", 10);
        double dMax = section.GetPositive("distance_max_mpc", 3e5);
        if (!(dMax > dMin)) throw section.Invalid("distance_max_mpc", Text($"must exceed distance_min_mpc ({dMin:G4}), got {dMax:G4}"));
        double tcMin = section.GetDouble("tc_min_s", shape.StartS);
        double tcMax = section.GetDouble("tc_max_s", shape.StartS + shape.DurationS);
        if (!double.IsFinite(tcMin)) throw section.Invalid("tc_min_s", "must be finite");
        if (!double.IsFinite(tcMax) || !(tcMax > tcMin)) throw section.Invalid("tc_max_s", Text($"must be finite and exceed tc_min_s ({tcMin:G6}), got {tcMax:G6}"));
        if (tcMax - tcMin > shape.DurationS * (1 + 1e-12))
            throw section.Invalid("tc_max_s", Text($"the t_c range may be at most the record's {shape.DurationS:G6} s (the search's time shifts wrap around the record)"));
        var settings = new MassiveBlackHoleBinaryFitSettings
        {
            Count = (int)section.GetInteger("count", 1, 1, 20),
            MinFrequencyHz = fMin,
            MaxFrequencyHz = fMax,
            IncludeT = section.GetBool("include_t", false),
            ChirpMassMinMsun = mMin,
            ChirpMassMaxMsun = mMax,
            MassRatioMax = qMax,
            SpinMax = spinMax,
            DistanceMinMpc = dMin,
            DistanceMaxMpc = dMax,
            CoalescenceMinS = tcMin,
            CoalescenceMaxS = tcMax,
            StepsPerUpdate = (int)section.GetInteger("steps_per_update", 400, 1, 1_000_000),
            SampleInterval = (int)section.GetInteger("sample_interval", 10, 1, 1_000_000),
            Temperatures = (int)section.GetInteger("temperatures", 6, 1, 64),
            MaxTemperature = section.GetInRange("max_temperature", 100, 1.01, 1e8),
            PhaseStepRad = section.GetInRange("phase_step_rad", DefaultPhaseStepRad, 1e-3, 1.0),
            RecentreThreshold = section.GetInRange("recentre_threshold", 1.0, 0, 1e6),
            SearchChirpMassStep = section.GetInRange("search_chirp_mass_step", 0.05, 1e-4, 1.0),
            SearchUpdates = (int)section.GetInteger("search_updates", 3, 1, 1000),
        };
        section.RejectUnknownKeys(Keys);
        return settings;
    }

    /// <summary>Writes every key, defaults included.</summary>
    public void WriteResolved(ResolvedConfigWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Key("count", Count);
        writer.Key("f_min_hz", MinFrequencyHz);
        writer.Key("f_max_hz", MaxFrequencyHz);
        writer.Key("include_t", IncludeT);
        writer.Key("chirp_mass_min_msun", ChirpMassMinMsun);
        writer.Key("chirp_mass_max_msun", ChirpMassMaxMsun);
        writer.Key("mass_ratio_max", MassRatioMax);
        writer.Key("spin_max", SpinMax);
        writer.Key("distance_min_mpc", DistanceMinMpc);
        writer.Key("distance_max_mpc", DistanceMaxMpc);
        writer.Key("tc_min_s", CoalescenceMinS);
        writer.Key("tc_max_s", CoalescenceMaxS);
        writer.Key("steps_per_update", StepsPerUpdate);
        writer.Key("sample_interval", SampleInterval);
        writer.Key("temperatures", Temperatures);
        writer.Key("max_temperature", MaxTemperature);
        writer.Key("phase_step_rad", PhaseStepRad);
        writer.Key("recentre_threshold", RecentreThreshold);
        writer.Key("search_chirp_mass_step", SearchChirpMassStep);
        writer.Key("search_updates", SearchUpdates);
    }

    private static string Text(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
