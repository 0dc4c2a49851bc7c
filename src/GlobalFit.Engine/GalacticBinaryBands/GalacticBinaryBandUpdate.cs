using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.GalacticBinaryBands;

/// <summary>The result of one <see cref="GalacticBinaryBandWorker.Update"/>.</summary>
/// <param name="WindowIndex">The window.</param>
/// <param name="Bins">The padded bins the templates cover.</param>
/// <param name="TemplateA">Channel A of the sum of the first cold chain's sources.</param>
/// <param name="TemplateE">Channel E of that sum.</param>
/// <param name="TemplateT">Channel T of that sum, or null when the worker runs on A and E.</param>
/// <param name="Samples">Cold-chain configurations of this update, one every sample interval.</param>
/// <param name="Statistics">Counters and timing.</param>
public sealed record GalacticBinaryBandUpdate(
    int WindowIndex,
    BinWindow Bins,
    Complex[] TemplateA,
    Complex[] TemplateE,
    Complex[]? TemplateT,
    ImmutableArray<GalacticBinarySample> Samples,
    GalacticBinaryBandStatistics Statistics);
