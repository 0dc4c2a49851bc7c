using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>Births drawn from the (normalised) source prior: the simplest valid birth density.</summary>
public sealed class PriorBirthDensity : IBirthDensity
{
    private readonly IPriorDensity _prior;

    /// <summary>Creates the density.</summary>
    /// <param name="prior">The normalised source prior.</param>
    public PriorBirthDensity(IPriorDensity prior)
    {
        _prior = prior ?? throw new ArgumentNullException(nameof(prior));
    }

    /// <inheritdoc />
    public double Draw(Span<double> source, ref RandomStream random)
    {
        _prior.DrawFromPrior(source, ref random);
        return _prior.LogPrior(source);
    }

    /// <inheritdoc />
    public double LogDensity(ReadOnlySpan<double> source) => _prior.LogPrior(source);
}
