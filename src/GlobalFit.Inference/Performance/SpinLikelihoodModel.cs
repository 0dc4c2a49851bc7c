using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Performance;

/// <summary>
/// A stand-in model for overhead measurements: a unit Gaussian likelihood plus a fixed amount of
/// serial floating-point work that imitates an expensive template, under a uniform prior on [−5, 5]^d.
/// </summary>
/// <remarks>The work is a dependent multiply-add chain, so its cost per iteration is one FMA latency and
/// does not vectorise away; its result enters the likelihood at the 10⁻³⁰⁰ level so the JIT cannot drop it.</remarks>
public sealed class SpinLikelihoodModel : ITargetModel
{
    private const double Bound = 5.0;

    /// <summary>Creates the model.</summary>
    /// <param name="dimension">Parameter dimension d ≥ 1.</param>
    /// <param name="workIterations">Multiply-add iterations per likelihood call, ≥ 0.</param>
    public SpinLikelihoodModel(int dimension, int workIterations)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        ArgumentOutOfRangeException.ThrowIfNegative(workIterations);
        WorkIterations = workIterations;
        var parameters = new ParameterSpec[dimension];
        for (int i = 0; i < dimension; i++)
        {
            parameters[i] = new ParameterSpec($"x{i}", string.Empty, -Bound, Bound, BoundaryKind.Reflect);
        }

        Schema = new ParameterSchema(parameters);
    }

    /// <summary>Multiply-add iterations per likelihood call.</summary>
    public int WorkIterations { get; }

    /// <inheritdoc />
    public ParameterSchema Schema { get; }

    /// <inheritdoc />
    public double LogPrior(ReadOnlySpan<double> theta) =>
        Schema.Contains(theta) ? -theta.Length * Math.Log(2.0 * Bound) : double.NegativeInfinity;

    /// <inheritdoc />
    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        for (int i = 0; i < theta.Length; i++)
        {
            theta[i] = random.NextUniform(-Bound, Bound);
        }
    }

    /// <inheritdoc />
    /// <remarks>Compiled fully optimised from the first call, so that its cost does not change when tiered
    /// compilation promotes it in the middle of a calibration.</remarks>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        double sumOfSquares = 0.0;
        foreach (double value in theta)
        {
            sumOfSquares += value * value;
        }

        double accumulator = theta[0];
        for (int i = 0; i < WorkIterations; i++)
        {
            accumulator = Math.FusedMultiplyAdd(accumulator, 0.999999, 1e-7);
        }

        return -0.5 * sumOfSquares + 1e-300 * accumulator;
    }
}
