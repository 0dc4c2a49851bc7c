using System.Numerics;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using GlobalFit.Physics.Tests.Noise;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

/// <summary>Test support: a band of one month of A/E/T data around a source, with the default instrument noise.</summary>
internal sealed class FStatisticTestBand
{
    public FStatisticTestBand(GalacticBinaryTemplateGenerator generator, double centreHz, int extraBins)
    {
        Generator = generator;
        var bins = generator.TemplateBins(centreHz, 0.0);
        Window = new BinWindow(bins.First - extraBins, bins.Count + 2 * extraBins);
        double df = generator.FrequencyResolutionHz;
        Psd = new double[3][];
        var inverse = new double[3][];
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            Psd[c] = new double[Window.Count];
            SlowReferenceSpectra.Noise.FillPsd(channels[c], Window.First * df, df, Psd[c]);
            inverse[c] = new double[Window.Count];
            InnerProduct.InvertPsd(Psd[c], inverse[c]);
        }
        Data = [new Complex[Window.Count], new Complex[Window.Count], new Complex[Window.Count]];
        Band = new GalacticBinaryBand(Window, df, Data[0], Data[1], inverse[0], inverse[1], Data[2], inverse[2]);
        BandAE = new GalacticBinaryBand(Window, df, Data[0], Data[1], inverse[0], inverse[1]);
    }

    public GalacticBinaryTemplateGenerator Generator { get; }
    public BinWindow Window { get; }
    public double[][] Psd { get; }
    public Complex[][] Data { get; }
    public GalacticBinaryBand Band { get; }
    public GalacticBinaryBand BandAE { get; }

    public void Clear()
    {
        foreach (var channel in Data) Array.Clear(channel);
    }

    public void AddSignal(GalacticBinaryParameters source) => Generator.AddResponse(source, Window, Data[0], Data[1], Data[2]);

    /// <summary>Adds Gaussian noise with E|n_k|^2 = (T/2) S_k (one-sided PSD in the FourierTransform convention) from seeded normals.</summary>
    public void AddNoise(int seed)
    {
        var normals = StandardNormals.Draw(seed, 6 * Window.Count);
        double halfT = 0.5 / Generator.FrequencyResolutionHz;
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < Window.Count; k++)
            {
                double sigma = Math.Sqrt(0.5 * halfT * Psd[c][k]);
                Data[c][k] += new Complex(sigma * normals[2 * (c * Window.Count + k)], sigma * normals[2 * (c * Window.Count + k) + 1]);
            }
    }

    /// <summary>(h|h) over the band in A, E and, if asked, T.</summary>
    public double SquaredSnr(GalacticBinaryParameters source, bool includeT)
    {
        var h = new[] { new Complex[Window.Count], new Complex[Window.Count], new Complex[Window.Count] };
        Generator.AddResponse(source, Window, h[0], h[1], h[2]);
        double sum = 0;
        var band = includeT ? Band : BandAE;
        sum += InnerProduct.SquaredNorm(h[0], band.InverseA, band.DfHz) + InnerProduct.SquaredNorm(h[1], band.InverseE, band.DfHz);
        if (includeT) sum += InnerProduct.SquaredNorm(h[2], band.InverseT, band.DfHz);
        return sum;
    }
}
