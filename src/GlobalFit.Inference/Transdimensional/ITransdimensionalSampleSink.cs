namespace GlobalFit.Inference.Transdimensional;

/// <summary>Receives every cold-chain configuration of a reversible-jump sampler after each step.</summary>
/// <remarks>Called on the sampler's thread; the span is only valid during the call.</remarks>
public interface ITransdimensionalSampleSink
{
    /// <summary>One cold-chain configuration.</summary>
    /// <param name="step">Step number after the step (1-based).</param>
    /// <param name="replica">Cold replica index.</param>
    /// <param name="sourceCount">Number of sources k.</param>
    /// <param name="sources">k × d values, source-major.</param>
    /// <param name="logLikelihood">ln L of the configuration.</param>
    /// <param name="logPrior">ln p(k) + Σ ln p(θ_j).</param>
    void OnSample(long step, int replica, int sourceCount, ReadOnlySpan<double> sources, double logLikelihood, double logPrior);
}
