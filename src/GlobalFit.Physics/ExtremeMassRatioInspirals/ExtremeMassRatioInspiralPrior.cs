using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The prior of one inspiral: log density and a draw from uniform variates.</summary>
/// <remarks>
/// <para>Bounds and shapes (defaults; common practice for a millihertz search, not taken from a paper):</para>
/// <list type="bullet">
/// <item>M log-uniform on [1e5, 1e7] M_sun; μ log-uniform on [1, 100] M_sun; χ uniform on [0, 0.99];</item>
/// <item>e0 uniform on [0, 0.5] (the template's accuracy is established up to 0.4, and degrades slowly beyond);</item>
/// <item>ν0 log-uniform on [ν_min, ν_hi], ν_hi = min(ν_max, (1 − 1e-3) ν_p(e0, M)) with ν_p the plunge frequency, i.e.
/// the source has not plunged at the start of the data; defaults ν_min = 1e-4 Hz, ν_max = 5e-3 Hz. Because ν_hi depends
/// on M and e0, this factor is a conditional density and its normalisation is included;</item>
/// <item>isotropic sky (uniform in sin β and in λ), isotropic spin direction (uniform in cos θ_K and φ_K), isotropic
/// orbit-to-spin angle (uniform in cos λ on [0, π]);</item>
/// <item>distance with density ∝ D² on [100, 10 000] Mpc (uniform in Euclidean volume);</item>
/// <item>Φ0, γ̃0, α0, the ecliptic longitude and φ_K uniform over a period; they are periodic and never out of bounds.</item>
/// </list>
/// <para>Immutable and thread-safe.</para>
/// </remarks>
public sealed class ExtremeMassRatioInspiralPrior
{
    /// <summary>Uniform variates one <see cref="Draw"/> consumes.</summary>
    public const int UniformsPerDraw = 14;

    /// <summary>Creates the prior.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A range is empty, not finite, or outside the model's domain.</exception>
    public ExtremeMassRatioInspiralPrior(
        double minCentralMassMsun = 1e5, double maxCentralMassMsun = 1e7,
        double minCompactMassMsun = 1, double maxCompactMassMsun = 100,
        double maxSpin = 0.99, double maxEccentricity = 0.5,
        double minFrequencyHz = 1e-4, double maxFrequencyHz = 5e-3,
        double minDistanceMpc = 100, double maxDistanceMpc = 1e4)
    {
        CheckRange(minCentralMassMsun, maxCentralMassMsun, nameof(minCentralMassMsun));
        CheckRange(minCompactMassMsun, maxCompactMassMsun, nameof(minCompactMassMsun));
        CheckRange(minFrequencyHz, maxFrequencyHz, nameof(minFrequencyHz));
        CheckRange(minDistanceMpc, maxDistanceMpc, nameof(minDistanceMpc));
        if (!(maxCompactMassMsun < minCentralMassMsun))
            throw new ArgumentOutOfRangeException(nameof(maxCompactMassMsun), maxCompactMassMsun, "compact masses must stay below the central masses");
        if (!(maxSpin > 0 && maxSpin < 1))
            throw new ArgumentOutOfRangeException(nameof(maxSpin), maxSpin, "spin bound must lie in (0, 1)");
        if (!(maxEccentricity > 0 && maxEccentricity <= 0.9))
            throw new ArgumentOutOfRangeException(nameof(maxEccentricity), maxEccentricity, "eccentricity bound must lie in (0, 0.9]");
        MinCentralMassMsun = minCentralMassMsun; MaxCentralMassMsun = maxCentralMassMsun;
        MinCompactMassMsun = minCompactMassMsun; MaxCompactMassMsun = maxCompactMassMsun;
        MaxSpin = maxSpin; MaxEccentricity = maxEccentricity;
        MinFrequencyHz = minFrequencyHz; MaxFrequencyHz = maxFrequencyHz;
        MinDistanceMpc = minDistanceMpc; MaxDistanceMpc = maxDistanceMpc;
    }

    /// <summary>Lower bound of M.</summary>
    /// <value>M_sun.</value>
    public double MinCentralMassMsun { get; }

    /// <summary>Upper bound of M.</summary>
    /// <value>M_sun.</value>
    public double MaxCentralMassMsun { get; }

    /// <summary>Lower bound of μ.</summary>
    /// <value>M_sun.</value>
    public double MinCompactMassMsun { get; }

    /// <summary>Upper bound of μ.</summary>
    /// <value>M_sun.</value>
    public double MaxCompactMassMsun { get; }

    /// <summary>Upper bound of χ.</summary>
    public double MaxSpin { get; }

    /// <summary>Upper bound of e0.</summary>
    public double MaxEccentricity { get; }

    /// <summary>Lower bound of ν0.</summary>
    /// <value>Hz.</value>
    public double MinFrequencyHz { get; }

    /// <summary>Upper bound of ν0 (further limited by the plunge).</summary>
    /// <value>Hz.</value>
    public double MaxFrequencyHz { get; }

    /// <summary>Lower bound of D.</summary>
    /// <value>Mpc.</value>
    public double MinDistanceMpc { get; }

    /// <summary>Upper bound of D.</summary>
    /// <value>Mpc.</value>
    public double MaxDistanceMpc { get; }

    /// <summary>Normalised log density; −∞ outside the support (never throws for finite input).</summary>
    public double LogDensity(in ExtremeMassRatioInspiralParameters p)
    {
        double m = p.CentralMassMsun, mu = p.CompactMassMsun;
        if (!(m >= MinCentralMassMsun && m <= MaxCentralMassMsun)) return double.NegativeInfinity;
        if (!(mu >= MinCompactMassMsun && mu <= MaxCompactMassMsun)) return double.NegativeInfinity;
        if (!(p.CentralSpin >= 0 && p.CentralSpin <= MaxSpin)) return double.NegativeInfinity;
        if (!(p.Eccentricity0 >= 0 && p.Eccentricity0 <= MaxEccentricity)) return double.NegativeInfinity;
        double high = UpperFrequency(m, p.Eccentricity0);
        if (!(high > MinFrequencyHz) || !(p.OrbitalFrequency0Hz >= MinFrequencyHz && p.OrbitalFrequency0Hz <= high)) return double.NegativeInfinity;
        if (!(p.OrbitInclinationRad >= 0 && p.OrbitInclinationRad <= Math.PI)) return double.NegativeInfinity;
        if (!(Math.Abs(p.EclipticLatitudeRad) <= 0.5 * Math.PI)) return double.NegativeInfinity;
        if (!(p.SpinThetaRad >= 0 && p.SpinThetaRad <= Math.PI)) return double.NegativeInfinity;
        if (!(p.DistanceMpc >= MinDistanceMpc && p.DistanceMpc <= MaxDistanceMpc)) return double.NegativeInfinity;
        if (!double.IsFinite(p.EclipticLongitudeRad) || !double.IsFinite(p.SpinPhiRad) || !double.IsFinite(p.Phi0Rad)
            || !double.IsFinite(p.Gamma0Rad) || !double.IsFinite(p.Alpha0Rad)) return double.NegativeInfinity;
        double twoPi = 2 * Math.PI;
        double d3 = Math.Pow(MaxDistanceMpc, 3) - Math.Pow(MinDistanceMpc, 3);
        return -Math.Log(m * Math.Log(MaxCentralMassMsun / MinCentralMassMsun))
             - Math.Log(mu * Math.Log(MaxCompactMassMsun / MinCompactMassMsun))
             - Math.Log(MaxSpin) - Math.Log(MaxEccentricity)
             - Math.Log(p.OrbitalFrequency0Hz * Math.Log(high / MinFrequencyHz))
             + Math.Log(0.5 * Math.Sin(p.OrbitInclinationRad))
             + Math.Log(0.5 * Math.Cos(p.EclipticLatitudeRad)) - Math.Log(twoPi)
             + Math.Log(0.5 * Math.Sin(p.SpinThetaRad)) - Math.Log(twoPi)
             + Math.Log(3 * p.DistanceMpc * p.DistanceMpc / d3)
             - 3 * Math.Log(twoPi);
    }

    /// <summary>Draws a source from <see cref="UniformsPerDraw"/> independent uniform variates in [0, 1), in the order of
    /// <see cref="ExtremeMassRatioInspiralParameters.ColumnNames"/> (inverse cumulative distributions).</summary>
    /// <exception cref="ArgumentException">Fewer than <see cref="UniformsPerDraw"/> variates are given.</exception>
    public ExtremeMassRatioInspiralParameters Draw(ReadOnlySpan<double> uniforms)
    {
        if (uniforms.Length < UniformsPerDraw)
            throw new ArgumentException($"a draw needs {UniformsPerDraw} uniform variates, got {uniforms.Length}", nameof(uniforms));
        double m = MinCentralMassMsun * Math.Pow(MaxCentralMassMsun / MinCentralMassMsun, uniforms[0]);
        double mu = MinCompactMassMsun * Math.Pow(MaxCompactMassMsun / MinCompactMassMsun, uniforms[1]);
        double chi = MaxSpin * uniforms[2];
        double e0 = MaxEccentricity * uniforms[4];
        double high = UpperFrequency(m, e0);
        double nu0 = MinFrequencyHz * Math.Pow(Math.Max(high, MinFrequencyHz) / MinFrequencyHz, uniforms[3]);
        double lambda = Math.Acos(1 - 2 * uniforms[5]);
        double beta = Math.Asin(2 * uniforms[6] - 1);
        double longitude = 2 * Math.PI * uniforms[7];
        double spinTheta = Math.Acos(1 - 2 * uniforms[8]);
        double spinPhi = 2 * Math.PI * uniforms[9];
        double lo3 = Math.Pow(MinDistanceMpc, 3), hi3 = Math.Pow(MaxDistanceMpc, 3);
        double distance = Math.Cbrt(lo3 + (hi3 - lo3) * uniforms[10]);
        return new(m, mu, chi, nu0, e0, lambda, beta, longitude, spinTheta, spinPhi, distance,
            2 * Math.PI * uniforms[11], 2 * Math.PI * uniforms[12], 2 * Math.PI * uniforms[13]);
    }

    private double UpperFrequency(double centralMassMsun, double e0)
    {
        double ratio = (1 - e0 * e0) / (6 + 2 * e0);
        double plunge = ratio * Math.Sqrt(ratio) / (2 * Math.PI * centralMassMsun * PhysicalConstants.SolarMassSeconds);
        return Math.Min(MaxFrequencyHz, (1 - 1e-3) * plunge);
    }

    private static void CheckRange(double low, double high, string name)
    {
        if (!(low > 0) || !double.IsFinite(high) || !(high > low))
            throw new ArgumentOutOfRangeException(name, low, "range must be positive, finite and non-empty");
    }
}
