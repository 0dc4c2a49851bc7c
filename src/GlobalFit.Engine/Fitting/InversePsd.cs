using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>1/S for A, E and T over every one-sided bin of the record: the weights the residual-data actor serves.</summary>
/// <param name="A">1/S_A per bin.</param>
/// <param name="E">1/S_E per bin.</param>
/// <param name="T">1/S_T per bin.</param>
/// <remarks>Bin 0 (DC) and any bin where the model's PSD is not positive and finite get weight 0, which excludes them
/// from every inner product rather than letting a non-finite weight poison a likelihood.</remarks>
public sealed record InversePsd(double[] A, double[] E, double[] T)
{
    /// <summary>Evaluates <paramref name="source"/> over bins 0 … <paramref name="binCount"/> − 1.</summary>
    public static InversePsd From(IPsdSource source, int binCount)
    {
        ArgumentNullException.ThrowIfNull(source);
        return new InversePsd(Channel(source, AetChannel.A, binCount), Channel(source, AetChannel.E, binCount), Channel(source, AetChannel.T, binCount));
    }

    private static double[] Channel(IPsdSource source, AetChannel channel, int binCount)
    {
        var values = new double[binCount];
        if (binCount <= 1) return values;
        Fill(source, channel, new BinWindow(1, binCount - 1), values.AsSpan(1));
        return values;
    }

    /// <summary>Writes the weights 1/S of <paramref name="channel"/> over <paramref name="bins"/>, by the rule of this
    /// type: a bin whose PSD is not positive and finite gets weight 0.</summary>
    /// <param name="source">The noise model.</param>
    /// <param name="channel">A, E or T.</param>
    /// <param name="bins">The bins.</param>
    /// <param name="weights">Output, <paramref name="bins"/>.Count values.</param>
    public static void Fill(IPsdSource source, AetChannel channel, BinWindow bins, Span<double> weights)
    {
        ArgumentNullException.ThrowIfNull(source);
        source.FillPsd(channel, bins, weights);
        for (int k = 0; k < weights.Length; k++)
            weights[k] = weights[k] > 0 && double.IsFinite(weights[k]) ? 1.0 / weights[k] : 0.0;
    }
}
