using System.Diagnostics;

namespace GlobalFit.Physics.Noise;

/// <summary>Result of <see cref="NoiseSynthesisProbe.Measure"/>.</summary>
/// <param name="SamplesPerChannel">Samples synthesised in each of A, E and T.</param>
/// <param name="Seconds">Wall time for the three channels (PSD evaluation, colouring and inverse FFT).</param>
public readonly record struct NoiseSynthesisMeasurement(int SamplesPerChannel, double Seconds)
{
    /// <summary>Samples produced per second of wall time, all three channels counted.</summary>
    public double SamplesPerSecond => 3.0 * SamplesPerChannel / Seconds;
}

/// <summary>A quick, dependency-free timing of A/E/T noise synthesis for <c>globalfit bench</c>.</summary>
/// <remarks>The draws fed to the synthesiser are a deterministic equidistributed sequence of unit variance
/// (a Weyl sequence mapped to [−√3, √3]), not Gaussian: the cost of synthesis does not depend on the values, and
/// this keeps Physics free of a random-number generator. Use <see cref="NoiseSynthesis"/> with real normals for data.</remarks>
public static class NoiseSynthesisProbe
{
    /// <summary>Times one synthesis of A, E and T noise (default instrument, 1-yr foreground with the exact response).</summary>
    /// <param name="samplesPerChannel">Samples per channel; 6,311,520 is one Julian year at 5 s.</param>
    /// <param name="dtSeconds">Sampling interval.</param>
    public static NoiseSynthesisMeasurement Measure(int samplesPerChannel, double dtSeconds = 5.0)
    {
        var model = new AetNoiseModel(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));
        // Fill the response-table entries the foreground needs outside the timed region: a one-time cost per process.
        model.FillPsd(AetChannel.A, 1e-4, 1e-4, stackalloc double[300]);
        var normals = new double[NoiseSynthesis.RequiredNormalCount(samplesPerChannel)];
        double golden = (Math.Sqrt(5.0) - 1.0) / 2.0, u = 0.5;
        for (int i = 0; i < normals.Length; i++)
        {
            u += golden;
            if (u >= 1.0) u -= 1.0;
            normals[i] = Math.Sqrt(3.0) * (2.0 * u - 1.0);
        }
        var clock = Stopwatch.StartNew();
        NoiseSynthesis.SynthesiseAet(model, samplesPerChannel, dtSeconds, 0.0, normals, normals, normals);
        return new NoiseSynthesisMeasurement(samplesPerChannel, clock.Elapsed.TotalSeconds);
    }
}
