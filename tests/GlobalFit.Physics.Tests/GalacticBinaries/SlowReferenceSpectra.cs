using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

/// <summary>Test support: the brute-force A/E/T spectra of a source (the yardstick) and the comparison measures.</summary>
internal static class SlowReferenceSpectra
{
    public static AetNoiseModel Noise { get; } = new(InstrumentNoiseSettings.Default);

    /// <summary>Full-cadence time-domain response (exact links and delays), FFT'd with the continuous convention, cut
    /// to <paramref name="window"/>, channels A, E, T.</summary>
    public static Complex[][] Compute(GalacticBinaryParameters p, IConstellationOrbits orbits, double t0, double dt, int count, BinWindow window)
    {
        var strain = new MonochromaticBinaryStrain(p.FrequencyHz, p.FrequencyDerivativeHzS, p.Amplitude, p.InclinationRad,
            p.PolarisationRad, p.InitialPhaseRad, new SkyPosition(p.EclipticLatitudeRad, p.EclipticLongitudeRad));
        var response = SlowReferenceResponse.Compute(strain, orbits, t0, dt, count);
        var result = new Complex[3][];
        int c = 0;
        foreach (var channel in response.Aet.Channels)
        {
            var spectrum = FourierTransform.Forward(channel);
            result[c++] = spectrum.Values.AsSpan(window.First, window.Count).ToArray();
        }
        return result;
    }

    /// <summary>The fast template on <paramref name="window"/>, channels A, E, T.</summary>
    public static Complex[][] Fast(GalacticBinaryTemplateGenerator generator, GalacticBinaryParameters p, BinWindow window)
    {
        var result = new[] { new Complex[window.Count], new Complex[window.Count], new Complex[window.Count] };
        generator.AddResponse(p, window, result[0], result[1], result[2]);
        return result;
    }

    /// <summary>Inverse PSDs of A, E, T of the default instrument on the window.</summary>
    public static double[][] InversePsd(BinWindow window, double dfHz)
    {
        var result = new double[3][];
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            var psd = new double[window.Count];
            Noise.FillPsd(channels[c], window.First * dfHz, dfHz, psd);
            result[c] = new double[window.Count];
            InnerProduct.InvertPsd(psd, result[c]);
        }
        return result;
    }

    /// <summary>A seeded random source: f0 log-uniform in [fLow, fHigh], sky isotropic, orientation uniform, A = 1e-21,
    /// ḟ from the quadrupole law for a chirp mass uniform in [0.2, 1] M_sun.</summary>
    public static GalacticBinaryParameters RandomSource(Random random, double fLowHz, double fHighHz)
    {
        double f0 = fLowHz * Math.Pow(fHighHz / fLowHz, random.NextDouble());
        double chirpMass = 0.2 + 0.8 * random.NextDouble();
        return new GalacticBinaryParameters(
            f0, QuadrupoleBinary.FrequencyDerivativeHzS(chirpMass, f0), 1e-21,
            Math.Asin(2.0 * random.NextDouble() - 1.0), 2.0 * Math.PI * random.NextDouble(),
            Math.Acos(2.0 * random.NextDouble() - 1.0), Math.PI * random.NextDouble(), 2.0 * Math.PI * random.NextDouble());
    }
}
