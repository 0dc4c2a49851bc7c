using GlobalFit.Inference.LinearAlgebra;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Proposals;

/// <summary>
/// Jumps along one eigen-direction of the Fisher matrix at a time, with a step of N(0, 1)/√(β λ_i).
/// </summary>
/// <remarks>
/// <para>The Fisher matrix approximates the inverse posterior covariance of a high-SNR signal, so its
/// eigenvectors v_i and eigenvalues λ_i give natural jump directions and scales (Cornish &amp; Crowder 2005,
/// Phys. Rev. D 72, 043005, §III; Littenberg &amp; Cornish 2009 use the same move for binaries of the Galaxy).
/// At inverse temperature β the likelihood is flattened, so steps grow by 1/√β; β is floored at 10⁻⁶ and
/// eigenvalues at 10⁻¹² of the largest so that steps stay finite.</para>
/// <para>The matrix is computed at the chain's current point on the first proposal and then every
/// <c>refreshInterval</c> observations (never again if 0). Between refreshes the proposal is symmetric
/// (log ratio zero); refreshing at the current point is a form of adaptation, so keep refreshes rare or
/// stop them after burn-in when exactness matters. Not thread-safe; one instance per chain slot.</para>
/// </remarks>
public sealed class FisherEigenProposal : IAdaptiveProposal, IStatefulProposal
{
    private const double InverseTemperatureFloor = 1e-6;
    private const double EigenvalueFloorFraction = 1e-12;

    private readonly IFisherInformation _fisher;
    private readonly ChainTemperature _temperature;
    private readonly int _refreshInterval;
    private readonly int _dimension;
    private readonly double[] _matrix;
    private readonly double[] _eigenvalues;
    private readonly double[] _eigenvectors;
    private readonly double[] _lastPosition;
    private long _observations;
    private bool _hasBasis;

    /// <summary>Creates the proposal.</summary>
    /// <param name="fisher">The model's Fisher information.</param>
    /// <param name="temperature">The chain slot's live inverse temperature.</param>
    /// <param name="refreshInterval">Observations between recomputations; 0 = compute once.</param>
    public FisherEigenProposal(IFisherInformation fisher, ChainTemperature temperature, int refreshInterval)
    {
        _fisher = fisher ?? throw new ArgumentNullException(nameof(fisher));
        _temperature = temperature ?? throw new ArgumentNullException(nameof(temperature));
        ArgumentOutOfRangeException.ThrowIfNegative(refreshInterval);
        _refreshInterval = refreshInterval;
        _dimension = fisher.Dimension;
        _matrix = new double[_dimension * _dimension];
        _eigenvalues = new double[_dimension];
        _eigenvectors = new double[_dimension * _dimension];
        _lastPosition = new double[_dimension];
    }

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        if (!_hasBasis)
        {
            Refresh(current);
        }

        int direction = random.NextInt(_dimension);
        double beta = Math.Max(_temperature.InverseTemperature, InverseTemperatureFloor);
        double step = random.NextGaussian() / Math.Sqrt(beta * _eigenvalues[direction]);
        for (int i = 0; i < _dimension; i++)
        {
            candidate[i] = current[i] + step * _eigenvectors[i * _dimension + direction];
        }

        return 0.0;
    }

    /// <inheritdoc />
    public void Observe(ReadOnlySpan<double> position)
    {
        checked
        {
            _observations++;
        }

        if (_refreshInterval > 0 && _observations % _refreshInterval == 0)
        {
            position[.._dimension].CopyTo(_lastPosition);
            Refresh(_lastPosition);
        }
    }

    /// <inheritdoc />
    public ProposalState CaptureState()
    {
        double[] reals = new double[_dimension + _dimension * _dimension];
        _eigenvalues.CopyTo(reals, 0);
        _eigenvectors.CopyTo(reals, _dimension);
        return new ProposalState(reals, [_observations, _hasBasis ? 1 : 0]);
    }

    /// <inheritdoc />
    public void RestoreState(ProposalState state)
    {
        ArgumentNullException.ThrowIfNull(state);
        if (state.Reals.Length != _dimension + _dimension * _dimension || state.Integers.Length != 2)
        {
            throw new ArgumentException("Fisher-eigen state has the wrong shape.", nameof(state));
        }

        state.Reals.AsSpan(0, _dimension).CopyTo(_eigenvalues);
        state.Reals.AsSpan(_dimension).CopyTo(_eigenvectors);
        _observations = state.Integers[0];
        _hasBasis = state.Integers[1] != 0;
    }

    private void Refresh(ReadOnlySpan<double> position)
    {
        _fisher.FisherMatrix(position, _matrix);
        SmallDenseMatrix.SymmetricEigen(_matrix, _dimension, _eigenvalues, _eigenvectors);
        double largest = 0.0;
        foreach (double eigenvalue in _eigenvalues)
        {
            largest = Math.Max(largest, eigenvalue);
        }

        // An all-zero Fisher matrix (no signal) still gives unit steps rather than infinite ones.
        double floor = largest > 0.0 ? EigenvalueFloorFraction * largest : 1.0;
        for (int i = 0; i < _dimension; i++)
        {
            _eigenvalues[i] = Math.Max(_eigenvalues[i], floor);
        }

        _hasBasis = true;
    }
}
