using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>A/E(/T) frequency-domain values over one window of full-resolution bins: a worker's current template, or
/// the data a residual is cut from. Values follow the continuous-transform convention of
/// <see cref="FourierTransform"/>.</summary>
/// <param name="Bins">The bins held.</param>
/// <param name="A">Channel A.</param>
/// <param name="E">Channel E.</param>
/// <param name="T">Channel T, or null when the worker uses A and E only.</param>
/// <remarks>Treated as immutable once published: the residual-data actor keeps the arrays a worker sends and never
/// writes to them, and a worker builds new arrays for every update.</remarks>
public sealed record WindowSpectra(BinWindow Bins, Complex[] A, Complex[] E, Complex[]? T)
{
    /// <summary>An all-zero template over <paramref name="bins"/>.</summary>
    /// <param name="bins">The bins.</param>
    /// <param name="includeT">Whether to hold channel T.</param>
    public static WindowSpectra Zero(BinWindow bins, bool includeT) =>
        new(bins, new Complex[bins.Count], new Complex[bins.Count], includeT ? new Complex[bins.Count] : null);
}
