using System.Numerics;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The F-statistic at one intrinsic point and the pieces it is built from.</summary>
/// <remarks>Notation of <see cref="FStatistic"/>: <c>U = (u|u)</c>, <c>V = (v|v)</c>,
/// <c>W = 4Δf Σ u v*/S</c>, <c>n_u = 4Δf Σ d u*/S</c>, <c>n_v = 4Δf Σ d v*/S</c>, summed over the channels. A value
/// with <see cref="IsDefined"/> false (template outside the band, or degenerate U V − |W|²) has F = 0.</remarks>
/// <param name="Value">F, the log-likelihood ratio maximised over the four amplitudes; 2F is χ² with 4 degrees of
/// freedom in pure noise.</param>
/// <param name="U">(u|u).</param>
/// <param name="V">(v|v).</param>
/// <param name="W">The complex cross term.</param>
/// <param name="ProjectionPlus">n_u.</param>
/// <param name="ProjectionCross">n_v.</param>
/// <param name="Amplitudes">The maximum-likelihood amplitudes (P̂, Q̂) = G⁻¹(n_u, n_v).</param>
public readonly record struct FStatisticResult(
    double Value,
    double U,
    double V,
    Complex W,
    Complex ProjectionPlus,
    Complex ProjectionCross,
    FStatisticAmplitudes Amplitudes)
{
    /// <summary>False when the statistic could not be formed (no overlap with the band or a singular M).</summary>
    public bool IsDefined => U > 0 && V > 0 && U * V - W.Real * W.Real - W.Imaginary * W.Imaginary > 0;
}
