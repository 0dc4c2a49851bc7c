using BenchmarkDotNet.Attributes;
using GlobalFit.Engine.SourceClasses.Noise;

namespace GlobalFit.Benchmarks.Noise;

/// <summary>One evaluation of the noise worker's Whittle likelihood for a year at 5 s: the A/E group (three shapes:
/// acceleration, optical metrology, foreground) plus the T group (two shapes), as <see cref="NoiseWorker"/> runs it per
/// sampler step. Bin counts: the default fit range 0.1–30 mHz (943 573 bins) and every one-sided bin of the record
/// (3 155 759, the worst case).</summary>
[MemoryDiagnoser]
public class NoiseLikelihoodBenchmarks
{
    private double[] _powerAe = [], _powerT = [], _acceleration = [], _oms = [], _foreground = [];

    /// <summary>Fitted bins.</summary>
    [Params(943_573, 3_155_759)]
    public int Bins { get; set; }

    /// <summary>Normalised shapes near the values the worker stores (they sum to about 1 at the starting levels);
    /// the cost does not depend on the values.</summary>
    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(1);
        _powerAe = Fill(random, 0.0, 4.0);
        _powerT = Fill(random, 0.0, 2.0);
        _acceleration = Fill(random, 0.1, 0.5);
        _oms = Fill(random, 0.3, 0.6);
        _foreground = Fill(random, 0.0, 0.2);
    }

    /// <summary>ln L of both groups at one point.</summary>
    [Benchmark]
    public double OneEvaluationYearAt5s() =>
        WhittleLikelihood.LogLikelihood(_powerAe, _acceleration, _oms, _foreground, 1.1, 0.9, 1.05, 2.0)
        + WhittleLikelihood.LogLikelihood(_powerT, _acceleration, _oms, 0.95, 1.02, 1.0);

    private double[] Fill(Random random, double low, double high)
    {
        var values = new double[Bins];
        for (int i = 0; i < values.Length; i++) values[i] = low + (high - low) * random.NextDouble();
        return values;
    }
}
