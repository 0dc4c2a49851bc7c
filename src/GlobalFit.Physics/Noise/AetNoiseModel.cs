namespace GlobalFit.Physics.Noise;

/// <summary>
/// The noise model the rest of globalfit uses: instrument noise in A, E, T plus, optionally, the Galactic
/// confusion foreground mapped into each channel. All PSDs are one-sided, in fractional-frequency units.
/// </summary>
/// <remarks>
/// <para>Instrument part: <see cref="InstrumentNoiseModel"/>. Foreground part (derived: taking the S_c of Robson,
/// Cornish &amp; Liu 2019 as an additive term of their two-channel S_n and converting with the channel's sky-averaged
/// response; other papers convert with other factors):
/// <c>S_ch^conf = S_c · 32x² sin²x · R_ch(x)</c>, times the TDI-generation factor, because the foreground is a
/// signal and passes through the same TDI combination as any wave.</para>
/// <para>For A and E, <c>R_ch</c> is <see cref="SkyAveragedResponse.ChannelAE"/> or Robson's approximation
/// (<see cref="ConfusionResponse"/>). For T the exact <see cref="SkyAveragedResponse.ChannelT"/> is always used
/// (Robson's formula has no T counterpart). R_T/R_A grows as x⁶ (1e-5 at x = 0.5, 7e-4 at x = 1), so the T
/// foreground is below 1e-8 of A's wherever the fit is on below 5 mHz, and zero above the fit's knee: in
/// practice T carries instrument noise only.
/// This treats the foreground as isotropic, as Robson's sky-averaged S_c does; the real foreground is
/// anisotropic and cyclo-stationary, which this stationary model does not describe.</para>
/// <para>Immutable and thread-safe; the span fillers allocate nothing.</para>
/// </remarks>
public sealed class AetNoiseModel
{
    private readonly double _transferFrequencyHz;

    /// <summary>Creates the model.</summary>
    /// <param name="instrument">Instrument-noise settings.</param>
    /// <param name="foreground">Foreground settings, or null for instrument noise only.</param>
    /// <param name="response">How the foreground is mapped into A and E.</param>
    public AetNoiseModel(InstrumentNoiseSettings instrument, GalacticConfusionSettings? foreground = null,
        ConfusionResponse response = ConfusionResponse.ExactSkyAverage)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        if (!Enum.IsDefined(response))
            throw new ArgumentException($"unknown confusion response {response}", nameof(response));
        Instrument = new InstrumentNoiseModel(instrument);
        Foreground = foreground is null ? null : new GalacticConfusion(foreground);
        Response = response;
        _transferFrequencyHz = instrument.TransferFrequencyHz;
    }

    /// <summary>The instrument part.</summary>
    public InstrumentNoiseModel Instrument { get; }

    /// <summary>The foreground, or null when the model has none.</summary>
    public GalacticConfusion? Foreground { get; }

    /// <summary>The response used to map the foreground into A and E.</summary>
    public ConfusionResponse Response { get; }

    /// <summary>Total PSD of channel A.</summary>
    /// <value>1/Hz.</value>
    public double PsdA(double fHz) => Psd(AetChannel.A, fHz);

    /// <summary>Total PSD of channel E.</summary>
    /// <value>1/Hz.</value>
    public double PsdE(double fHz) => Psd(AetChannel.E, fHz);

    /// <summary>Total PSD of channel T.</summary>
    /// <value>1/Hz.</value>
    public double PsdT(double fHz) => Psd(AetChannel.T, fHz);

    /// <summary>Total PSD (instrument + foreground) of <paramref name="channel"/>; +∞ at f = 0.</summary>
    /// <value>1/Hz.</value>
    public double Psd(AetChannel channel, double fHz) => Instrument.Psd(channel, fHz) + ConfusionPsd(channel, fHz);

    /// <summary>The foreground's contribution to <paramref name="channel"/>; 0 without a foreground and at f = 0.</summary>
    /// <value>1/Hz.</value>
    public double ConfusionPsd(AetChannel channel, double fHz)
    {
        if (!InstrumentNoiseModel.CheckFrequency(fHz) || Foreground is null) return 0.0;
        double strain = Foreground.StrainPsd(fHz);
        if (strain == 0) return 0.0;
        double x = fHz / _transferFrequencyHz;
        double sin = Math.Sin(x);
        double response = channel switch
        {
            AetChannel.A or AetChannel.E => Response == ConfusionResponse.ExactSkyAverage
                ? SkyAveragedResponse.ChannelAE(x)
                : SkyAveragedResponse.RobsonChannelAEApproximation(x),
            AetChannel.T => SkyAveragedResponse.ChannelT(x),
            _ => throw new ArgumentOutOfRangeException(nameof(channel), channel, "unknown channel"),
        };
        return strain * 32.0 * x * x * sin * sin * response * Instrument.GenerationFactor(fHz);
    }

    /// <summary>Writes the total PSD of <paramref name="channel"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    /// <exception cref="ArgumentException">The start frequency is negative or the spacing is not positive and finite.</exception>
    public void FillPsd(AetChannel channel, double f0Hz, double dfHz, Span<double> output)
    {
        InstrumentNoiseModel.CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++)
            output[k] = Psd(channel, f0Hz + k * dfHz);
    }

    /// <summary>Writes the foreground contribution to <paramref name="channel"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillConfusionPsd(AetChannel channel, double f0Hz, double dfHz, Span<double> output)
    {
        InstrumentNoiseModel.CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++)
            output[k] = ConfusionPsd(channel, f0Hz + k * dfHz);
    }
}
