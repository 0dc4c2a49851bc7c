using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>A noise PSD the engine can read over any window of bins: the noise worker's current model, or a fixed
/// model.</summary>
public interface IPsdSource
{
    /// <summary>Writes the one-sided PSD S(f_k) of <paramref name="channel"/> at the bins of <paramref name="bins"/>.</summary>
    /// <param name="channel">A, E or T.</param>
    /// <param name="bins">The bins (f_k = k Δf).</param>
    /// <param name="psd">Output, <paramref name="bins"/>.Count values (1/Hz).</param>
    void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd);
}
