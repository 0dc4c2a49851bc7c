using GlobalFit.Inference.Tempering;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>Keeps every cold-chain sample after a burn-in step, per replica and per parameter.</summary>
internal sealed class CollectingSink : ISampleSink
{
    private readonly long _burnIn;

    public CollectingSink(int replicas, int dimension, long burnIn)
    {
        _burnIn = burnIn;
        Draws = new List<double>[replicas][];
        for (int r = 0; r < replicas; r++)
        {
            Draws[r] = new List<double>[dimension];
            for (int i = 0; i < dimension; i++)
            {
                Draws[r][i] = [];
            }
        }
    }

    /// <summary>Draws[replica][parameter] = the kept values in order.</summary>
    public List<double>[][] Draws { get; }

    public void OnSample(long step, int replica, ReadOnlySpan<double> position, double logLikelihood, double logPrior)
    {
        if (step <= _burnIn)
        {
            return;
        }

        for (int i = 0; i < position.Length; i++)
        {
            Draws[replica][i].Add(position[i]);
        }
    }

    /// <summary>Chains of parameter <paramref name="parameter"/>, one per replica.</summary>
    public double[][] Chains(int parameter)
    {
        double[][] chains = new double[Draws.Length][];
        for (int r = 0; r < Draws.Length; r++)
        {
            chains[r] = [.. Draws[r][parameter]];
        }

        return chains;
    }

    /// <summary>Chains of f(θ) for a function of the parameter vector, one per replica.</summary>
    public double[][] Chains(Func<int, int, double> valueOfReplicaAndIndex)
    {
        double[][] chains = new double[Draws.Length][];
        for (int r = 0; r < Draws.Length; r++)
        {
            int count = Draws[r][0].Count;
            chains[r] = new double[count];
            for (int n = 0; n < count; n++)
            {
                chains[r][n] = valueOfReplicaAndIndex(r, n);
            }
        }

        return chains;
    }
}
