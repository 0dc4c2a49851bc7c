using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>θ_i ~ N(0, τ²) independently, one observation y_i ~ N(θ_i, σ²) per component. Posterior:
/// N(y_i τ²/(τ² + σ²), τ²σ²/(τ² + σ²)); evidence Π N(y_i; 0, τ² + σ²) (e.g. Gelman et al. 2013, Bayesian Data Analysis, 3rd ed., §2.5).</summary>
internal sealed class ConjugateGaussianModel : ITargetModel
{
    private readonly double[] _data;

    public ConjugateGaussianModel(double[] data, double priorSigma, double noiseSigma)
    {
        _data = data;
        PriorSigma = priorSigma;
        NoiseSigma = noiseSigma;
        Schema = new ParameterSchema(data.Select((_, i) =>
            new ParameterSpec($"theta{i}", string.Empty, double.NegativeInfinity, double.PositiveInfinity, BoundaryKind.Reject)));
    }

    public double PriorSigma { get; }

    public double NoiseSigma { get; }

    public ParameterSchema Schema { get; }

    public double PosteriorMean(int i) => _data[i] * PriorSigma * PriorSigma / (PriorSigma * PriorSigma + NoiseSigma * NoiseSigma);

    public double PosteriorVariance =>
        PriorSigma * PriorSigma * NoiseSigma * NoiseSigma / (PriorSigma * PriorSigma + NoiseSigma * NoiseSigma);

    public double LogEvidence()
    {
        double variance = PriorSigma * PriorSigma + NoiseSigma * NoiseSigma;
        return _data.Sum(y => -0.5 * y * y / variance - 0.5 * Math.Log(2 * Math.PI * variance));
    }

    public double LogPrior(ReadOnlySpan<double> theta)
    {
        double sum = 0.0;
        foreach (double value in theta)
        {
            sum += -0.5 * value * value / (PriorSigma * PriorSigma) - 0.5 * Math.Log(2 * Math.PI * PriorSigma * PriorSigma);
        }

        return sum;
    }

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        for (int i = 0; i < theta.Length; i++)
        {
            theta[i] = PriorSigma * random.NextGaussian();
        }
    }

    /// <summary>Normalised Gaussian likelihood, so that thermodynamic integration gives the true evidence.</summary>
    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        double sum = 0.0;
        for (int i = 0; i < theta.Length; i++)
        {
            double residual = _data[i] - theta[i];
            sum += -0.5 * residual * residual / (NoiseSigma * NoiseSigma) - 0.5 * Math.Log(2 * Math.PI * NoiseSigma * NoiseSigma);
        }

        return sum;
    }
}
