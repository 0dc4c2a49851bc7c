using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>A residual for the massive black-hole binary worker tests: one binary rendered by the module's own template
/// generator (as the simulator injects it) plus, optionally, Gaussian noise drawn bin by bin from the instrument PSD with
/// <c>E|ñ_k|² = (T/2) S(f_k)</c> (the convention of <see cref="FourierTransform"/>).</summary>
internal static class MassiveBlackHoleBinaryTestData
{
    // 2^18 samples at 10 s ≈ 30.3 days, as the noise-worker tests use.
    public const int SampleCount = 1 << 18;
    public const double CadenceS = 10.0;

    public static FitDataShape Shape { get; } = new("synthetic.h5", SampleCount, CadenceS, 0.0);

    /// <summary>A binary of 10⁶ M☉ detector-frame total mass merging on day 20.</summary>
    public static MassiveBlackHoleBinaryParameters Binary(double distanceMpc) =>
        new(4.0e5, 2.0, 0.4, -0.1, 20 * 86_400.0, distanceMpc, 0.6, 2.2, 1.1, 0.8, 1.3);

    public static MassiveBlackHoleBinaryFitSettings Settings(int steps = 200) => new()
    {
        MinFrequencyHz = 1e-4,
        MaxFrequencyHz = 0.02,
        ChirpMassMinMsun = 1e5,
        ChirpMassMaxMsun = 2e6,
        CoalescenceMinS = 0,
        CoalescenceMaxS = Shape.DurationS,
        StepsPerUpdate = steps,
        Temperatures = 4,
    };

    /// <summary>The residual over the settings' window: the binary, plus noise when <paramref name="noiseSeed"/> is given.</summary>
    public static WorkerResidual Residual(MassiveBlackHoleBinaryFitSettings settings, MassiveBlackHoleBinaryParameters? binary, ulong? noiseSeed)
    {
        var window = settings.Window(Shape);
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        if (binary is { } b)
            new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), window.Count, Shape.StartS).RenderBins(b, window, Shape.DfHz, a, e, Span<Complex>.Empty);
        var noise = new AetNoiseModel(new InstrumentNoiseSettings());
        var inverseA = new double[window.Count];
        var inverseE = new double[window.Count];
        var random = RandomStream.ForPath(noiseSeed ?? 0, 11, 0);
        for (int k = 0; k < window.Count; k++)
        {
            double f = (window.First + k) * Shape.DfHz;
            double psdA = noise.Psd(AetChannel.A, f), psdE = noise.Psd(AetChannel.E, f);
            inverseA[k] = 1 / psdA;
            inverseE[k] = 1 / psdE;
            if (noiseSeed is null) continue;
            // Each of the real and imaginary parts has variance (T/4) S, so E|ñ|² = (T/2) S.
            double sa = Math.Sqrt(Shape.DurationS * psdA / 4), se = Math.Sqrt(Shape.DurationS * psdE / 4);
            a[k] += new Complex(sa * random.NextGaussian(), sa * random.NextGaussian());
            e[k] += new Complex(se * random.NextGaussian(), se * random.NextGaussian());
        }
        return new WorkerResidual(new WindowSpectra(window, a, e, null), Shape.DfHz, inverseA, inverseE, null);
    }

    /// <summary>Optimal SNR of <paramref name="binary"/> in A and E against the residual's weights.</summary>
    public static double Snr(WorkerResidual residual, MassiveBlackHoleBinaryParameters binary)
    {
        var window = residual.Bins;
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), window.Count, Shape.StartS).RenderBins(binary, window, Shape.DfHz, a, e, Span<Complex>.Empty);
        return Math.Sqrt(InnerProduct.SquaredNorm(a, residual.InverseA, Shape.DfHz) + InnerProduct.SquaredNorm(e, residual.InverseE, Shape.DfHz));
    }
}
