using MessagePack;

namespace GlobalFit.Engine.Fitting;

/// <summary>The cold-chain samples one worker drew in one iteration, in a class-neutral shape: each sample is a list
/// of sources, each source a vector of named parameters.</summary>
/// <param name="WorkerId">The worker that drew them.</param>
/// <param name="ClassId">Its source class (its module id).</param>
/// <param name="Iteration">The global-fit iteration (1-based).</param>
/// <param name="ParameterNames">Column names in the project's naming scheme (e.g. <c>f0_hz</c>).</param>
/// <param name="SourcesPerSample">Number of sources in each sample, in sample order.</param>
/// <param name="Values">All sources of all samples back to back, <see cref="ParameterNames"/>.Length values each.</param>
/// <param name="LogLikelihoods">ln L of each sample against the residual of its update.</param>
[MessagePackObject]
public sealed record SampleBlock(
    [property: Key(0)] string WorkerId,
    [property: Key(1)] string ClassId,
    [property: Key(2)] long Iteration,
    [property: Key(3)] string[] ParameterNames,
    [property: Key(4)] int[] SourcesPerSample,
    [property: Key(5)] double[] Values,
    [property: Key(6)] double[] LogLikelihoods)
{
    /// <summary>Number of samples.</summary>
    [IgnoreMember]
    public int SampleCount => SourcesPerSample.Length;
}
