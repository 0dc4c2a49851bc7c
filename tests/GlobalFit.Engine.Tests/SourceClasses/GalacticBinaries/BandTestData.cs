using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

/// <summary>Frequency-domain test data: stationary Gaussian noise of the instrument model plus injected binaries,
/// built directly on the bins a test needs (the time-domain simulator gives the same statistics but costs a full FFT of
/// the record, too slow for tests that only read a few hundred bins).</summary>
internal sealed class BandTestData
{
    public const double CadenceSeconds = 5.0;

    public BandTestData(double durationDays, BinWindow bins, IReadOnlyList<GalacticBinaryParameters> sources, ulong noiseSeed, bool noise = true)
    {
        Generator = new GalacticBinaryTemplateGenerator(durationDays * 86400.0, CadenceSeconds);
        Bins = bins;
        Sources = sources;
        var model = new AetNoiseModel(InstrumentNoiseSettings.Default);
        double df = Generator.FrequencyResolutionHz;
        A = new Complex[bins.Count];
        E = new Complex[bins.Count];
        InverseA = new double[bins.Count];
        InverseE = new double[bins.Count];
        var random = RandomStream.ForPath(noiseSeed, 7, 7);
        for (int k = 0; k < bins.Count; k++)
        {
            double f = (bins.First + k) * df;
            double sa = model.PsdA(f), se = model.PsdE(f);
            InverseA[k] = 1.0 / sa;
            InverseE[k] = 1.0 / se;
            // Each of the real and imaginary parts has variance S/(4Δf), so that <(n|h)²> = (h|h) for the inner product
            // 4Δf Re Σ a b*/S (Physics InnerProduct, after Cutler & Flanagan 1994).
            double sigmaA = Math.Sqrt(sa / (4.0 * df)), sigmaE = Math.Sqrt(se / (4.0 * df));
            if (noise)
            {
                A[k] = new Complex(sigmaA * random.NextGaussian(), sigmaA * random.NextGaussian());
                E[k] = new Complex(sigmaE * random.NextGaussian(), sigmaE * random.NextGaussian());
            }
        }
        foreach (var source in sources) Generator.AddResponse(source, bins, A, E, Span<Complex>.Empty);
    }

    public GalacticBinaryTemplateGenerator Generator { get; }

    public BinWindow Bins { get; }

    public IReadOnlyList<GalacticBinaryParameters> Sources { get; }

    public Complex[] A { get; }

    public Complex[] E { get; }

    public double[] InverseA { get; }

    public double[] InverseE { get; }

    public double DfHz => Generator.FrequencyResolutionHz;

    /// <summary>The data over a sub-window (copies), as a worker's residual.</summary>
    public GalacticBinaryBand Residual(BinWindow window, IEnumerable<GalacticBinaryParameters>? subtract = null)
    {
        int offset = window.First - Bins.First;
        var a = A.AsSpan(offset, window.Count).ToArray();
        var e = E.AsSpan(offset, window.Count).ToArray();
        foreach (var source in subtract ?? [])
        {
            var sa = new Complex[window.Count];
            var se = new Complex[window.Count];
            Generator.AddResponse(source, window, sa, se, Span<Complex>.Empty);
            for (int k = 0; k < window.Count; k++)
            {
                a[k] -= sa[k];
                e[k] -= se[k];
            }
        }
        return new GalacticBinaryBand(window, DfHz, a, e, InverseA.AsSpan(offset, window.Count).ToArray(), InverseE.AsSpan(offset, window.Count).ToArray());
    }

    /// <summary>Optimal SNR of a source over the data's bins (A and E).</summary>
    public double Snr(in GalacticBinaryParameters source)
    {
        var a = new Complex[Bins.Count];
        var e = new Complex[Bins.Count];
        Generator.AddResponse(source, Bins, a, e, Span<Complex>.Empty);
        return Math.Sqrt(InnerProduct.SquaredNorm(a, InverseA, DfHz) + InnerProduct.SquaredNorm(e, InverseE, DfHz));
    }

    /// <summary>Noise-weighted overlap of two sources' templates over the data's bins.</summary>
    public double Match(in GalacticBinaryParameters first, in GalacticBinaryParameters second)
    {
        var a1 = new Complex[Bins.Count];
        var e1 = new Complex[Bins.Count];
        var a2 = new Complex[Bins.Count];
        var e2 = new Complex[Bins.Count];
        Generator.AddResponse(first, Bins, a1, e1, Span<Complex>.Empty);
        Generator.AddResponse(second, Bins, a2, e2, Span<Complex>.Empty);
        return Physics.Series.Match.Overlap([a1, e1], [a2, e2], [InverseA, InverseE], DfHz);
    }

    /// <summary>A source with amplitude scaled to the requested SNR.</summary>
    public GalacticBinaryParameters WithSnr(GalacticBinaryParameters source, double snr) =>
        source with { Amplitude = source.Amplitude * snr / Snr(source) };
}
