namespace GlobalFit.Inference.Performance;

/// <summary>Result of <see cref="SamplerOverheadProbe.Measure"/>.</summary>
/// <param name="Dimension">Parameter dimension of the probe model.</param>
/// <param name="Steps">Timed sampler steps.</param>
/// <param name="LikelihoodNanoseconds">Mean cost of the model alone per step (one likelihood and one prior call), in ns.</param>
/// <param name="NanosecondsPerStep">Mean cost of one sampler step (proposal, prior, likelihood, accept/reject, bookkeeping), in ns.</param>
/// <param name="OverheadFraction">(step − likelihood) / likelihood; the target is ≤ 0.05.</param>
/// <param name="AllocatedBytesPerStep">Managed bytes allocated per step on the sampling thread; the target is 0.</param>
public sealed record SamplerOverheadReport(
    int Dimension,
    int Steps,
    double LikelihoodNanoseconds,
    double NanosecondsPerStep,
    double OverheadFraction,
    double AllocatedBytesPerStep);
