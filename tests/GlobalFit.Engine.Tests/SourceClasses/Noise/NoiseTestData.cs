using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.Noise;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.Noise;

/// <summary>Noise-only data for the noise-worker tests: A/E coloured with instrument noise plus foreground at one
/// set of levels, T with instrument noise at another, each synthesised in the time domain by the project's own
/// <see cref="NoiseSynthesis"/> and transformed back with <see cref="FourierTransform"/>.</summary>
internal sealed class NoiseTestData
{
    // 2^18 samples at 10 s ≈ 30.3 days: a radix-2 length, so the synthesis takes a fraction of a second.
    public const int SampleCount = 1 << 18;
    public const double CadenceS = 10.0;

    public static FitDataShape Shape { get; } = new("synthetic.h5", SampleCount, CadenceS, 0.0);

    public NoiseTestData(NoiseLevels truth, double foregroundYears, ulong seed)
    {
        Truth = truth;
        var ae = new AetNoiseModel(new InstrumentNoiseSettings(truth.AccelerationAsdAe, truth.OmsAsdAe),
            truth.ForegroundAmplitude > 0 ? new GalacticConfusionSettings(foregroundYears, truth.ForegroundAmplitude) : null);
        var t = new InstrumentNoiseModel(new InstrumentNoiseSettings(truth.AccelerationAsdT, truth.OmsAsdT));
        A = Channel(f => ae.Psd(AetChannel.A, f), seed, 0);
        E = Channel(f => ae.Psd(AetChannel.E, f), seed, 1);
        T = Channel(f => t.Psd(AetChannel.T, f), seed, 2);
    }

    public NoiseLevels Truth { get; }

    public Complex[] A { get; }

    public Complex[] E { get; }

    public Complex[] T { get; }

    public WindowSpectra Residual(BinWindow bins, bool includeT) =>
        new(bins, A[bins.First..bins.End], E[bins.First..bins.End], includeT ? T[bins.First..bins.End] : null);

    private static Complex[] Channel(Func<double, double> psdOf, ulong seed, ulong channel)
    {
        var psd = new double[FourierTransform.OneSidedLength(SampleCount)];
        for (int k = 1; k < psd.Length; k++) psd[k] = psdOf(k * Shape.DfHz);
        var random = RandomStream.ForPath(seed, 99, channel);
        var normals = new double[NoiseSynthesis.RequiredNormalCount(SampleCount)];
        for (int i = 0; i < normals.Length; i++) normals[i] = random.NextGaussian();
        var samples = new double[SampleCount];
        NoiseSynthesis.ColourWhiteNoise(normals, psd, CadenceS, samples);
        var spectrum = new Complex[psd.Length];
        FourierTransform.Forward(samples, CadenceS, spectrum);
        return spectrum;
    }
}
