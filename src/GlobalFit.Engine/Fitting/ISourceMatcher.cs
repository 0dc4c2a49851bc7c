using System.Collections.Immutable;

namespace GlobalFit.Engine.Fitting;

/// <summary>How a source class tells whether two parameter rows are the same signal: the noise-weighted overlap of their
/// templates, with the class's stated threshold. <c>globalfit compare</c> matches catalogued sources to injected ones
/// with it.</summary>
/// <remarks>Rows hold the class's parameters in <see cref="ParameterColumns"/> order.</remarks>
public interface ISourceMatcher
{
    /// <summary>The columns of a row, in order (the class's parameter columns).</summary>
    ImmutableArray<string> ParameterColumns { get; }

    /// <summary>Per column, the period of a periodic parameter (an angle summarised on a wrapped range), or 0.</summary>
    ImmutableArray<double> Periods { get; }

    /// <summary>Smallest overlap at which two rows are the same source, in (0, 1].</summary>
    double Threshold { get; }

    /// <summary>One sentence stating the overlap and the threshold, for reports.</summary>
    string Rule { get; }

    /// <summary>Whether the fit looked for a source with these parameters at all (e.g. its frequency lies in the fitted
    /// band); sources outside are left out of the comparison.</summary>
    /// <param name="row">The source's parameters.</param>
    bool Covers(ReadOnlySpan<double> row);

    /// <summary>The overlap of the two rows' templates: (h₁|h₂)/√((h₁|h₁)(h₂|h₂)), 0 when they share no bin.</summary>
    /// <param name="first">One row.</param>
    /// <param name="second">The other row.</param>
    double Overlap(ReadOnlySpan<double> first, ReadOnlySpan<double> second);
}
