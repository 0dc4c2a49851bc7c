namespace GlobalFit.Inference.Tempering;

/// <summary>Running sums of ln L per rung for thermodynamic integration.</summary>
internal sealed class EvidenceAccumulator
{
    public EvidenceAccumulator(int rungs)
    {
        Sums = new double[rungs];
        Counts = new long[rungs];
    }

    public double[] Sums { get; }

    public long[] Counts { get; }

    public void Add(int rung, double logLikelihood)
    {
        Sums[rung] += logLikelihood;
        Counts[rung]++;
    }

    public void Reset()
    {
        Array.Clear(Sums);
        Array.Clear(Counts);
    }

    public double[] Means()
    {
        double[] means = new double[Sums.Length];
        for (int i = 0; i < means.Length; i++)
        {
            means[i] = Counts[i] == 0 ? double.NaN : Sums[i] / Counts[i];
        }

        return means;
    }

    public void Restore(ReadOnlySpan<double> sums, ReadOnlySpan<long> counts)
    {
        if (sums.Length != Sums.Length || counts.Length != Counts.Length)
        {
            throw new ArgumentException("Saved evidence sums do not match TemperatureCount.", nameof(sums));
        }

        sums.CopyTo(Sums);
        counts.CopyTo(Counts);
    }
}
