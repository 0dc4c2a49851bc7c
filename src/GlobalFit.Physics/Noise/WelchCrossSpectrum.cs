using System.Numerics;

namespace GlobalFit.Physics.Noise;

/// <summary>A Welch estimate of the one-sided cross-spectral density <c>S_ab</c> of two channels.</summary>
/// <remarks>Convention: <c>S_ab(f_k) ≈ (2/T_seg) E[ã_k b̃_k*]</c> (without the 2 at DC and Nyquist), so
/// <c>S_aa</c> is the PSD of <see cref="WelchSpectrum"/>. The arrays are owned by the result.</remarks>
public sealed class WelchCrossSpectrum
{
    internal WelchCrossSpectrum(double dfHz, Complex[] csd, int segmentCount, int segmentLength)
    {
        DfHz = dfHz;
        Csd = csd;
        SegmentCount = segmentCount;
        SegmentLength = segmentLength;
    }

    /// <summary>Bin spacing.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>Estimated one-sided CSD per bin, k = 0 … L/2.</summary>
    /// <value>(signal unit)²/Hz.</value>
    public Complex[] Csd { get; }

    /// <summary>Number of segments averaged.</summary>
    public int SegmentCount { get; }

    /// <summary>Samples per segment L.</summary>
    public int SegmentLength { get; }

    /// <summary>Number of bins, L/2 + 1.</summary>
    public int Count => Csd.Length;

    /// <summary>Frequency of bin <paramref name="index"/>.</summary>
    /// <value>Hz.</value>
    public double FrequencyOf(int index) => index * DfHz;
}
