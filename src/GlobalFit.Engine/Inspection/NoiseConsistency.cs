using GlobalFit.Physics.Noise;

namespace GlobalFit.Engine.Inspection;

/// <summary>How well one channel's Welch estimate agrees with the model PSD over a band.</summary>
/// <param name="Channel">A, E or T.</param>
/// <param name="RmsValue">Root mean square of the samples (fractional frequency).</param>
/// <param name="BandLowHz">Lower edge of the compared band.</param>
/// <param name="BandHighHz">Upper edge of the compared band.</param>
/// <param name="BinsCompared">Welch bins inside the band.</param>
/// <param name="MeanRatio">Mean of estimate/model over the band; 1 for data that follow the model.</param>
/// <param name="RatioStandardError">Expected scatter of <paramref name="MeanRatio"/> for data that follow the model,
/// <c>1/√(K' n)</c> (treats the bins as independent, so it is a slight underestimate for the Hann window).</param>
/// <param name="ChiSquarePerBin">Mean of <c>K' (estimate/model − 1)²</c>; its expectation is 1 when the data follow the model.</param>
public sealed record ChannelNoiseCheck(string Channel, double RmsValue, double BandLowHz, double BandHighHz, int BinsCompared,
    double MeanRatio, double RatioStandardError, double ChiSquarePerBin);

/// <summary>Mean magnitude-squared coherence between two channels; near <paramref name="ExpectedForIndependent"/>
/// (about <c>1/K'</c>) when their noises are uncorrelated, as A, E and T should be.</summary>
/// <param name="Pair">E.g. "A-E".</param>
/// <param name="MeanCoherence">Mean of <c>|S_ab|²/(S_aa S_bb)</c> over the band.</param>
/// <param name="ExpectedForIndependent">Expected mean coherence of independent Gaussian noises.</param>
public sealed record CrossChannelCheck(string Pair, double MeanCoherence, double ExpectedForIndependent);

/// <summary>Compares Welch estimates with a model PSD: the numbers <c>globalfit inspect</c> prints.</summary>
/// <remarks>Each Welch bin of Gaussian noise is close to <c>S χ²_{2K'}/(2K')</c> (Welch 1967; see
/// <see cref="WelchEstimator.EffectiveSegmentCount"/>), so the ratio estimate/model has mean 1 and variance 1/K'.
/// The band avoids the lowest ten Welch bins (window leakage from DC) and stops below 40 mHz, before the first
/// transfer-function zero of the TDI channels near 60 mHz where any leakage dominates the ratio.</remarks>
public static class NoiseConsistency
{
    /// <summary>Upper edge of the compared band, below the first TDI response zero at π f* ≈ 60 mHz.</summary>
    public const double MaximumBandHz = 0.04;

    /// <summary>The Welch segment length used for a record of <paramref name="sampleCount"/> samples:
    /// the largest power of two not above N/16 and 2^16, so that there are at least ~30 segments.</summary>
    public static int SegmentLength(int sampleCount)
    {
        int length = 1 << 16;
        while (length > 16 && length > sampleCount / 16) length >>= 1;
        return length;
    }

    /// <summary>Checks one channel against its model PSD.</summary>
    public static ChannelNoiseCheck Check(string channel, ReadOnlySpan<double> samples, WelchSpectrum welch, Func<double, double> modelPsd, double dtSeconds)
    {
        double sumSquares = 0;
        foreach (double v in samples) sumSquares += v * v;
        var (low, high) = Band(welch, dtSeconds);
        double kEff = WelchEstimator.EffectiveSegmentCount(welch.SegmentCount);
        double ratioSum = 0, chiSum = 0;
        int n = 0;
        for (int k = 0; k < welch.Count; k++)
        {
            double f = welch.FrequencyOf(k);
            if (f < low || f > high) continue;
            double model = modelPsd(f);
            if (!(model > 0)) continue;
            double ratio = welch.Psd[k] / model;
            ratioSum += ratio;
            chiSum += kEff * (ratio - 1) * (ratio - 1);
            n++;
        }
        double rms = Math.Sqrt(sumSquares / Math.Max(1, samples.Length));
        if (n == 0) return new ChannelNoiseCheck(channel, rms, low, high, 0, double.NaN, double.NaN, double.NaN);
        return new ChannelNoiseCheck(channel, rms, low, high, n, ratioSum / n, 1 / Math.Sqrt(kEff * n), chiSum / n);
    }

    /// <summary>Mean coherence of two channels over the same band as <see cref="Check"/>.</summary>
    public static CrossChannelCheck Coherence(string pair, WelchCrossSpectrum cross, WelchSpectrum a, WelchSpectrum b, double dtSeconds)
    {
        var (low, high) = Band(a, dtSeconds);
        double sum = 0;
        int n = 0;
        for (int k = 0; k < cross.Count; k++)
        {
            double f = cross.FrequencyOf(k);
            if (f < low || f > high || !(a.Psd[k] > 0) || !(b.Psd[k] > 0)) continue;
            double magnitude = cross.Csd[k].Magnitude;
            sum += magnitude * magnitude / (a.Psd[k] * b.Psd[k]);
            n++;
        }
        return new CrossChannelCheck(pair, n == 0 ? double.NaN : sum / n, 1.0 / WelchEstimator.EffectiveSegmentCount(cross.SegmentCount));
    }

    private static (double Low, double High) Band(WelchSpectrum welch, double dtSeconds) =>
        (10 * welch.DfHz, Math.Min(MaximumBandHz, 0.8 * 0.5 / dtSeconds));
}
