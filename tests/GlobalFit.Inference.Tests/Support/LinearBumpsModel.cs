using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Transdimensional;
using MathNet.Numerics.LinearAlgebra;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>
/// k identical "bumps", each with two amplitudes (a, b) multiplying fixed shapes φ₁ (a Gaussian bump) and φ₂
/// (its odd partner), observed on 24 points with white Gaussian noise σ; amplitudes ~ N(0, s²) i.i.d.;
/// k uniform on 0..K.
/// </summary>
/// <remarks>
/// Closed form (MacKay 2003, ITILA ch. 28, linear-Gaussian evidence; Bishop 2006, PRML eq. 3.86): with the
/// stacked design Φ_k = [Φ … Φ] (k copies of the 24×2 shape matrix), y ~ N(0, C_k) with
/// C_k = s² Φ_k Φ_kᵀ + σ² I = k s² Φ Φᵀ + σ² I, so Z_k = N(y; 0, C_k) and p(k | y) ∝ Z_k / (K + 1). The
/// posterior mean of every source's (a, b) given k is s² Φᵀ C_k⁻¹ y.
/// </remarks>
internal sealed class LinearBumpsModel : ITransdimensionalModel
{
    public const int Points = 24;
    private readonly double[] _data;
    private readonly double[] _shapeA = new double[Points];
    private readonly double[] _shapeB = new double[Points];
    private readonly double[] _model = new double[Points];

    public LinearBumpsModel(int maxSources, double amplitudeSigma, double noiseSigma, double trueA, double trueB, ulong seed)
    {
        MaxSources = maxSources;
        AmplitudeSigma = amplitudeSigma;
        NoiseSigma = noiseSigma;
        for (int i = 0; i < Points; i++)
        {
            double t = (i - 11.5) / 4.0;
            _shapeA[i] = Math.Exp(-0.5 * t * t);
            _shapeB[i] = t * Math.Exp(-0.5 * t * t);
        }

        var random = RandomStream.FromSeed(seed);
        _data = new double[Points];
        for (int i = 0; i < Points; i++)
        {
            _data[i] = trueA * _shapeA[i] + trueB * _shapeB[i] + noiseSigma * random.NextGaussian();
        }

        SourceSchema = new ParameterSchema(
        [
            new ParameterSpec("a", string.Empty, double.NegativeInfinity, double.PositiveInfinity, BoundaryKind.Reject),
            new ParameterSpec("b", string.Empty, double.NegativeInfinity, double.PositiveInfinity, BoundaryKind.Reject),
        ]);
        SourcePrior = new IsotropicGaussianPrior(amplitudeSigma);
    }

    public int MaxSources { get; }

    public double AmplitudeSigma { get; }

    public double NoiseSigma { get; }

    public ParameterSchema SourceSchema { get; }

    public IPriorDensity SourcePrior { get; }

    public double LogCountPrior(int count) => count >= 0 && count <= MaxSources ? -Math.Log(MaxSources + 1) : double.NegativeInfinity;

    public double LogLikelihood(ReadOnlySpan<double> sources, int count)
    {
        double sumA = 0.0, sumB = 0.0;
        for (int j = 0; j < count; j++)
        {
            sumA += sources[2 * j];
            sumB += sources[2 * j + 1];
        }

        double chiSquare = 0.0;
        for (int i = 0; i < Points; i++)
        {
            double residual = _data[i] - sumA * _shapeA[i] - sumB * _shapeB[i];
            chiSquare += residual * residual;
        }

        return -0.5 * chiSquare / (NoiseSigma * NoiseSigma) - 0.5 * Points * Math.Log(2 * Math.PI * NoiseSigma * NoiseSigma);
    }

    /// <summary>Closed-form p(k | y) for k = 0..K and the posterior mean of each source's (a, b) given k.</summary>
    public (double[] CountPosterior, double[][] AmplitudeMeans) ClosedForm()
    {
        var y = Vector<double>.Build.DenseOfArray(_data);
        var phi = Matrix<double>.Build.Dense(Points, 2, (i, c) => c == 0 ? _shapeA[i] : _shapeB[i]);
        double[] logEvidence = new double[MaxSources + 1];
        double[][] means = new double[MaxSources + 1][];
        for (int k = 0; k <= MaxSources; k++)
        {
            Matrix<double> covariance = k * AmplitudeSigma * AmplitudeSigma * phi * phi.Transpose()
                + NoiseSigma * NoiseSigma * Matrix<double>.Build.DenseIdentity(Points);
            var cholesky = covariance.Cholesky();
            Vector<double> solved = cholesky.Solve(y);
            logEvidence[k] = -0.5 * y.DotProduct(solved) - 0.5 * cholesky.DeterminantLn - 0.5 * Points * Math.Log(2 * Math.PI);
            means[k] = (AmplitudeSigma * AmplitudeSigma * phi.Transpose() * solved).ToArray();
        }

        double max = logEvidence.Max();
        double[] weights = logEvidence.Select(l => Math.Exp(l - max)).ToArray();
        double total = weights.Sum();
        return (weights.Select(w => w / total).ToArray(), means);
    }

    private sealed class IsotropicGaussianPrior(double sigma) : IPriorDensity
    {
        public double LogPrior(ReadOnlySpan<double> theta)
        {
            double sum = 0.0;
            foreach (double value in theta)
            {
                sum += -0.5 * value * value / (sigma * sigma) - 0.5 * Math.Log(2 * Math.PI * sigma * sigma);
            }

            return sum;
        }

        public void DrawFromPrior(Span<double> theta, ref RandomStream random)
        {
            for (int i = 0; i < theta.Length; i++)
            {
                theta[i] = sigma * random.NextGaussian();
            }
        }
    }
}
