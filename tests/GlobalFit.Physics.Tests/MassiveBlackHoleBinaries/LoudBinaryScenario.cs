using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

/// <summary>Test support: a 1e6 M_sun binary (q = 2, spins 0.5 and 0.2) merging 25 days into a 30.3-day record at 10 s cadence,
/// scaled to SNR 1000, plus Gaussian instrument noise (seed 5); the window runs from 0.1 mHz to the model's cut-off.</summary>
public sealed class LoudBinaryScenario
{
    public const double Cadence = 10.0;
    public const int SampleCount = 1 << 18;
    public const double TargetSnr = 1000.0;

    public LoudBinaryScenario()
    {
        double duration = SampleCount * Cadence;
        double df = 1.0 / duration;
        var draft = new MassiveBlackHoleBinaryParameters(BinaryMasses.FromComponents(6.6667e5, 3.3333e5).ChirpMass, 2.0, 0.5, 0.2,
            25.0 * 86400.0, 1e4, -0.3, 4.0, 1.0, 0.4, 2.2);
        double fMax = MassiveBlackHoleBinaryTemplateGenerator.Waveform(draft).MaximumFrequencyHz;
        int first = (int)Math.Ceiling(1e-4 / df);
        int last = Math.Min(SampleCount / 2, (int)Math.Floor(fMax / df));
        Window = new BinWindow(first, last - first + 1);
        Orbits = new RigidOrbits(initialOrbitalPhaseRad: 0.5);
        Generator = new MassiveBlackHoleBinaryTemplateGenerator(Orbits, Window.Count, earliestTimeS: 0.0);

        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        var inverse = new double[3][];
        var psd = new double[3][];
        for (int c = 0; c < 3; c++)
        {
            psd[c] = new double[Window.Count];
            noise.FillPsd(channels[c], first * df, df, psd[c]);
            inverse[c] = new double[Window.Count];
            InnerProduct.InvertPsd(psd[c], inverse[c]);
        }
        var signal = new[] { new Complex[Window.Count], new Complex[Window.Count], new Complex[Window.Count] };
        Generator.RenderBins(draft, Window, df, signal[0], signal[1], signal[2]);
        double snr = Math.Sqrt(Enumerable.Range(0, 3).Sum(c => InnerProduct.SquaredNorm(signal[c], inverse[c], df)));
        double scale = snr / TargetSnr;
        Truth = draft with { DistanceMpc = draft.DistanceMpc * scale };

        var random = new Random(5);
        var data = new Complex[3][];
        for (int c = 0; c < 3; c++)
        {
            data[c] = new Complex[Window.Count];
            for (int k = 0; k < Window.Count; k++)
            {
                // E|n_k|² = (T/2) S_k (the project's convention); Box–Muller pairs.
                double sigma = Math.Sqrt(0.25 * duration * psd[c][k]);
                double radius = Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble()));
                double angle = 2.0 * Math.PI * random.NextDouble();
                data[c][k] = signal[c][k] / scale + sigma * radius * new Complex(Math.Cos(angle), Math.Sin(angle));
            }
        }
        Data = new MassiveBlackHoleBinaryData(Window, df, data, inverse);
        Full = new MassiveBlackHoleBinaryLikelihood(Generator, Data);
    }

    public BinWindow Window { get; }

    public IConstellationOrbits Orbits { get; }

    public MassiveBlackHoleBinaryTemplateGenerator Generator { get; }

    public MassiveBlackHoleBinaryParameters Truth { get; }

    public MassiveBlackHoleBinaryData Data { get; }

    public MassiveBlackHoleBinaryLikelihood Full { get; }
}
