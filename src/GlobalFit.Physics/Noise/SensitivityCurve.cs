namespace GlobalFit.Physics.Noise;

/// <summary>
/// Sky-averaged strain sensitivity of the two-channel (A+E) detector, in Robson et al.'s approximate
/// form and in the exact static equal-arm form, with the derived quantities analysts plot.
/// </summary>
/// <remarks>
/// <para>Robson, Cornish &amp; Liu 2019, CQG 36, 105011, arXiv:1803.01944 (Eq. 1 form; formulas and equation
/// number from memory, each cross-checked by the identities below):
/// <c>P_n = P_OMS/L² + 2(1 + cos²x) P_acc/((2πf)⁴ L²)</c>, <c>S_n = P_n/R + S_c</c> with
/// <c>R = (3/10)/(1 + 0.6x²)</c>. The identity <c>P_n = S_X/(16x² sin²x)</c> (derived: exact algebra, checked to
/// 1e-12) ties it to <see cref="InstrumentNoiseModel"/>.</para>
/// <para>Exact form (derived: the two-channel noise divided by the sky-averaged A+E response):
/// <c>S_n,exact = S_A/(2 · 16x² sin²x · R_A) + S_c</c> with R_A from
/// <see cref="SkyAveragedResponse.ChannelAE"/>. It does not depend on the TDI generation, since the
/// generation factor multiplies signal and noise alike; first-generation PSDs are used, with the
/// <c>sin²x</c> cancelled analytically so the zeros of sin x cause no 0/0.</para>
/// <para>Immutable and thread-safe.</para>
/// </remarks>
public sealed class SensitivityCurve
{
    private readonly InstrumentNoiseModel _instrument;

    /// <summary>Creates the curve for an instrument and an optional foreground.</summary>
    public SensitivityCurve(InstrumentNoiseSettings instrument, GalacticConfusionSettings? foreground = null)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        _instrument = new InstrumentNoiseModel(instrument);
        Foreground = foreground is null ? null : new GalacticConfusion(foreground);
    }

    /// <summary>The instrument settings.</summary>
    public InstrumentNoiseSettings Instrument => _instrument.Settings;

    /// <summary>The foreground added to the curve, or null.</summary>
    public GalacticConfusion? Foreground { get; }

    /// <summary>Robson et al.'s <c>P_n(f)</c>: the X-channel noise in Michelson-strain units.</summary>
    /// <value>1/Hz (strain).</value>
    public double MichelsonStrainNoise(double fHz)
    {
        if (!InstrumentNoiseModel.CheckFrequency(fHz)) return double.PositiveInfinity;
        double lengthM = Instrument.ArmLengthM;
        double x = fHz / Instrument.TransferFrequencyHz;
        double cos = Math.Cos(x);
        double omega2 = 2.0 * Math.PI * fHz * (2.0 * Math.PI * fHz);
        double omsRatio = 2e-3 / fHz, lowRatio = 0.4e-3 / fHz, highRatio = fHz / 8e-3;
        double oms = Instrument.OmsAsd * Instrument.OmsAsd * (1.0 + omsRatio * omsRatio * omsRatio * omsRatio);
        double acc = Instrument.AccelerationAsd * Instrument.AccelerationAsd * (1.0 + lowRatio * lowRatio)
            * (1.0 + highRatio * highRatio * highRatio * highRatio);
        return (oms + 2.0 * (1.0 + cos * cos) * acc / (omega2 * omega2)) / (lengthM * lengthM);
    }

    /// <summary>Robson et al.'s sky-averaged sensitivity <c>S_n(f)</c>, including the foreground if any.</summary>
    /// <value>1/Hz (strain).</value>
    public double RobsonStrainPsd(double fHz)
    {
        if (!InstrumentNoiseModel.CheckFrequency(fHz)) return double.PositiveInfinity;
        double x = fHz / Instrument.TransferFrequencyHz;
        return MichelsonStrainNoise(fHz) / SkyAveragedResponse.RobsonTwoChannelApproximation(x) + ForegroundStrain(fHz);
    }

    /// <summary>The exact two-channel sky-averaged sensitivity <c>S_A/(32x² sin²x R_A) + S_c</c>.</summary>
    /// <value>1/Hz (strain).</value>
    public double ExactStrainPsd(double fHz)
    {
        if (!InstrumentNoiseModel.CheckFrequency(fHz)) return double.PositiveInfinity;
        double x = fHz / Instrument.TransferFrequencyHz;
        double cos = Math.Cos(x);
        // S_A/(32 x² sin²x) with the sin²x of S_A (InstrumentNoiseModel) cancelled.
        double reduced = ((2.0 + cos) * _instrument.OmsPsd(fHz) + 4.0 * (1.0 + cos + cos * cos) * _instrument.AccelerationPsd(fHz))
            / (4.0 * x * x);
        return reduced / SkyAveragedResponse.ChannelAE(x) + ForegroundStrain(fHz);
    }

    /// <summary>Amplitude spectral density <c>√S_n</c> of <see cref="RobsonStrainPsd"/>.</summary>
    /// <value>Hz^-1/2.</value>
    public double RobsonStrainAsd(double fHz) => Math.Sqrt(RobsonStrainPsd(fHz));

    /// <summary>Amplitude spectral density <c>√S_n</c> of <see cref="ExactStrainPsd"/>.</summary>
    /// <value>Hz^-1/2.</value>
    public double ExactStrainAsd(double fHz) => Math.Sqrt(ExactStrainPsd(fHz));

    /// <summary>The noise curve <c>√(f S_n)</c> (Robson form), dimensionless, to plot against <see cref="EffectiveStrain"/>.</summary>
    public double RobsonCharacteristicNoise(double fHz) => Math.Sqrt(fHz * RobsonStrainPsd(fHz));

    /// <summary>Writes <see cref="RobsonStrainPsd"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillRobsonStrainPsd(double f0Hz, double dfHz, Span<double> output)
    {
        InstrumentNoiseModel.CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++) output[k] = RobsonStrainPsd(f0Hz + k * dfHz);
    }

    /// <summary>Writes <see cref="ExactStrainPsd"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillExactStrainPsd(double f0Hz, double dfHz, Span<double> output)
    {
        InstrumentNoiseModel.CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++) output[k] = ExactStrainPsd(f0Hz + k * dfHz);
    }

    /// <summary>Effective strain of a monochromatic binary, <c>h_eff = A √(16 f T/5)</c>, so that its
    /// averaged SNR² is <c>h_eff²/(f S_n)</c>.</summary>
    /// <param name="amplitude">Strain amplitude A (face-on strain is 2A).</param>
    /// <param name="fHz">Gravitational-wave frequency.</param>
    /// <param name="observationSeconds">Observation time.</param>
    /// <remarks>Derived from the S_n definition of Robson, Cornish &amp; Liu 2019 (16/5 is the inclination average).</remarks>
    public static double EffectiveStrain(double amplitude, double fHz, double observationSeconds) =>
        amplitude * Math.Sqrt(16.0 * fHz * observationSeconds / 5.0);

    /// <summary>Sky-, polarisation- and inclination-averaged SNR of a monochromatic binary,
    /// <c>ρ̄ = √((16/5) A² T/S_n(f))</c>, for a sensitivity value in this class's convention.</summary>
    /// <param name="amplitude">Strain amplitude A.</param>
    /// <param name="observationSeconds">Observation time.</param>
    /// <param name="strainPsd">S_n at the binary's frequency, 1/Hz.</param>
    /// <remarks>Derived: average of <c>(1 + cos²ι)² + 4 cos²ι</c> over uniform cos ι is 16/5, with the sky and
    /// polarisation averages inside S_n (Robson, Cornish &amp; Liu 2019 convention); checked by Monte Carlo to 1 %.</remarks>
    public static double AveragedSnr(double amplitude, double observationSeconds, double strainPsd) =>
        Math.Sqrt(16.0 / 5.0 * amplitude * amplitude * observationSeconds / strainPsd);

    private double ForegroundStrain(double fHz) => Foreground?.StrainPsd(fHz) ?? 0.0;
}
