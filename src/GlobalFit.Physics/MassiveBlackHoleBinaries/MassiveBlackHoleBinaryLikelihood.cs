using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The full (bin-by-bin) log-likelihood ratio of one massive black-hole binary against data on a window:
/// <c>ln Λ = Σ_c [(d_c|h_c) − ½(h_c|h_c)]</c> over A, E, T.</summary>
/// <remarks>Whittle likelihood of Gaussian stationary noise (e.g. Cutler &amp; Flanagan 1994, PRD 49, 2658) with the inner product
/// of <see cref="InnerProduct"/>; the template is rendered on every bin of the window. This is the reference the heterodyned
/// likelihood approximates. Holds template buffers: one instance per thread. No allocation per call.</remarks>
public sealed class MassiveBlackHoleBinaryLikelihood
{
    private readonly Complex[][] _template;

    /// <summary>Creates the likelihood of <paramref name="data"/>.</summary>
    /// <exception cref="ArgumentException">The generator cannot hold the window.</exception>
    public MassiveBlackHoleBinaryLikelihood(MassiveBlackHoleBinaryTemplateGenerator generator, MassiveBlackHoleBinaryData data)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(data);
        if (generator.Capacity < data.Window.Count)
            throw new ArgumentException($"generator capacity {generator.Capacity} is below the window's {data.Window.Count} bins", nameof(generator));
        Generator = generator;
        Data = data;
        _template = [new Complex[data.Window.Count], new Complex[data.Window.Count], new Complex[data.Window.Count]];
    }

    /// <summary>The template generator.</summary>
    public MassiveBlackHoleBinaryTemplateGenerator Generator { get; }

    /// <summary>The data.</summary>
    public MassiveBlackHoleBinaryData Data { get; }

    /// <summary>ln Λ of <paramref name="source"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside the waveform's range.</exception>
    public double LogLikelihoodRatio(in MassiveBlackHoleBinaryParameters source)
    {
        Generator.RenderBins(source, Data.Window, Data.DfHz, _template[0], _template[1], _template[2]);
        double total = 0;
        for (int c = 0; c < 3; c++)
            total += InnerProduct.Real(Data.Channels[c], _template[c], Data.InversePsd[c], Data.DfHz)
                     - 0.5 * InnerProduct.SquaredNorm(_template[c], Data.InversePsd[c], Data.DfHz);
        return total;
    }

    /// <summary>Optimal SNR <c>√(Σ_c (h_c|h_c))</c> of <paramref name="source"/> with the data's weights.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside the waveform's range.</exception>
    public double OptimalSnr(in MassiveBlackHoleBinaryParameters source)
    {
        Generator.RenderBins(source, Data.Window, Data.DfHz, _template[0], _template[1], _template[2]);
        double total = 0;
        for (int c = 0; c < 3; c++)
            total += InnerProduct.SquaredNorm(_template[c], Data.InversePsd[c], Data.DfHz);
        return Math.Sqrt(total);
    }

    /// <summary>The template last rendered (A, E, T), for callers that need it after a call (read-only use).</summary>
    public ReadOnlySpan<Complex> LastTemplate(int channel) => _template[channel];
}
