using System.Numerics;
using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>How many envelope samples N (a power of two) the fast response uses for a source: the accuracy rule.</summary>
/// <remarks>
/// <para>The N envelope samples cover the bins <c>q − N/2 … q + N/2 − 1</c> around the carrier, so N must exceed the
/// full bandwidth of the envelope. Its half-width in bins is estimated as
/// <c>β_D T/yr + |ḟ| T² + 4 T/yr + margin</c>: the orbital Doppler spread with <c>β_D = 2π f (1 au)/c</c> (the worst
/// case, a source on the ecliptic), the drift over the record, the antenna-pattern harmonics (the pattern of a turning,
/// orbiting triangle reaches the fourth harmonic of the orbital frequency), and a fixed margin for the transfer
/// function and for the leakage of an envelope that is not periodic over the record. The half-width is doubled and
/// rounded up to a power of two, then held between <see cref="MinimumLength"/> and <see cref="MaximumLength"/>
/// (the envelope-length idea is that of Cornish &amp; Littenberg 2007, arXiv:0704.1808; this rule and its defaults are
/// ours, set by the accuracy tests against the brute-force response).</para>
/// <para>The rule uses the largest f of the record (<c>f0 + max(ḟ, 0) T</c>) and the ecliptic worst case, so N does not
/// change with the sky position: a sampler moving over the sky keeps one template length. Beyond
/// <see cref="MaximumLength"/> the length is capped and accuracy degrades; keep ḟ inside a prior for which the cap is
/// not reached. Immutable and thread-safe.</para>
/// </remarks>
public sealed record EnvelopeLengthRule
{
    private const double OrbitRadiusLightSeconds = PhysicalConstants.AstronomicalUnitM / PhysicalConstants.SpeedOfLightMS;

    /// <summary>Creates a rule.</summary>
    /// <param name="marginBins">Extra half-width in bins; default 8.</param>
    /// <param name="minimumLength">Smallest N (power of two); default 32.</param>
    /// <param name="maximumLength">Largest N (power of two); default 4096.</param>
    /// <exception cref="ArgumentOutOfRangeException">The margin is negative or not finite, a length is not a power of
    /// two of at least 8, or the minimum exceeds the maximum.</exception>
    public EnvelopeLengthRule(double marginBins = 8.0, int minimumLength = 32, int maximumLength = 4096)
    {
        if (!(marginBins >= 0) || !double.IsFinite(marginBins))
            throw new ArgumentOutOfRangeException(nameof(marginBins), marginBins, "margin must be finite and not negative");
        if (minimumLength < 8 || !BitOperations.IsPow2(minimumLength))
            throw new ArgumentOutOfRangeException(nameof(minimumLength), minimumLength, "minimum length must be a power of two of at least 8");
        if (maximumLength < minimumLength || !BitOperations.IsPow2(maximumLength))
            throw new ArgumentOutOfRangeException(nameof(maximumLength), maximumLength, "maximum length must be a power of two not below the minimum");
        MarginBins = marginBins;
        MinimumLength = minimumLength;
        MaximumLength = maximumLength;
    }

    /// <summary>The default rule (margin 8 bins, N from 32 to 4096).</summary>
    public static EnvelopeLengthRule Default { get; } = new();

    /// <summary>Extra half-width added to the physical estimate.</summary>
    /// <value>Bins.</value>
    public double MarginBins { get; }

    /// <summary>Smallest envelope length.</summary>
    public int MinimumLength { get; }

    /// <summary>Largest envelope length.</summary>
    public int MaximumLength { get; }

    /// <summary>Estimated half-bandwidth of the envelope in bins, before the margin.</summary>
    /// <param name="frequencyHz">f0.</param>
    /// <param name="frequencyDerivativeHzS">ḟ.</param>
    /// <param name="durationSeconds">Record length T.</param>
    public static double PhysicalHalfWidthBins(double frequencyHz, double frequencyDerivativeHzS, double durationSeconds)
    {
        double years = durationSeconds / PhysicalConstants.SiderealYearS;
        double highestHz = frequencyHz + Math.Max(frequencyDerivativeHzS, 0.0) * durationSeconds;
        double dopplerIndex = 2.0 * Math.PI * highestHz * OrbitRadiusLightSeconds;
        return dopplerIndex * years + Math.Abs(frequencyDerivativeHzS) * durationSeconds * durationSeconds + 4.0 * years;
    }

    /// <summary>The envelope length N for a source.</summary>
    /// <param name="frequencyHz">f0.</param>
    /// <param name="frequencyDerivativeHzS">ḟ.</param>
    /// <param name="durationSeconds">Record length T.</param>
    public int Length(double frequencyHz, double frequencyDerivativeHzS, double durationSeconds)
    {
        double full = 2.0 * (PhysicalHalfWidthBins(frequencyHz, frequencyDerivativeHzS, durationSeconds) + MarginBins);
        if (!(full < MaximumLength)) return MaximumLength;
        int length = (int)BitOperations.RoundUpToPowerOf2((uint)Math.Ceiling(full));
        return Math.Clamp(length, MinimumLength, MaximumLength);
    }
}
