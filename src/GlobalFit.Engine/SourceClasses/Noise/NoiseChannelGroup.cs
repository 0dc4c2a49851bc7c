using System.Numerics;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>One channel group of the noise fit (A and E together, or T): the per-bin PSD shapes whose linear
/// combination is the group's PSD, and the residual power of the current update.</summary>
/// <remarks>
/// <para>The group's PSD is <c>S_k = c_acc · A_k + c_oms · O_k [+ c_fg · F_k]</c>, where A and O are the acceleration
/// and optical-metrology parts at the starting ASDs (so <c>c_acc</c>, <c>c_oms</c> are squared ASD multipliers) and F
/// is the foreground at amplitude 1 (so <c>c_fg</c> is the foreground amplitude). Shapes and power are stored divided
/// by the starting PSD S⁰_k, which keeps the sums of <see cref="WhittleLikelihood"/> near zero; the constant
/// <c>−w Σ ln S⁰_k</c> is added back so <see cref="LogLikelihood"/> is the Whittle ln L itself.</para>
/// <para><see cref="InstrumentNoiseModel"/> exposes only total PSDs, so the two parts are separated by evaluating it
/// at two acceleration levels: S(a₀) = A + O and S(2a₀) = 4A + O give A = (S(2a₀) − S(a₀))/3 exactly up to rounding
/// (relative error ~1e-13 where one part is 1000 times the other).</para>
/// </remarks>
internal sealed class NoiseChannelGroup
{
    private readonly double[][] _shapes;
    private readonly double[] _power;
    private readonly double[] _inverseStartPsd;
    private readonly double _powerFactor;
    private readonly double _logNormalisation;

    private NoiseChannelGroup(double[][] shapes, double[] inverseStartPsd, int channelCount, double dfHz)
    {
        _shapes = shapes;
        _inverseStartPsd = inverseStartPsd;
        _power = new double[inverseStartPsd.Length];
        ChannelCount = channelCount;
        _powerFactor = 2.0 * dfHz;
        double logStart = 0;
        foreach (double inverse in inverseStartPsd) logStart -= Math.Log(inverse);
        _logNormalisation = -channelCount * logStart;
    }

    /// <summary>Channels sharing the PSD (the log weight w): 2 for A and E, 1 for T.</summary>
    public int ChannelCount { get; }

    /// <summary>Number of coefficients: 2, or 3 with the foreground.</summary>
    public int ShapeCount => _shapes.Length;

    /// <summary>Builds the shapes of <paramref name="channel"/> over <paramref name="bins"/>.</summary>
    /// <param name="channel">A (for the A/E group) or T.</param>
    /// <param name="channelCount">Channels in the group.</param>
    /// <param name="bins">The fitted bins.</param>
    /// <param name="dfHz">Bin spacing.</param>
    /// <param name="start">Instrument settings at the starting ASDs.</param>
    /// <param name="foregroundYears">The foreground fit to use, or null for no foreground shape.</param>
    /// <param name="startCoefficients">The starting coefficients (1, 1[, foreground amplitude]) defining S⁰.</param>
    public static NoiseChannelGroup Create(AetChannel channel, int channelCount, BinWindow bins, double dfHz, InstrumentNoiseSettings start,
        double? foregroundYears, ReadOnlySpan<double> startCoefficients)
    {
        var low = new InstrumentNoiseModel(start);
        var high = new InstrumentNoiseModel(new InstrumentNoiseSettings(2.0 * start.AccelerationAsd, start.OmsAsd, start.ArmLengthM, start.Generation));
        var foreground = foregroundYears is double years ? new AetNoiseModel(start, new GalacticConfusionSettings(years, 1.0)) : null;
        int count = bins.Count;
        var shapes = new double[foreground is null ? 2 : 3][];
        for (int j = 0; j < shapes.Length; j++) shapes[j] = new double[count];
        var inverseStart = new double[count];
        for (int i = 0; i < count; i++)
        {
            double f = (bins.First + i) * dfHz;
            double sLow = low.Psd(channel, f);
            double acceleration = (high.Psd(channel, f) - sLow) / 3.0;
            shapes[0][i] = acceleration;
            shapes[1][i] = sLow - acceleration;
            if (foreground is not null) shapes[2][i] = foreground.ConfusionPsd(channel, f);
            double startPsd = 0;
            for (int j = 0; j < shapes.Length; j++) startPsd += startCoefficients[j] * shapes[j][i];
            inverseStart[i] = 1.0 / startPsd;
            for (int j = 0; j < shapes.Length; j++) shapes[j][i] *= inverseStart[i];
        }
        return new NoiseChannelGroup(shapes, inverseStart, channelCount, dfHz);
    }

    /// <summary>Stores <c>2Δf Σ_ch |r̃_k|² / S⁰_k</c> for the update's residual.</summary>
    /// <param name="first">First channel of the group.</param>
    /// <param name="second">Second channel (E), or empty for a one-channel group.</param>
    public void SetResidual(ReadOnlySpan<Complex> first, ReadOnlySpan<Complex> second)
    {
        if (first.Length != _power.Length || (ChannelCount == 2 && second.Length != _power.Length))
            throw new ArgumentException($"residual must hold {_power.Length} bins");
        for (int k = 0; k < _power.Length; k++)
        {
            double squared = first[k].Real * first[k].Real + first[k].Imaginary * first[k].Imaginary;
            if (ChannelCount == 2) squared += second[k].Real * second[k].Real + second[k].Imaginary * second[k].Imaginary;
            _power[k] = _powerFactor * squared * _inverseStartPsd[k];
        }
    }

    /// <summary>The Whittle ln L of the group for coefficients <paramref name="coefficients"/>.</summary>
    /// <param name="coefficients"><see cref="ShapeCount"/> values.</param>
    public double LogLikelihood(ReadOnlySpan<double> coefficients) => _shapes.Length == 2
        ? WhittleLikelihood.LogLikelihood(_power, _shapes[0], _shapes[1], coefficients[0], coefficients[1], ChannelCount) + _logNormalisation
        : WhittleLikelihood.LogLikelihood(_power, _shapes[0], _shapes[1], _shapes[2], coefficients[0], coefficients[1], coefficients[2], ChannelCount) + _logNormalisation;

    /// <summary>Adds the score and Fisher information of the coefficients (see <see cref="WhittleLikelihood.AccumulateScore"/>).</summary>
    public void AccumulateScore(ReadOnlySpan<double> coefficients, Span<double> gradient, Span<double> fisher) =>
        WhittleLikelihood.AccumulateScore(_power, _shapes, coefficients, ChannelCount, gradient, fisher);
}
