using System.Numerics;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>Optimal signal-to-noise ratio of an inspiral, <c>√((h|h)_A + (h|h)_E)</c>.</summary>
/// <remarks>The template comes from <see cref="ExtremeMassRatioInspiralTemplateGenerator"/> over its own bins; T carries
/// nothing in the long-wavelength response. Allocates two windows of the template's size: meant for injections and
/// catalogues, not for sampler loops.</remarks>
public static class ExtremeMassRatioInspiralSnr
{
    /// <summary>Optimal SNR of <paramref name="source"/> against the PSDs of <paramref name="noise"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid.</exception>
    public static double Optimal(ExtremeMassRatioInspiralTemplateGenerator generator, in ExtremeMassRatioInspiralParameters source, AetNoiseModel noise)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(noise);
        var window = generator.TemplateBins(source);
        if (window.Count == 0) return 0.0;
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        generator.AddResponse(source, window, a, e, Span<Complex>.Empty);
        double df = generator.FrequencyResolutionHz;
        var psd = new double[window.Count];
        var weight = new double[window.Count];
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, weight);
        double snr2 = InnerProduct.SquaredNorm(a, weight, df);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, weight);
        snr2 += InnerProduct.SquaredNorm(e, weight, df);
        return Math.Sqrt(snr2);
    }
}
