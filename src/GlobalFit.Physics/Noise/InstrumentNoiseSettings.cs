using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Noise;

/// <summary>
/// The instrument-noise parameters: test-mass acceleration and optical-metrology amplitudes, arm length
/// and TDI generation. Validated on creation and immutable.
/// </summary>
/// <remarks>Defaults are the noise allocation used by Robson, Cornish &amp; Liu 2019 (CQG 36, 105011,
/// arXiv:1803.01944): 3e-15 m s⁻² Hz^-1/2, 15e-12 m Hz^-1/2 and 2.5e9 m arms. Thread-safe.</remarks>
public sealed record InstrumentNoiseSettings
{
    /// <summary>Default test-mass acceleration amplitude.</summary>
    /// <value>m s⁻² Hz^-1/2.</value>
    public const double DefaultAccelerationAsd = 3e-15;

    /// <summary>Default optical-metrology displacement amplitude.</summary>
    /// <value>m Hz^-1/2.</value>
    public const double DefaultOmsAsd = 15e-12;

    /// <summary>Default arm length.</summary>
    /// <value>m.</value>
    public const double DefaultArmLengthM = 2.5e9;

    /// <summary>Creates validated settings.</summary>
    /// <param name="accelerationAsd">Acceleration amplitude at the flat part of its spectrum, m s⁻² Hz^-1/2.</param>
    /// <param name="omsAsd">Optical-metrology amplitude at high frequency, m Hz^-1/2.</param>
    /// <param name="armLengthM">Arm length, m.</param>
    /// <param name="generation">TDI generation of the PSDs.</param>
    /// <exception cref="ArgumentException">A value is not positive and finite; the message and
    /// <see cref="ArgumentException.ParamName"/> name the field.</exception>
    public InstrumentNoiseSettings(
        double accelerationAsd = DefaultAccelerationAsd,
        double omsAsd = DefaultOmsAsd,
        double armLengthM = DefaultArmLengthM,
        TdiGeneration generation = TdiGeneration.First)
    {
        RequirePositiveFinite(accelerationAsd, nameof(AccelerationAsd));
        RequirePositiveFinite(omsAsd, nameof(OmsAsd));
        RequirePositiveFinite(armLengthM, nameof(ArmLengthM));
        if (!Enum.IsDefined(generation))
            throw new ArgumentException($"{nameof(Generation)} must be First or Second, got {generation}", nameof(Generation));
        AccelerationAsd = accelerationAsd;
        OmsAsd = omsAsd;
        ArmLengthM = armLengthM;
        Generation = generation;
    }

    /// <summary>The default allocation (see the remarks) with first-generation TDI.</summary>
    public static InstrumentNoiseSettings Default { get; } = new();

    /// <summary>Test-mass acceleration amplitude (per test mass, one-sided ASD).</summary>
    /// <value>m s⁻² Hz^-1/2.</value>
    public double AccelerationAsd { get; }

    /// <summary>Optical-metrology displacement amplitude (per link, one-sided ASD).</summary>
    /// <value>m Hz^-1/2.</value>
    public double OmsAsd { get; }

    /// <summary>Arm length.</summary>
    /// <value>m.</value>
    public double ArmLengthM { get; }

    /// <summary>TDI generation the PSDs describe.</summary>
    public TdiGeneration Generation { get; }

    /// <summary>Transfer frequency <c>f* = c/(2πL)</c>; the dimensionless frequency is <c>x = f/f*</c>.</summary>
    /// <value>Hz (1.908538064e-2 for the default arm).</value>
    public double TransferFrequencyHz => PhysicalConstants.SpeedOfLightMS / (2.0 * Math.PI * ArmLengthM);

    private static void RequirePositiveFinite(double value, string field)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentException($"{field} must be positive and finite, got {value}", field);
    }
}
