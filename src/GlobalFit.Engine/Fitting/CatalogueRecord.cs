using System.Collections.Immutable;

namespace GlobalFit.Engine.Fitting;

/// <summary>One catalogued source in a class-neutral shape, ready for export.</summary>
/// <param name="Id">Stable id within the run (class prefix and rank).</param>
/// <param name="ClassId">Its source class.</param>
/// <param name="Confidence">Fraction of the samples in which the source is present, in [0, 1].</param>
/// <param name="Snr">Median optimal SNR of its samples against the final noise model.</param>
/// <param name="ParameterNames">Parameter columns.</param>
/// <param name="Median">Per-parameter medians.</param>
/// <param name="Lower">Per-parameter 5 % quantiles.</param>
/// <param name="Upper">Per-parameter 95 % quantiles.</param>
/// <param name="Samples">Its posterior samples, one row of <paramref name="ParameterNames"/> per sample, back to back.</param>
public sealed record CatalogueRecord(string Id, string ClassId, double Confidence, double Snr, ImmutableArray<string> ParameterNames,
    ImmutableArray<double> Median, ImmutableArray<double> Lower, ImmutableArray<double> Upper, ImmutableArray<double> Samples)
{
    /// <summary>How well the source's chain mixed; null for a class that does not report it (e.g. the noise row).</summary>
    public SourceConvergence? Convergence { get; init; }

    /// <summary>Number of posterior samples.</summary>
    public int SampleCount => ParameterNames.Length == 0 ? 0 : Samples.Length / ParameterNames.Length;
}
