using GlobalFit.Inference.Parameters;

namespace GlobalFit.Inference.Targets;

/// <summary>
/// The only view a fixed-dimension sampler has of a model: a parameter schema, a log prior, a log
/// likelihood and prior draws. The sampler targets p(θ) L(θ)^β at inverse temperature β.
/// </summary>
/// <remarks>
/// Implementations must be deterministic functions of θ (bit-identical resume relies on it). Samplers are
/// generic over the model (<c>where TModel : ITargetModel</c>), so a struct or sealed class model gets a
/// devirtualised loop. Calls come from one thread at a time per sampler.
/// </remarks>
public interface ITargetModel : IPriorDensity
{
    /// <summary>The parameters, in vector order, with their bounds and boundary kinds.</summary>
    ParameterSchema Schema { get; }

    /// <summary>ln L(θ) up to a constant; <see cref="double.NegativeInfinity"/> outside the support. Never throws for that.</summary>
    /// <param name="theta">Parameter vector.</param>
    /// <returns>The log likelihood.</returns>
    double LogLikelihood(ReadOnlySpan<double> theta);
}
