using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>What a worker samples against in one update: the data minus every <em>other</em> worker's current
/// template over the worker's window, with the current inverse noise PSDs there.</summary>
/// <param name="Bins">The worker's window.</param>
/// <param name="DfHz">Bin spacing 1/T.</param>
/// <param name="A">Residual, channel A.</param>
/// <param name="E">Residual, channel E.</param>
/// <param name="T">Residual, channel T, or null when the worker uses A and E only.</param>
/// <param name="InverseA">1/S_A per bin (0 excludes a bin).</param>
/// <param name="InverseE">1/S_E per bin.</param>
/// <param name="InverseT">1/S_T per bin, given exactly when <paramref name="T"/> is.</param>
/// <remarks>Fresh arrays for every request: the worker may keep and read them for the duration of its update.</remarks>
public sealed record WorkerResidual(BinWindow Bins, double DfHz, Complex[] A, Complex[] E, Complex[]? T,
    double[] InverseA, double[] InverseE, double[]? InverseT);
