using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The result of one <see cref="GalacticBinaryBandWorker.Update"/>.</summary>
/// <param name="WindowIndex">The window.</param>
/// <param name="Template">The summed templates of the first cold chain's sources at the end of the update.</param>
/// <param name="Samples">Cold-chain configurations of this update, one every sample interval.</param>
/// <param name="Statistics">Counters and timing.</param>
public sealed record GalacticBinaryBandUpdate(
    int WindowIndex,
    WindowSpectra Template,
    ImmutableArray<GalacticBinarySample> Samples,
    GalacticBinaryBandStatistics Statistics);
