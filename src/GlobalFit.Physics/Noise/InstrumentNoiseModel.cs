using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Noise;

/// <summary>
/// Instrument-noise PSDs for equal, static arms: the two noise components in fractional-frequency units
/// and the TDI combinations X, the X–Y cross-spectrum, A, E and T built from them.
/// </summary>
/// <remarks>
/// <para>Components (allocation as in Robson, Cornish &amp; Liu 2019, CQG 36, 105011, arXiv:1803.01944; their
/// typography from memory): per test mass
/// <c>√S_a = a [1 + (0.4 mHz/f)²]^½ [1 + (f/8 mHz)⁴]^½</c> and per link <c>√S_x = o [1 + (2 mHz/f)⁴]^½</c>,
/// converted to Doppler units by <c>S_acc = S_a/(2πfc)²</c> and <c>S_oms = S_x (2πf/c)²</c> (derived: velocity is
/// the integral of acceleration and <c>y = (1/c) dx/dt</c>).</para>
/// <para>TDI PSDs, first generation (derived: transfer matrix from the six independent optical-metrology and six
/// test-mass noises to X, Y, Z; also in Prince et al. 2002, PRD 66, 122002, from memory), with <c>x = f/f*</c>:
/// <c>S_X = 16 sin²x [S_oms + (3 + cos 2x) S_acc]</c>, <c>S_XY = −8 sin²x cos x [S_oms + 4 S_acc]</c>,
/// <c>S_A = S_E = 8 sin²x [(2 + cos x) S_oms + 4 (1 + cos x + cos²x) S_acc]</c>,
/// <c>S_T = 32 sin²x sin²(x/2) [S_oms + 4 sin²(x/2) S_acc]</c>; second generation multiplies each by
/// <c>4 sin²(2x)</c>. The T form with <c>sin²(x/2)</c> avoids the cancellation in <c>1 − cos x</c>.</para>
/// <para>At <c>f = 0</c> the noise is not defined (the acceleration term diverges); every PSD returns
/// <see cref="double.PositiveInfinity"/> there, which <see cref="Series.InnerProduct.InvertPsd"/> turns into
/// weight 0. Immutable and thread-safe; the span fillers allocate nothing.</para>
/// </remarks>
public sealed class InstrumentNoiseModel
{
    private const double AccelerationLowKneeHz = 0.4e-3;
    private const double AccelerationHighKneeHz = 8e-3;
    private const double OmsKneeHz = 2e-3;

    private readonly double _transferFrequencyHz;

    /// <summary>Creates the model for <paramref name="settings"/>.</summary>
    public InstrumentNoiseModel(InstrumentNoiseSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        Settings = settings;
        _transferFrequencyHz = settings.TransferFrequencyHz;
    }

    /// <summary>The model with the default settings (<see cref="InstrumentNoiseSettings.Default"/>, first generation).</summary>
    public static InstrumentNoiseModel Default { get; } = new(InstrumentNoiseSettings.Default);

    /// <summary>The parameters of this model.</summary>
    public InstrumentNoiseSettings Settings { get; }

    /// <summary>Test-mass acceleration noise of one test mass in fractional-frequency units, <c>S_acc(f)</c>.</summary>
    /// <value>1/Hz.</value>
    public double AccelerationPsd(double fHz)
    {
        if (!CheckFrequency(fHz)) return double.PositiveInfinity;
        double ratioLow = AccelerationLowKneeHz / fHz;
        double ratioHigh = fHz / AccelerationHighKneeHz;
        double toDoppler = Settings.AccelerationAsd / (2.0 * Math.PI * fHz * PhysicalConstants.SpeedOfLightMS);
        return toDoppler * toDoppler * (1.0 + ratioLow * ratioLow) * (1.0 + ratioHigh * ratioHigh * ratioHigh * ratioHigh);
    }

    /// <summary>Optical-metrology noise of one link in fractional-frequency units, <c>S_oms(f)</c>.</summary>
    /// <value>1/Hz.</value>
    public double OmsPsd(double fHz)
    {
        if (!CheckFrequency(fHz)) return double.PositiveInfinity;
        double ratio = OmsKneeHz / fHz;
        double toDoppler = Settings.OmsAsd * 2.0 * Math.PI * fHz / PhysicalConstants.SpeedOfLightMS;
        return toDoppler * toDoppler * (1.0 + ratio * ratio * ratio * ratio);
    }

    /// <summary>The factor the TDI generation applies to every PSD: 1, or <c>4 sin²(2x)</c> for the second generation.</summary>
    public double GenerationFactor(double fHz)
    {
        if (Settings.Generation == TdiGeneration.First) return 1.0;
        double s = Math.Sin(2.0 * fHz / _transferFrequencyHz);
        return 4.0 * s * s;
    }

    /// <summary>PSD of the Michelson channel X (and of Y and Z).</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double PsdX(double fHz) => Evaluate(Quantity.X, fHz);

    /// <summary>Cross-spectral density of X and Y (real; equal to S_YZ and S_ZX).</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double CsdXY(double fHz) => Evaluate(Quantity.XY, fHz);

    /// <summary>PSD of channel A.</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double PsdA(double fHz) => Evaluate(Quantity.AE, fHz);

    /// <summary>PSD of channel E (equal to that of A for equal arms).</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double PsdE(double fHz) => Evaluate(Quantity.AE, fHz);

    /// <summary>PSD of channel T.</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double PsdT(double fHz) => Evaluate(Quantity.T, fHz);

    /// <summary>PSD of <paramref name="channel"/>.</summary>
    /// <value>1/Hz, fractional frequency.</value>
    public double Psd(AetChannel channel, double fHz) => Evaluate(ToQuantity(channel), fHz);

    /// <summary>Writes the PSD of <paramref name="channel"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    /// <exception cref="ArgumentException">The start frequency is negative or the spacing is not positive and finite.</exception>
    public void FillPsd(AetChannel channel, double f0Hz, double dfHz, Span<double> output) =>
        Fill(ToQuantity(channel), f0Hz, dfHz, output);

    /// <summary>Writes <see cref="PsdX"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillPsdX(double f0Hz, double dfHz, Span<double> output) => Fill(Quantity.X, f0Hz, dfHz, output);

    /// <summary>Writes <see cref="CsdXY"/> at <c>f0Hz + k dfHz</c> into <paramref name="output"/>[k].</summary>
    public void FillCsdXY(double f0Hz, double dfHz, Span<double> output) => Fill(Quantity.XY, f0Hz, dfHz, output);

    internal static void CheckGrid(double f0Hz, double dfHz)
    {
        if (!(f0Hz >= 0) || !double.IsFinite(f0Hz))
            throw new ArgumentException($"start frequency must be finite and non-negative, got {f0Hz}", nameof(f0Hz));
        if (!(dfHz > 0) || !double.IsFinite(dfHz))
            throw new ArgumentException($"frequency spacing must be positive and finite, got {dfHz}", nameof(dfHz));
    }

    /// <summary>False for <c>f = 0</c> (where every PSD is +∞ by convention); throws for negative or non-finite f.</summary>
    internal static bool CheckFrequency(double fHz)
    {
        if (!(fHz >= 0) || !double.IsFinite(fHz))
            throw new ArgumentOutOfRangeException(nameof(fHz), fHz, "frequency must be finite and non-negative");
        return fHz > 0;
    }

    private void Fill(Quantity quantity, double f0Hz, double dfHz, Span<double> output)
    {
        CheckGrid(f0Hz, dfHz);
        for (int k = 0; k < output.Length; k++)
            output[k] = Evaluate(quantity, f0Hz + k * dfHz);
    }

    private double Evaluate(Quantity quantity, double fHz)
    {
        if (!CheckFrequency(fHz)) return double.PositiveInfinity;
        double acc = AccelerationPsd(fHz);
        double oms = OmsPsd(fHz);
        double x = fHz / _transferFrequencyHz;
        double sin = Math.Sin(x), cos = Math.Cos(x);
        double sin2 = sin * sin;
        double first = quantity switch
        {
            Quantity.X => 16.0 * sin2 * (oms + (3.0 + Math.Cos(2.0 * x)) * acc),
            Quantity.XY => -8.0 * sin2 * cos * (oms + 4.0 * acc),
            Quantity.AE => 8.0 * sin2 * ((2.0 + cos) * oms + 4.0 * (1.0 + cos + cos * cos) * acc),
            _ => TChannel(sin2, x, oms, acc),
        };
        return first * GenerationFactor(fHz);
    }

    private static double TChannel(double sin2, double x, double oms, double acc)
    {
        double half = Math.Sin(0.5 * x);
        double half2 = half * half;
        return 32.0 * sin2 * half2 * (oms + 4.0 * half2 * acc);
    }

    private static Quantity ToQuantity(AetChannel channel) => channel switch
    {
        AetChannel.A or AetChannel.E => Quantity.AE,
        AetChannel.T => Quantity.T,
        _ => throw new ArgumentOutOfRangeException(nameof(channel), channel, "unknown channel"),
    };

    private enum Quantity { X, XY, AE, T }
}
