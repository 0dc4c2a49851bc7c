using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using MathNet.Numerics.LinearAlgebra;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>A multivariate Gaussian likelihood N(μ, Σ) under a wide uniform prior box, whose posterior is
/// the Gaussian itself to within the box truncation (the box is ≥ 12σ from the mean in every direction).</summary>
internal sealed class GaussianTarget : ITargetModel, IFisherInformation
{
    private readonly double[] _mean;
    private readonly double[] _precision;
    private readonly double _lower;
    private readonly double _upper;

    public GaussianTarget(double[] mean, Matrix<double> covariance, double lower, double upper)
    {
        _mean = mean;
        Covariance = covariance;
        Matrix<double> precision = covariance.Inverse();
        _precision = new double[mean.Length * mean.Length];
        for (int i = 0; i < mean.Length; i++)
        {
            for (int j = 0; j < mean.Length; j++)
            {
                _precision[i * mean.Length + j] = precision[i, j];
            }
        }

        _lower = lower;
        _upper = upper;
        var specs = new ParameterSpec[mean.Length];
        for (int i = 0; i < mean.Length; i++)
        {
            specs[i] = new ParameterSpec($"x{i}", string.Empty, lower, upper, BoundaryKind.Reject);
        }

        Schema = new ParameterSchema(specs);
    }

    public Matrix<double> Covariance { get; }

    public ParameterSchema Schema { get; }

    public int Dimension => _mean.Length;

    public double LogPrior(ReadOnlySpan<double> theta) =>
        Schema.Contains(theta) ? -Dimension * Math.Log(_upper - _lower) : double.NegativeInfinity;

    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        for (int i = 0; i < theta.Length; i++)
        {
            theta[i] = random.NextUniform(_lower, _upper);
        }
    }

    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        int d = Dimension;
        double quadratic = 0.0;
        for (int i = 0; i < d; i++)
        {
            double di = theta[i] - _mean[i];
            for (int j = 0; j < d; j++)
            {
                quadratic += di * _precision[i * d + j] * (theta[j] - _mean[j]);
            }
        }

        return -0.5 * quadratic;
    }

    public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix) => _precision.CopyTo(matrix);
}
