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
/// C_t = s_d Cov + s_d ε I with s_d = 2.38²/d (Gelman, Roberts &amp; Gilks 1996); their theorem 2
/// gives ergodicity despite the adaptation. Before <see cref="MinimumObservations"/> points have been
/// seen, the walk uses an isotropic initial scale. The running moments use Welford's update and the
/// Cholesky factor is refreshed every <see cref="UpdateInterval"/> observations, so the O(d³) work is
/// amortised; each step costs O(d²). The proposal is symmetric, so the log ratio is zero.</para>
/// <para>A global scale factor exp(s) multiplies the steps and is adapted by a Robbins–Monro recursion
/// towards 23.4 % acceptance (Andrieu &amp; Thoms 2008, "A tutorial on adaptive MCMC", Statistics and
/// Computing 18, 343, algorithm 4, applied per batch of <see cref="ScaleBatch"/> proposals with gain 1/√(batch index)); without it a chain that starts far out with a poor
/// initial scale never moves enough to learn a covariance.</para>
/// <para>Implementation note: Haario et al. use the whole history, but the burn-in transient then inflates
/// the covariance for a long time (in a 10-D test the acceptance fell to 3 %). The moments are therefore
/// restarted at observation counts 200, 400, 800, …, so the estimate covers a recent part of the history
/// of at least a quarter of its length; the previous factor stays in use until the new window is half
/// as long as it will be at the next restart. Adaptation changes happen at geometrically spaced times, so it
/// still diminishes.</para>
/// <para>Not thread-safe; one instance per chain slot.</para>
/// </remarks>
public sealed class AdaptiveGaussianProposal : IAdaptiveProposal, IStatefulProposal
{
    /// <summary>Acceptance rate the global scale is adapted towards (Roberts, Gelman &amp; Gilks 1997).</summary>
    public const double TargetAcceptance = 0.234;

    /// <summary>Proposals per Robbins–Monro update of the global scale.</summary>
    public const int ScaleBatch = 20;

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
    private readonly double[] _previous;
    private readonly double[] _lastCurrent;
    private double _logScale;
    private double _globalScale = 1.0;
    private long _batchProposals;
    private long _batchAccepted;
    private long _batches;
    private bool _proposedThisStep;
    private long _observations;
    private long _windowCount;
    private long _windowMoves;
    private long _nextRestart = FirstRestart;
    private bool _hasFactor;

    private const long FirstRestart = 200;

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
        _previous = new double[_dimension];
        _lastCurrent = new double[_dimension];
    }

    /// <summary>Observations needed before the learned covariance replaces the initial scale: max(2d, 50).</summary>
    public int MinimumObservations => Math.Max(2 * _dimension, 50);

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        current[.._dimension].CopyTo(_lastCurrent);
        _proposedThisStep = true;
        double globalScale = _globalScale;
        if (!_hasFactor)
        {
            for (int i = 0; i < _dimension; i++)
            {
                candidate[i] = current[i] + globalScale * _initialSigma[i] * random.NextGaussian();
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
            candidate[i] = current[i] + globalScale * _scale * _step[i];
        }

        return 0.0;
    }

    /// <inheritdoc />
    public void Observe(ReadOnlySpan<double> position)
    {
        int d = _dimension;
        if (_proposedThisStep)
        {
            // Robbins–Monro step on the global log scale towards 23.4 % acceptance (Andrieu & Thoms 2008,
            // algorithm 4), applied once per batch of proposals so that the exp is amortised; an accepted
            // move is one that left the pre-proposal point.
            _proposedThisStep = false;
            _batchProposals++;
            if (!position[..d].SequenceEqual(_lastCurrent))
            {
                _batchAccepted++;
            }

            if (_batchProposals == ScaleBatch)
            {
                _batches++;
                double rate = (double)_batchAccepted / ScaleBatch;
                _logScale = Math.Clamp(_logScale + (rate - TargetAcceptance) / Math.Sqrt(_batches), -20.0, 5.0);
                _globalScale = Math.Exp(_logScale);
                _batchProposals = 0;
                _batchAccepted = 0;
            }
        }

        checked
        {
            _observations++;
            if (_observations == _nextRestart)
            {
                _nextRestart *= 2;
                _windowCount = 0;
                _windowMoves = 0;
                Array.Clear(_mean);
                Array.Clear(_scatter);
            }

            _windowCount++;
            if (!position[.._dimension].SequenceEqual(_previous))
            {
                _windowMoves++;
                position[.._dimension].CopyTo(_previous);
            }
        }

        double inverseCount = 1.0 / _windowCount;
        for (int i = 0; i < d; i++)
        {
            _delta[i] = position[i] - _mean[i];
            _mean[i] += _delta[i] * inverseCount;
        }

        // Welford: scatter += (x − old mean)(x − new mean)ᵀ; only the upper triangle is kept. Unchecked:
        // indices are bounded by d², fixed at construction, and this O(d²) loop dominates the proposal's cost.
        unchecked
        {
            for (int i = 0; i < d; i++)
            {
                double afterI = position[i] - _mean[i];
                Span<double> row = _scatter.AsSpan(i * d + i, d - i);
                ReadOnlySpan<double> delta = _delta.AsSpan(i, d - i);
                for (int j = 0; j < row.Length; j++)
                {
                    row[j] += delta[j] * afterI;
                }
            }
        }

        // After a restart the new window must reach half the length it will have at the next restart before
        // it replaces the factor: a covariance from a few autocorrelated points underestimates the spread,
        // which shrinks the steps and feeds back into the next window (seen as stalled 10-D chains).
        // A window in which the chain hardly moved (e.g. stuck far out at the start) has a near-zero
        // covariance; adopting it would freeze the chain for good, so it needs a minimum number of moves.
        long required = Math.Max(MinimumObservations, _nextRestart / 4);
        if (_windowCount >= required && _windowMoves >= required / 5 && _windowCount % UpdateInterval == 0)
        {
            RefreshFactor();
        }
    }

    /// <inheritdoc />
    public ProposalState CaptureState()
    {
        double[] reals = new double[_mean.Length + _scatter.Length + _factor.Length + _previous.Length + _lastCurrent.Length + 1];
        _mean.CopyTo(reals, 0);
        _scatter.CopyTo(reals, _mean.Length);
        _factor.CopyTo(reals, _mean.Length + _scatter.Length);
        _previous.CopyTo(reals, _mean.Length + _scatter.Length + _factor.Length);
        _lastCurrent.CopyTo(reals, _mean.Length + _scatter.Length + _factor.Length + _previous.Length);
        reals[^1] = _logScale;
        return new ProposalState(
            reals,
            [_observations, _windowCount, _nextRestart, _hasFactor ? 1 : 0, _windowMoves, _batchProposals, _batchAccepted, _batches, _proposedThisStep ? 1 : 0]);
    }

    /// <inheritdoc />
    public void RestoreState(ProposalState state)
    {
        ArgumentNullException.ThrowIfNull(state);
        if (state.Reals.Length != _mean.Length + _scatter.Length + _factor.Length + _previous.Length + _lastCurrent.Length + 1 || state.Integers.Length != 9)
        {
            throw new ArgumentException("Adaptive Gaussian state has the wrong shape.", nameof(state));
        }

        state.Reals.AsSpan(0, _mean.Length).CopyTo(_mean);
        state.Reals.AsSpan(_mean.Length, _scatter.Length).CopyTo(_scatter);
        state.Reals.AsSpan(_mean.Length + _scatter.Length, _factor.Length).CopyTo(_factor);
        state.Reals.AsSpan(_mean.Length + _scatter.Length + _factor.Length, _previous.Length).CopyTo(_previous);
        state.Reals.AsSpan(_mean.Length + _scatter.Length + _factor.Length + _previous.Length, _lastCurrent.Length).CopyTo(_lastCurrent);
        _logScale = state.Reals[^1];
        _globalScale = Math.Exp(_logScale);
        _observations = state.Integers[0];
        _windowCount = state.Integers[1];
        _nextRestart = state.Integers[2];
        _hasFactor = state.Integers[3] != 0;
        _windowMoves = state.Integers[4];
        _batchProposals = state.Integers[5];
        _batchAccepted = state.Integers[6];
        _batches = state.Integers[7];
        _proposedThisStep = state.Integers[8] != 0;
    }

    private void RefreshFactor()
    {
        int d = _dimension;
        double inverseDenominator = 1.0 / (_windowCount - 1);
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
