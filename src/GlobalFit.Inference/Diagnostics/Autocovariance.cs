namespace GlobalFit.Inference.Diagnostics;

/// <summary>Sample autocovariances of a single chain, computed lag by lag so that estimators which stop
/// early (Geyer, Sokal) pay only for the lags they use.</summary>
internal sealed class Autocovariance
{
    private readonly double[] _centered;

    public Autocovariance(ReadOnlySpan<double> chain)
    {
        double mean = 0.0;
        foreach (double value in chain)
        {
            mean += value;
        }

        mean /= chain.Length;
        Mean = mean;
        _centered = new double[chain.Length];
        for (int i = 0; i < chain.Length; i++)
        {
            _centered[i] = chain[i] - mean;
        }
    }

    public int Length => _centered.Length;

    public double Mean { get; }

    /// <summary>γ(t) = (1/n) Σ_{i&lt;n−t} (x_i − x̄)(x_{i+t} − x̄), the biased (positive-definite) estimator.</summary>
    public double At(int lag)
    {
        if (lag >= _centered.Length)
        {
            return 0.0;
        }

        double sum = 0.0;
        for (int i = 0; i + lag < _centered.Length; i++)
        {
            sum += _centered[i] * _centered[i + lag];
        }

        return sum / _centered.Length;
    }
}
