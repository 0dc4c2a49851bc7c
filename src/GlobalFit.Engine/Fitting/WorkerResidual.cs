using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>What a worker samples against in one update: the data minus every <em>other</em> worker's current
/// template over the worker's window, with the current inverse noise PSDs there.</summary>
/// <param name="Spectra">The residual over the worker's window (T exactly when the worker uses it).</param>
/// <param name="DfHz">Bin spacing 1/T.</param>
/// <param name="InverseA">1/S_A per bin (0 excludes a bin, see <see cref="InversePsd"/>).</param>
/// <param name="InverseE">1/S_E per bin.</param>
/// <param name="InverseT">1/S_T per bin, given exactly when <paramref name="Spectra"/> holds T.</param>
/// <remarks>Fresh arrays for every request: the worker may keep and read them for the duration of its update.</remarks>
public sealed record WorkerResidual(WindowSpectra Spectra, double DfHz, double[] InverseA, double[] InverseE, double[]? InverseT)
{
    /// <summary>The worker's window.</summary>
    public BinWindow Bins => Spectra.Bins;
}
