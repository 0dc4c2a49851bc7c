using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The coordinates an inspiral worker samples in: the fourteen parameters mapped to quantities whose prior is
/// flat or nearly so, then shifted to a reference point and divided by per-parameter scales.</summary>
/// <remarks>
/// <para>Unscaled coordinates y: ln M, ln μ, χ, ν0, e0, cos λ, sin β, ecliptic longitude, cos θ_K, φ_K, ln D, Φ0, γ̃0,
/// α0. In them the prior of <see cref="ExtremeMassRatioInspiralPrior"/> is uniform except for D³ in ln D and the
/// conditional normalisation of ν0 (derived: the prior's densities times the Jacobian M μ D / (sin λ cos β sin θ_K)).</para>
/// <para>Scaled coordinates x = (y − y_ref)/s: the scales are the conditional posterior widths 1/√F_ii at the start, so
/// every sampled coordinate has a width of order one whatever its unit (ν0 is known to ~1e-10 Hz, the spin direction
/// to a radian); the Fisher matrix in x is well conditioned enough for its eigen-decomposition and the differential
/// evolution jitter (a fixed fraction of each range) stays small.</para>
/// <para>Immutable; thread-safe.</para>
/// </remarks>
internal sealed class InspiralSamplingCoordinates
{
    /// <summary>Number of coordinates.</summary>
    public const int Dimension = 14;

    /// <summary>Indices of the periodic coordinates (longitude, φ_K, Φ0, γ̃0, α0), period 2π in y.</summary>
    public static ReadOnlySpan<int> PeriodicIndices => [7, 9, 11, 12, 13];

    private readonly double[] _reference;
    private readonly double[] _scales;

    /// <summary>Creates the map around <paramref name="reference"/> (unscaled y) with <paramref name="scales"/>.</summary>
    /// <exception cref="ArgumentException">A length is not 14 or a scale is not positive and finite.</exception>
    public InspiralSamplingCoordinates(double[] reference, double[] scales)
    {
        if (reference.Length != Dimension || scales.Length != Dimension) throw new ArgumentException("an inspiral has 14 coordinates");
        foreach (double s in scales)
            if (!(s > 0) || !double.IsFinite(s)) throw new ArgumentException($"scales must be positive and finite, got {s}", nameof(scales));
        _reference = reference;
        _scales = scales;
    }

    /// <summary>The reference point y_ref.</summary>
    public ReadOnlySpan<double> Reference => _reference;

    /// <summary>The scales s.</summary>
    public ReadOnlySpan<double> Scales => _scales;

    /// <summary>Whether coordinate <paramref name="index"/> is periodic.</summary>
    public static bool IsPeriodic(int index) => index is 7 or 9 or 11 or 12 or 13;

    /// <summary>Unscaled coordinates y of <paramref name="p"/>.</summary>
    public static void ToUnscaled(in ExtremeMassRatioInspiralParameters p, Span<double> y)
    {
        y[0] = Math.Log(p.CentralMassMsun);
        y[1] = Math.Log(p.CompactMassMsun);
        y[2] = p.CentralSpin;
        y[3] = p.OrbitalFrequency0Hz;
        y[4] = p.Eccentricity0;
        y[5] = Math.Cos(p.OrbitInclinationRad);
        y[6] = Math.Sin(p.EclipticLatitudeRad);
        y[7] = p.EclipticLongitudeRad;
        y[8] = Math.Cos(p.SpinThetaRad);
        y[9] = p.SpinPhiRad;
        y[10] = Math.Log(p.DistanceMpc);
        y[11] = p.Phi0Rad;
        y[12] = p.Gamma0Rad;
        y[13] = p.Alpha0Rad;
    }

    /// <summary>Parameters of unscaled coordinates y; periodic angles are wrapped into [0, 2π) and cosines/sines
    /// clamped to [−1, 1].</summary>
    public static ExtremeMassRatioInspiralParameters FromUnscaled(ReadOnlySpan<double> y) => new(
        Math.Exp(y[0]), Math.Exp(y[1]), y[2], y[3], y[4],
        Math.Acos(Math.Clamp(y[5], -1, 1)), Math.Asin(Math.Clamp(y[6], -1, 1)), Wrap(y[7]),
        Math.Acos(Math.Clamp(y[8], -1, 1)), Wrap(y[9]), Math.Exp(y[10]), Wrap(y[11]), Wrap(y[12]), Wrap(y[13]));

    /// <summary>ln of the Jacobian |dθ/dy| (θ the physical parameters), −∞ where a cosine or sine reaches ±1.</summary>
    public static double LogJacobian(in ExtremeMassRatioInspiralParameters p) =>
        Math.Log(p.CentralMassMsun) + Math.Log(p.CompactMassMsun) + Math.Log(p.DistanceMpc)
        - Math.Log(Math.Sin(p.OrbitInclinationRad)) - Math.Log(Math.Cos(p.EclipticLatitudeRad)) - Math.Log(Math.Sin(p.SpinThetaRad));

    /// <summary>Parameters of scaled coordinates x.</summary>
    public ExtremeMassRatioInspiralParameters ToParameters(ReadOnlySpan<double> x)
    {
        Span<double> y = stackalloc double[Dimension];
        ToUnscaledFromScaled(x, y);
        return FromUnscaled(y);
    }

    /// <summary>y = y_ref + s x.</summary>
    public void ToUnscaledFromScaled(ReadOnlySpan<double> x, Span<double> y)
    {
        for (int i = 0; i < Dimension; i++) y[i] = _reference[i] + _scales[i] * x[i];
    }

    /// <summary>Scaled coordinates x of <paramref name="p"/>; periodic ones are taken within half a period of the
    /// reference.</summary>
    public void ToScaled(in ExtremeMassRatioInspiralParameters p, Span<double> x)
    {
        Span<double> y = stackalloc double[Dimension];
        ToUnscaled(p, y);
        for (int i = 0; i < Dimension; i++)
        {
            double d = y[i] - _reference[i];
            if (IsPeriodic(i)) d = Math.IEEERemainder(d, 2 * Math.PI);
            x[i] = d / _scales[i];
        }
    }

    /// <summary>An angle wrapped into [0, 2π).</summary>
    public static double Wrap(double angle)
    {
        double w = angle % (2 * Math.PI);
        if (w < 0) w += 2 * Math.PI;
        return w >= 2 * Math.PI ? 0 : w;
    }
}
