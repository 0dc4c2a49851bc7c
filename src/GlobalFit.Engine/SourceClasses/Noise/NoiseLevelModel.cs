using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise levels as a sampler target: a uniform prior on the box of <see cref="NoiseParameterLayout"/>
/// and the Whittle likelihood of the A/E group plus, when fitted, the T group.</summary>
/// <remarks>One likelihood evaluation is one vectorised pass over the bins of each group and allocates nothing.
/// The groups' residual power is set by the worker before each update and stays fixed during it.</remarks>
internal sealed class NoiseLevelModel : ITargetModel
{
    private readonly NoiseParameterLayout _layout;
    private readonly double _logPriorDensity;

    public NoiseLevelModel(NoiseParameterLayout layout, NoiseChannelGroup ae, NoiseChannelGroup? t)
    {
        _layout = layout;
        Ae = ae;
        T = t;
        double logVolume = 0;
        foreach (var spec in layout.Schema.Parameters) logVolume += Math.Log(spec.Width);
        _logPriorDensity = -logVolume;
    }

    /// <summary>The A/E group.</summary>
    public NoiseChannelGroup Ae { get; }

    /// <summary>The T group, or null when T is not fitted.</summary>
    public NoiseChannelGroup? T { get; }

    public ParameterSchema Schema => _layout.Schema;

    // Uniform and normalised (prior draws and their ratios need the normalisation).
    public double LogPrior(ReadOnlySpan<double> theta) => Schema.Contains(theta) ? _logPriorDensity : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        for (int i = 0; i < theta.Length; i++)
        {
            var spec = Schema.Parameters[i];
            theta[i] = random.NextUniform(spec.Lower, spec.Upper);
        }
    }

    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        if (!Schema.Contains(theta)) return double.NegativeInfinity;
        Span<double> coefficients = stackalloc double[3];
        _layout.AeCoefficients(theta, coefficients);
        double logLikelihood = Ae.LogLikelihood(coefficients[..Ae.ShapeCount]);
        if (T is not null)
        {
            _layout.TCoefficients(theta, coefficients);
            logLikelihood += T.LogLikelihood(coefficients[..2]);
        }
        return logLikelihood;
    }
}
