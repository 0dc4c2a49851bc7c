using System.Collections.Immutable;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>One catalogued galactic binary: the samples that were associated with it, summarised.</summary>
/// <param name="Confidence">Fraction of the samples in which the entry is present, in [0, 1].</param>
/// <param name="MemberCount">Number of sample sources associated with it.</param>
/// <param name="Median">Per-parameter medians.</param>
/// <param name="Lower">Per-parameter 5 % quantiles (the lower end of the central 90 % interval).</param>
/// <param name="Upper">Per-parameter 95 % quantiles.</param>
/// <param name="MedianSnr">Median optimal SNR of the members (A and E, with the builder's noise weights).</param>
/// <param name="Members">The associated sample sources themselves (the entry's posterior samples).</param>
/// <param name="Convergence">Split R̂ and ESS per column of <see cref="GalacticBinaryParameters.TableColumnNames"/> over
/// the members in sampling order, and the fractions of members in the sky modes of <see cref="GalacticBinarySkyModes"/>.</param>
/// <remarks>λ, ψ and φ0 are summarised on their wrapped ranges ([0, 2π), [0, π), [0, 2π)) like linear quantities, so an
/// entry whose samples straddle the wrap point gets a wide interval; f0, ḟ, A, β and ι are linear.</remarks>
public sealed record CatalogueEntry(
    double Confidence,
    int MemberCount,
    GalacticBinaryParameters Median,
    GalacticBinaryParameters Lower,
    GalacticBinaryParameters Upper,
    double MedianSnr,
    ImmutableArray<GalacticBinaryParameters> Members,
    Fitting.SourceConvergence Convergence);
