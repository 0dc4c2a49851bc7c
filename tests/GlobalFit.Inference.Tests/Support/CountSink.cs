using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Inference.Tests.Support;

/// <summary>Records, after burn-in, the cold replica-0 source count and, per count, the mean (a, b) of the sources of a
/// two-parameter model such as <see cref="LinearBumpsModel"/>.</summary>
internal sealed class CountSink(long burnIn, int maxSources) : ITransdimensionalSampleSink
{
    public List<int> Counts { get; } = [];

    public List<double>[] MeanA { get; } = Enumerable.Range(0, maxSources + 1).Select(_ => new List<double>()).ToArray();

    public List<double>[] MeanB { get; } = Enumerable.Range(0, maxSources + 1).Select(_ => new List<double>()).ToArray();

    public void OnSample(long step, int replica, int sourceCount, ReadOnlySpan<double> sources, double logLikelihood, double logPrior)
    {
        if (step <= burnIn || replica != 0)
        {
            return;
        }

        Counts.Add(sourceCount);
        if (sourceCount > 0)
        {
            double a = 0, b = 0;
            for (int j = 0; j < sourceCount; j++)
            {
                a += sources[2 * j];
                b += sources[2 * j + 1];
            }

            MeanA[sourceCount].Add(a / sourceCount);
            MeanB[sourceCount].Add(b / sourceCount);
        }
    }
}
