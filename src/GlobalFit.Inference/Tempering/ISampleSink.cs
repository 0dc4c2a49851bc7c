namespace GlobalFit.Inference.Tempering;

/// <summary>Receives every cold-chain state of a fixed-dimension sampler after each step.</summary>
/// <remarks>Called on the sampler's thread; the span is only valid during the call. Use a struct or sealed
/// class sink; <see cref="ParallelTemperingSampler{TModel}.Advance{TSink}"/> is generic so a struct sink is not boxed.</remarks>
public interface ISampleSink
{
    /// <summary>One cold-chain state.</summary>
    /// <param name="step">Step number after the step (1-based).</param>
    /// <param name="replica">Cold replica index, 0 ≤ replica &lt; ChainsPerTemperature.</param>
    /// <param name="position">The parameter vector.</param>
    /// <param name="logLikelihood">ln L at the position.</param>
    /// <param name="logPrior">ln p at the position.</param>
    void OnSample(long step, int replica, ReadOnlySpan<double> position, double logLikelihood, double logPrior);
}
