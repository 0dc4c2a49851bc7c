using System.Collections.Immutable;
using GlobalFit.Inference.Diagnostics;

namespace GlobalFit.Engine.Fitting;

/// <summary>How well one catalogued source's chain has mixed: split R̂ and bulk effective sample size per parameter over
/// its post-burn-in samples, and the fraction of its samples in each sky mode of its class.</summary>
/// <param name="SplitRhat">Rank-normalised split R̂ per parameter (the record's parameter order); NaN for a parameter
/// the sampler holds fixed or a source with fewer than <see cref="MinimumSamples"/> samples.</param>
/// <param name="EffectiveSampleSize">Bulk ESS per parameter, NaN where R̂ is.</param>
/// <param name="ModeNames">The class's sky modes (e.g. hemispheres); empty when the class defines none.</param>
/// <param name="ModeFractions">Fraction of the samples in each mode, summing to 1.</param>
/// <remarks>One source's samples come from one cold chain in sample order, so R̂ compares the chain's two halves
/// (Vehtari, Gelman, Simpson, Carpenter &amp; Bürkner 2021, Bayesian Analysis 16, 667, arXiv:1903.08008, via
/// <see cref="ConvergenceDiagnostics"/>): R̂ well above 1.01 says the halves disagree, i.e. the chain was still moving
/// between regions (a sky mode, say) when sampling ended.</remarks>
public sealed record SourceConvergence(ImmutableArray<double> SplitRhat, ImmutableArray<double> EffectiveSampleSize,
    ImmutableArray<string> ModeNames, ImmutableArray<double> ModeFractions)
{
    /// <summary>Fewest samples for which R̂ and ESS are computed (two halves of at least 4 draws each are needed).</summary>
    public const int MinimumSamples = 8;

    /// <summary>R̂ and bulk ESS of one scalar chain; NaN for both when it is shorter than <see cref="MinimumSamples"/> or
    /// constant (a parameter held fixed).</summary>
    /// <param name="draws">The draws in sampling order.</param>
    public static (double SplitRhat, double EffectiveSampleSize) Of(IReadOnlyList<double> draws)
    {
        ArgumentNullException.ThrowIfNull(draws);
        if (draws.Count < MinimumSamples) return (double.NaN, double.NaN);
        double first = draws[0];
        bool constant = true;
        for (int i = 1; i < draws.Count && constant; i++) constant = draws[i] == first;
        if (constant) return (double.NaN, double.NaN);
        double[][] chain = [[.. draws]];
        return (ConvergenceDiagnostics.SplitRhat(chain), ConvergenceDiagnostics.BulkEffectiveSampleSize(chain));
    }

    /// <summary>The largest R̂ over the parameters that have one (NaN if none has).</summary>
    public double MaxSplitRhat => SplitRhat.Where(double.IsFinite).DefaultIfEmpty(double.NaN).Max();

    /// <summary>The smallest ESS over the parameters that have one (NaN if none has).</summary>
    public double MinEffectiveSampleSize => EffectiveSampleSize.Where(double.IsFinite).DefaultIfEmpty(double.NaN).Min();
}
