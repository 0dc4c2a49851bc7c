using GlobalFit.Inference.LinearAlgebra;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Proposals;

/// <summary>
/// Adaptive Metropolis: a Gaussian random walk whose covariance is the running covariance of the chain
/// scaled by 2.38²/d.
/// </summary>
/// <remarks>
/// <para>Haario, Saksman &amp; Tamminen (2001), "An adaptive Metropolis algorithm", Bernoulli 7(2), 223:
/// C_t = s_d Cov(x_0..x_t) + s_d ε I with s_d = 2.38²/d (Gelman, Roberts &amp; Gilks 1996); their theorem 2
/// gives ergodicity despite the adaptation. Before <see cref="MinimumObservations"/> points have been
/// seen, the walk uses an isotropic initial scale. The running moments use Welford's update and the
/// Cholesky factor is refreshed every <see cref="UpdateInterval"/> observations, so the O(d³) work is
/// amortised; each step costs O(d²). The proposal is symmetric, so the log ratio is zero.</para>
/// <para>Not thread-safe; one instance per chain slot.</para>
/// </remarks>
public sealed class AdaptiveGaussianProposal : IAdaptiveProposal, IStatefulProposal
{
    /// <summary>Observations between Cholesky refreshes.</summary>
    public const int UpdateInterval = 100;

    private readonly int _dimension;
    private readonly double _scale;
    private readonly double[] _initialSigma;
    private readonly double[] _mean;
    private readonly double[] _scatter;
    private readonly double[] _factor;
    private readonly double[] _candidateFactor;
    private readonly double[] _delta;
    private readonly double[] _normal;
    private readonly double[] _step;
    private long _observations;
    private bool _hasFactor;

    /// <summary>Creates the proposal for vectors described by <paramref name="schema"/>.</summary>
    /// <param name="schema">The schema; finite ranges give initial step sizes of 1 % of the range, infinite ones 0.1.</param>
    public AdaptiveGaussianProposal(ParameterSchema schema)
    {
        ArgumentNullException.ThrowIfNull(schema);
        _dimension = schema.Dimension;
        _scale = 2.38 / Math.Sqrt(_dimension);
        _initialSigma = new double[_dimension];
        for (int i = 0; i < _dimension; i++)
        {
            double width = schema.Parameters[i].Width;
            _initialSigma[i] = double.IsFinite(width) ? 0.01 * width : 0.1;
        }

        _mean = new double[_dimension];
        _scatter = new double[_dimension * _dimension];
        _factor = new double[_dimension * _dimension];
        _candidateFactor = new double[_dimension * _dimension];
        _delta = new double[_dimension];
        _normal = new double[_dimension];
        _step = new double[_dimension];
    }

    /// <summary>Observations needed before the learned covariance replaces the initial scale: max(2d, 50).</summary>
    public int MinimumObservations => Math.Max(2 * _dimension, 50);

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        if (!_hasFactor)
        {
            for (int i = 0; i < _dimension; i++)
            {
                candidate[i] = current[i] + _initialSigma[i] * random.NextGaussian();
            }

            return 0.0;
        }

        for (int i = 0; i < _dimension; i++)
        {
            _normal[i] = random.NextGaussian();
        }

        SmallDenseMatrix.LowerTimesVector(_factor, _dimension, _normal, _step);
        for (int i = 0; i < _dimension; i++)
        {
            candidate[i] = current[i] + _scale * _step[i];
        }

        return 0.0;
    }

    /// <inheritdoc />
    public void Observe(ReadOnlySpan<double> position)
    {
        int d = _dimension;
        checked
        {
            _observations++;
        }

        double inverseCount = 1.0 / _observations;
        for (int i = 0; i < d; i++)
        {
            _delta[i] = position[i] - _mean[i];
            _mean[i] += _delta[i] * inverseCount;
        }

        // Welford: scatter += (x − old mean)(x − new mean)ᵀ; only the upper triangle is kept.
        for (int i = 0; i < d; i++)
        {
            double afterI = position[i] - _mean[i];
            for (int j = i; j < d; j++)
            {
                _scatter[i * d + j] += _delta[j] * afterI;
            }
        }

        if (_observations >= MinimumObservations && _observations % UpdateInterval == 0)
        {
            RefreshFactor();
        }
    }

    /// <inheritdoc />
    public ProposalState CaptureState()
    {
        double[] reals = new double[_mean.Length + _scatter.Length + _factor.Length];
        _mean.CopyTo(reals, 0);
        _scatter.CopyTo(reals, _mean.Length);
        _factor.CopyTo(reals, _mean.Length + _scatter.Length);
        return new ProposalState(reals, [_observations, _hasFactor ? 1 : 0]);
    }

    /// <inheritdoc />
    public void RestoreState(ProposalState state)
    {
        ArgumentNullException.ThrowIfNull(state);
        if (state.Reals.Length != _mean.Length + _scatter.Length + _factor.Length || state.Integers.Length != 2)
        {
            throw new ArgumentException("Adaptive Gaussian state has the wrong shape.", nameof(state));
        }

        state.Reals.AsSpan(0, _mean.Length).CopyTo(_mean);
        state.Reals.AsSpan(_mean.Length, _scatter.Length).CopyTo(_scatter);
        state.Reals.AsSpan(_mean.Length + _scatter.Length, _factor.Length).CopyTo(_factor);
        _observations = state.Integers[0];
        _hasFactor = state.Integers[1] != 0;
    }

    private void RefreshFactor()
    {
        int d = _dimension;
        double inverseDenominator = 1.0 / (_observations - 1);
        double largestVariance = 0.0;
        for (int i = 0; i < d; i++)
        {
            largestVariance = Math.Max(largestVariance, _scatter[i * d + i] * inverseDenominator);
        }

        // Haario's ε I keeps the factor defined when the chain has not yet moved in some direction.
        double regulariser = 1e-10 * largestVariance + double.Epsilon;
        for (int i = 0; i < d; i++)
        {
            for (int j = 0; j < d; j++)
            {
                double covariance = (i <= j ? _scatter[i * d + j] : _scatter[j * d + i]) * inverseDenominator;
                _candidateFactor[i * d + j] = i == j ? covariance + regulariser : covariance;
            }
        }

        // A failed factorisation (e.g. a chain stuck so far) keeps the previous factor.
        if (SmallDenseMatrix.CholeskyInPlace(_candidateFactor, d))
        {
            _candidateFactor.CopyTo(_factor, 0);
            _hasFactor = true;
        }
    }
}
