using GlobalFit.Inference.Random;
using GlobalFit.Inference.Transdimensional;
using static GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinarySourceVector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Splits one galactic binary into two nearby ones and merges such a pair back, for the reversible-jump sampler:
/// the move that repairs one loud signal fitted as a source plus a spurious companion a few bins away.</summary>
/// <remarks>
/// <para>Auxiliary variables u, one per coordinate of <see cref="GalacticBinarySourceVector"/>: the angle φ ~ U(0, π/2)
/// that shares the SNR, ρ̂₁ = ρ̂ cos φ and ρ̂₂ = ρ̂ sin φ (the squared SNR of two nearly orthogonal templates is what a
/// single template of the pair's power would carry); the signed separation Δf = f₂ − f₁ ~ U(−Δ, Δ); and for ḟ, sin β,
/// λ, cos ι, ψ, φ0 a difference δ ~ N(0, σ²). Every coordinate p other than ρ̂ splits about a weighted centroid,
/// p₁ = p − (1 − w) δ and p₂ = p + w δ, with w = cos⁴φ / (cos⁴φ + sin⁴φ): a weak companion (small φ) takes nearly all
/// of the difference, so merging it leaves the loud partner almost where it was, which a loud source's sharp likelihood
/// demands; an even split (φ = π/4) merges at the midpoint. Angles wrap (the difference is the shortest signed one,
/// so a periodic δ is used only on |δ| &lt; half a period and g is sub-normalised there, as
/// <see cref="ISourceSplitMerge"/> allows); other coordinates that leave the prior make the sampler reject.</para>
/// <para>Jacobian: the SNR outputs depend on (ρ̂, φ) only, so ∂(θ₁, θ₂)/∂(θ, u) is block-triangular; the SNR block is
/// |∂(ρ̂₁, ρ̂₂)/∂(ρ̂, φ)| = ρ̂ (polar coordinates), and each other block ∂(p₁, p₂)/∂(p, δ) at fixed φ has determinant
/// w + (1 − w) = 1, whatever w(φ) is. So ln|J| = ln ρ̂ (Green 1995, Biometrika 82, 711, eq. 7; the split-about-a-
/// weighted-mean construction follows Richardson &amp; Green 1997, JRSS B 59, 731, §3.2, here with a weight of our
/// choosing). The scales σ are our choice: wide enough that a companion with a poorly measured sky and orientation
/// still maps to a probable u, so that merges are not refused for those parameters alone.</para>
/// <para>Immutable, thread-safe and allocation-free.</para>
/// </remarks>
public sealed class GalacticBinarySplitMerge : ISourceSplitMerge
{
    // Widths of the Gaussian differences, by coordinate. ḟ barely changes a one-month signal, so its difference spans a
    // quarter of the prior; sky and orientation differences of a weak companion are measured to tens of degrees at best.
    private const double SinLatitudeSigma = 0.5;
    private const double LongitudeSigmaRad = 1.0;
    private const double CosInclinationSigma = 0.5;
    private const double PolarisationSigmaRad = 0.8;
    private const double PhaseSigmaRad = 1.5;
    private const double DerivativeSigmaFraction = 0.25;

    private static readonly double LogQuarterTurn = Math.Log(0.5 * Math.PI);
    private static readonly double LogSqrtTwoPi = 0.5 * Math.Log(2.0 * Math.PI);

    private readonly double _maxSeparationHz;
    private readonly double _derivativeSigmaHzS;

    /// <summary>Creates the map.</summary>
    /// <param name="maxSeparationHz">Δ, the largest |f₂ − f₁| of a split pair, &gt; 0.</param>
    /// <param name="derivativeRangeHzS">Width of the ḟ prior, &gt; 0; the ḟ difference has a quarter of it as σ.</param>
    /// <exception cref="ArgumentOutOfRangeException">A width is not positive and finite.</exception>
    public GalacticBinarySplitMerge(double maxSeparationHz, double derivativeRangeHzS)
    {
        if (!(maxSeparationHz > 0) || !double.IsFinite(maxSeparationHz))
            throw new ArgumentOutOfRangeException(nameof(maxSeparationHz), maxSeparationHz, "separation must be positive and finite");
        if (!(derivativeRangeHzS > 0) || !double.IsFinite(derivativeRangeHzS))
            throw new ArgumentOutOfRangeException(nameof(derivativeRangeHzS), derivativeRangeHzS, "ḟ range must be positive and finite");
        _maxSeparationHz = maxSeparationHz;
        _derivativeSigmaHzS = DerivativeSigmaFraction * derivativeRangeHzS;
    }

    /// <summary>Δ, the largest frequency separation of a split pair.</summary>
    public double MaxSeparationHz => _maxSeparationHz;

    /// <inheritdoc />
    public double DrawAuxiliary(ReadOnlySpan<double> source, Span<double> auxiliary, ref RandomStream random)
    {
        auxiliary[Snr] = random.NextUniform(0.0, 0.5 * Math.PI);
        auxiliary[Frequency] = random.NextUniform(-_maxSeparationHz, _maxSeparationHz);
        auxiliary[FrequencyDerivative] = _derivativeSigmaHzS * random.NextGaussian();
        auxiliary[SinLatitude] = SinLatitudeSigma * random.NextGaussian();
        auxiliary[Longitude] = LongitudeSigmaRad * random.NextGaussian();
        auxiliary[CosInclination] = CosInclinationSigma * random.NextGaussian();
        auxiliary[Polarisation] = PolarisationSigmaRad * random.NextGaussian();
        auxiliary[Phase] = PhaseSigmaRad * random.NextGaussian();
        return LogAuxiliaryDensity(source, auxiliary);
    }

    /// <inheritdoc />
    public double LogAuxiliaryDensity(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary)
    {
        double angle = auxiliary[Snr], separation = auxiliary[Frequency];
        if (!(angle > 0.0 && angle < 0.5 * Math.PI && Math.Abs(separation) < _maxSeparationHz)
            || !(Math.Abs(auxiliary[Longitude]) < Math.PI && Math.Abs(auxiliary[Polarisation]) < 0.5 * Math.PI
                && Math.Abs(auxiliary[Phase]) < Math.PI))
            return double.NegativeInfinity;
        return -LogQuarterTurn - Math.Log(2.0 * _maxSeparationHz)
            + LogGaussian(auxiliary[FrequencyDerivative], _derivativeSigmaHzS)
            + LogGaussian(auxiliary[SinLatitude], SinLatitudeSigma)
            + LogGaussian(auxiliary[Longitude], LongitudeSigmaRad)
            + LogGaussian(auxiliary[CosInclination], CosInclinationSigma)
            + LogGaussian(auxiliary[Polarisation], PolarisationSigmaRad)
            + LogGaussian(auxiliary[Phase], PhaseSigmaRad);
    }

    /// <inheritdoc />
    public bool TrySplit(ReadOnlySpan<double> source, ReadOnlySpan<double> auxiliary, Span<double> first, Span<double> second, out double logJacobian)
    {
        double snr = source[Snr], angle = auxiliary[Snr];
        logJacobian = Math.Log(snr);
        if (!(snr > 0.0 && angle > 0.0 && angle < 0.5 * Math.PI)) return false;
        double cos = Math.Cos(angle), sin = Math.Sin(angle);
        first[Snr] = snr * cos;
        second[Snr] = snr * sin;
        double weight = CentroidWeight(cos, sin);
        for (int i = 0; i < Dimension; i++)
        {
            if (i == Snr) continue;
            double period = Period(i);
            first[i] = Wrap(source[i] - (1.0 - weight) * auxiliary[i], period);
            second[i] = Wrap(source[i] + weight * auxiliary[i], period);
        }
        return true;
    }

    /// <inheritdoc />
    public bool TryMerge(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> source, Span<double> auxiliary, out double logJacobian)
    {
        double snr = Math.Sqrt(first[Snr] * first[Snr] + second[Snr] * second[Snr]);
        logJacobian = Math.Log(snr);
        if (!(first[Snr] > 0.0 && second[Snr] > 0.0)) return false;
        double angle = Math.Atan2(second[Snr], first[Snr]);
        source[Snr] = snr;
        auxiliary[Snr] = angle;
        double weight = CentroidWeight(first[Snr] / snr, second[Snr] / snr);
        for (int i = 0; i < Dimension; i++)
        {
            if (i == Snr) continue;
            double period = Period(i);
            double difference = second[i] - first[i];
            if (period > 0.0) difference -= period * Math.Round(difference / period);
            auxiliary[i] = difference;
            source[i] = Wrap(first[i] + (1.0 - weight) * difference, period);
        }
        return Math.Abs(auxiliary[Frequency]) < _maxSeparationHz;
    }

    // ρ̂⁴-weighted centroid: w = ρ̂₁⁴ / (ρ̂₁⁴ + ρ̂₂⁴), from the cosine and sine of the sharing angle.
    private static double CentroidWeight(double cos, double sin)
    {
        double cos4 = cos * cos * cos * cos, sin4 = sin * sin * sin * sin;
        return cos4 / (cos4 + sin4);
    }

    private static double Period(int index) => index switch
    {
        Longitude or Phase => 2.0 * Math.PI,
        Polarisation => Math.PI,
        _ => 0.0,
    };

    private static double Wrap(double value, double period)
    {
        if (period == 0.0) return value;
        double wrapped = value - period * Math.Floor(value / period);
        return wrapped >= period ? 0.0 : wrapped;
    }

    private static double LogGaussian(double value, double sigma)
    {
        double z = value / sigma;
        return -0.5 * z * z - Math.Log(sigma) - LogSqrtTwoPi;
    }
}
