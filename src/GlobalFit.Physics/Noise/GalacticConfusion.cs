namespace GlobalFit.Physics.Noise;

/// <summary>
/// The Galactic white-dwarf confusion foreground as a sky-averaged strain PSD <c>S_c(f)</c> in the
/// convention of Robson, Cornish &amp; Liu (additive to their sensitivity <c>S_n</c>).
/// </summary>
/// <remarks>
/// <para>Robson, Cornish &amp; Liu 2019, CQG 36, 105011, arXiv:1803.01944, Eq. 14 and its table (the fit goes
/// back to Cornish &amp; Robson 2017, arXiv:1703.09858); formula, table and equation number from memory, not read
/// from the paper, so the tests also check limits the fit must obey:
/// <c>S_c(f) = A f^{−7/3} exp(−f^α + β f sin κf) [1 + tanh(γ (f_k − f))]</c>, <c>A = 9e−45</c>, f in Hz,
/// multiplied here by <see cref="GalacticConfusionSettings.AmplitudeScale"/>.</para>
/// <para>Above the knee the tanh factor reaches exactly zero in double precision (e.g. above ≈ 20 mHz for
/// 1 yr); the PSD is then 0 without evaluating the exponential, which would overflow at high f.
/// At f = 0 the PSD is +∞. Immutable and thread-safe.</para>
/// </remarks>
public sealed class GalacticConfusion
{
    private const double Amplitude = 9e-45;

    private readonly FitParameters _fit;

    /// <summary>Creates the foreground for <paramref name="settings"/>.</summary>
    public GalacticConfusion(GalacticConfusionSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        Settings = settings;
        _fit = settings.ObservationYears switch
        {
            0.5 => new FitParameters(0.133, 243, 482, 917, 2.58e-3),
            1.0 => new FitParameters(0.171, 292, 1020, 1680, 2.15e-3),
            2.0 => new FitParameters(0.165, 299, 611, 1340, 1.73e-3),
            _ => new FitParameters(0.138, -221, 521, 1680, 1.13e-3),
        };
    }

    /// <summary>The observation time and multiplier.</summary>
    public GalacticConfusionSettings Settings { get; }

    /// <summary>Sky-averaged strain PSD of the foreground, <c>S_c(f)</c>.</summary>
    /// <value>1/Hz (strain).</value>
    /// <exception cref="ArgumentOutOfRangeException">The frequency is negative or not finite.</exception>
    public double StrainPsd(double fHz)
    {
        if (!InstrumentNoiseModel.CheckFrequency(fHz))
            return Settings.AmplitudeScale == 0 ? 0.0 : double.PositiveInfinity;
        double knee = 1.0 + Math.Tanh(_fit.Gamma * (_fit.KneeHz - fHz));
        if (knee == 0 || Settings.AmplitudeScale == 0) return 0.0;
        double shape = Math.Exp(-Math.Pow(fHz, _fit.Alpha) + _fit.Beta * fHz * Math.Sin(_fit.Kappa * fHz));
        return Settings.AmplitudeScale * Amplitude * Math.Pow(fHz, -7.0 / 3.0) * shape * knee;
    }

    /// <summary>Writes <see cref="StrainPsd"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillStrainPsd(double f0Hz, double dfHz, Span<double> output)
    {
        InstrumentNoiseModel.CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++)
            output[k] = StrainPsd(f0Hz + k * dfHz);
    }

    private readonly record struct FitParameters(double Alpha, double Beta, double Kappa, double Gamma, double KneeHz);
}
