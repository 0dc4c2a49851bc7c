namespace GlobalFit.Physics.Noise;

/// <summary>A Welch estimate of a one-sided PSD on bins
/// <c>f_k = k/(L Δt)</c>, k = 0 … L/2, with the number of segments averaged.</summary>
/// <remarks>The arrays are owned by the result; callers must not change them.</remarks>
public sealed class WelchSpectrum
{
    internal WelchSpectrum(double dfHz, double[] psd, int segmentCount, int segmentLength)
    {
        DfHz = dfHz;
        Psd = psd;
        SegmentCount = segmentCount;
        SegmentLength = segmentLength;
    }

    /// <summary>Bin spacing, the inverse of the segment duration.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>Estimated one-sided PSD per bin, k = 0 … L/2.</summary>
    /// <value>(signal unit)²/Hz.</value>
    public double[] Psd { get; }

    /// <summary>Number of (50 %-overlapping) segments averaged.</summary>
    public int SegmentCount { get; }

    /// <summary>Samples per segment L.</summary>
    public int SegmentLength { get; }

    /// <summary>Number of bins, L/2 + 1.</summary>
    public int Count => Psd.Length;

    /// <summary>Frequency of bin <paramref name="index"/>.</summary>
    /// <value>Hz.</value>
    public double FrequencyOf(int index) => index * DfHz;

    /// <summary>The frequencies of all bins (a new array).</summary>
    /// <value>Hz.</value>
    public double[] FrequenciesHz()
    {
        var f = new double[Count];
        for (int k = 0; k < f.Length; k++) f[k] = FrequencyOf(k);
        return f;
    }
}
