using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Targets;

/// <summary>A prior over a parameter vector that can be evaluated and sampled.</summary>
/// <remarks>
/// Where a prior appears in a ratio against a different density (prior-draw proposals, birth moves
/// whose birth density is not this prior, model-order posteriors in reversible jump) it must be
/// normalised; otherwise a constant offset is harmless.
/// </remarks>
public interface IPriorDensity
{
    /// <summary>ln p(θ); <see cref="double.NegativeInfinity"/> outside the support. Never throws for θ off the support.</summary>
    /// <param name="theta">Parameter vector.</param>
    /// <returns>The log prior density.</returns>
    double LogPrior(ReadOnlySpan<double> theta);

    /// <summary>Writes an independent draw from the prior into <paramref name="theta"/>.</summary>
    /// <param name="theta">Destination vector.</param>
    /// <param name="random">The caller's random stream.</param>
    void DrawFromPrior(Span<double> theta, ref RandomStream random);
}
