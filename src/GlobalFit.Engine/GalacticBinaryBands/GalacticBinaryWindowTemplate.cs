using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.GalacticBinaryBands;

/// <summary>The summed A/E(/T) templates of the sources one worker holds, over its padded window: what the other
/// windows subtract from the data to form their residuals.</summary>
/// <param name="Bins">The padded bins.</param>
/// <param name="A">Channel A.</param>
/// <param name="E">Channel E.</param>
/// <param name="T">Channel T, or null when the worker runs on A and E.</param>
public sealed record GalacticBinaryWindowTemplate(BinWindow Bins, Complex[] A, Complex[] E, Complex[]? T);
