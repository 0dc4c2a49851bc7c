using System.Numerics;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

/// <summary>Fast template against the direct path on the same record, with A/E noise weighting.</summary>
internal static class InspiralComparison
{
    public static ExtremeMassRatioInspiralParameters Source(double e0, double nu0 = 8e-4, double spin = 0.5, double lambda = 0.9) =>
        new(1e6, 10, spin, nu0, e0, lambda, 0.4, 1.9, 1.1, 4.0, 1000, 0.3, 1.2, 2.5);

    public static (double Match, double Overlap, double SnrFast, double SnrDirect) Compare(
        ExtremeMassRatioInspiralTemplateGenerator fast, ExtremeMassRatioInspiralDirectWaveform direct, ExtremeMassRatioInspiralParameters p)
    {
        var (directA, directE) = direct.Spectra(p);
        int bins = directA.Length;
        double df = direct.FrequencyResolutionHz;
        // Band 0.05 mHz … Nyquist; below the instrument band the weights are negligible anyway.
        int first = Math.Max(1, (int)(5e-5 / df));
        var window = new BinWindow(first, bins - first);
        var fastA = new Complex[window.Count];
        var fastE = new Complex[window.Count];
        fast.AddResponse(p, window, fastA, fastE, Span<Complex>.Empty);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var psd = new double[window.Count];
        var weightA = new double[window.Count];
        var weightE = new double[window.Count];
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, weightA);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, weightE);
        var slowA = directA.AsSpan(window.First, window.Count).ToArray();
        var slowE = directE.AsSpan(window.First, window.Count).ToArray();
        Complex[][] f = [fastA, fastE], d = [slowA, slowE];
        double[][] w = [weightA, weightE];
        double match = Match.MaximisedOverTimeAndPhase(f, d, w, df);
        double overlap = Match.Overlap(f, d, w, df);
        double snrFast = Math.Sqrt(InnerProduct.SquaredNorm(fastA, weightA, df) + InnerProduct.SquaredNorm(fastE, weightE, df));
        double snrDirect = Math.Sqrt(InnerProduct.SquaredNorm(slowA, weightA, df) + InnerProduct.SquaredNorm(slowE, weightE, df));
        return (match, overlap, snrFast, snrDirect);
    }
}
