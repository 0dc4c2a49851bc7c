namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>A prior over the parameters of one massive black-hole binary: log density and draws.</summary>
/// <remarks>
/// <para>Independent factors (common practice for millihertz massive black-hole binary studies; bounds are settings):</para>
/// <list type="bullet">
/// <item><c>chirp_mass_msun</c>: log-uniform on [<see cref="MinimumChirpMassMsun"/>, <see cref="MaximumChirpMassMsun"/>]
/// (default 1e4 … 1e7, detector frame);</item>
/// <item><c>mass_ratio</c>: uniform on [1, <see cref="MaximumMassRatio"/>] (default 10; IMRPhenomD is calibrated to q ≤ 18,
/// Khan et al. 2016, arXiv:1508.07253);</item>
/// <item><c>spin1</c>, <c>spin2</c>: uniform on [−<see cref="MaximumSpin"/>, <see cref="MaximumSpin"/>] (default 0.99);</item>
/// <item><c>tc_s</c>: uniform on [<see cref="EarliestCoalescenceS"/>, <see cref="LatestCoalescenceS"/>] (no default: the caller
/// gives the data span or a window around a trigger);</item>
/// <item><c>distance_mpc</c>: uniform in Euclidean volume, density ∝ D² on [<see cref="MinimumDistanceMpc"/>,
/// <see cref="MaximumDistanceMpc"/>] (default 10 … 3e5 Mpc, beyond z = 20 for the 2018 Planck parameters);</item>
/// <item>sky isotropic: <c>sin beta_rad</c> uniform on [−1, 1], <c>lambda_rad</c> uniform on [0, 2π);</item>
/// <item><c>cos iota_rad</c> uniform on [−1, 1]; <c>psi_rad</c> uniform on [0, π); <c>phi_ref_rad</c> uniform on [0, 2π).</item>
/// </list>
/// <para>The log density is normalised (it integrates to one over the box), and is −∞ outside it. Immutable and thread-safe.</para>
/// </remarks>
public sealed class MassiveBlackHoleBinaryPrior
{
    private readonly double _logNormalisation;

    /// <summary>Creates the prior.</summary>
    /// <param name="earliestCoalescenceS">Lower end of t_c.</param>
    /// <param name="latestCoalescenceS">Upper end of t_c.</param>
    /// <param name="minimumChirpMassMsun">Lower end of the chirp mass.</param>
    /// <param name="maximumChirpMassMsun">Upper end of the chirp mass.</param>
    /// <param name="maximumMassRatio">Upper end of q.</param>
    /// <param name="maximumSpin">Largest |χ|.</param>
    /// <param name="minimumDistanceMpc">Lower end of D_L.</param>
    /// <param name="maximumDistanceMpc">Upper end of D_L.</param>
    /// <exception cref="ArgumentOutOfRangeException">A range is empty, not finite, or outside the physical one.</exception>
    public MassiveBlackHoleBinaryPrior(
        double earliestCoalescenceS,
        double latestCoalescenceS,
        double minimumChirpMassMsun = 1e4,
        double maximumChirpMassMsun = 1e7,
        double maximumMassRatio = 10.0,
        double maximumSpin = 0.99,
        double minimumDistanceMpc = 10.0,
        double maximumDistanceMpc = 3e5)
    {
        CheckRange(earliestCoalescenceS, latestCoalescenceS, nameof(latestCoalescenceS), double.NegativeInfinity);
        CheckRange(minimumChirpMassMsun, maximumChirpMassMsun, nameof(maximumChirpMassMsun), 0.0);
        CheckRange(1.0, maximumMassRatio, nameof(maximumMassRatio), 1.0);
        if (!(maximumSpin > 0 && maximumSpin <= 1))
            throw new ArgumentOutOfRangeException(nameof(maximumSpin), maximumSpin, "largest spin must lie in (0, 1]");
        CheckRange(minimumDistanceMpc, maximumDistanceMpc, nameof(maximumDistanceMpc), 0.0);
        EarliestCoalescenceS = earliestCoalescenceS;
        LatestCoalescenceS = latestCoalescenceS;
        MinimumChirpMassMsun = minimumChirpMassMsun;
        MaximumChirpMassMsun = maximumChirpMassMsun;
        MaximumMassRatio = maximumMassRatio;
        MaximumSpin = maximumSpin;
        MinimumDistanceMpc = minimumDistanceMpc;
        MaximumDistanceMpc = maximumDistanceMpc;
        double dCubed = maximumDistanceMpc * maximumDistanceMpc * maximumDistanceMpc - minimumDistanceMpc * minimumDistanceMpc * minimumDistanceMpc;
        _logNormalisation =
            -Math.Log(Math.Log(maximumChirpMassMsun / minimumChirpMassMsun))
            - Math.Log(maximumMassRatio - 1.0)
            - 2.0 * Math.Log(2.0 * maximumSpin)
            - Math.Log(latestCoalescenceS - earliestCoalescenceS)
            + Math.Log(3.0 / dCubed)
            - Math.Log(2.0) - Math.Log(2.0 * Math.PI)   // cos β / 2 over β, and λ
            - Math.Log(2.0)                             // sin ι / 2 over ι
            - Math.Log(Math.PI) - Math.Log(2.0 * Math.PI);
    }

    /// <summary>Lower end of t_c.</summary>
    /// <value>s.</value>
    public double EarliestCoalescenceS { get; }

    /// <summary>Upper end of t_c.</summary>
    /// <value>s.</value>
    public double LatestCoalescenceS { get; }

    /// <summary>Lower end of the detector-frame chirp mass.</summary>
    /// <value>Solar masses.</value>
    public double MinimumChirpMassMsun { get; }

    /// <summary>Upper end of the detector-frame chirp mass.</summary>
    /// <value>Solar masses.</value>
    public double MaximumChirpMassMsun { get; }

    /// <summary>Upper end of q.</summary>
    public double MaximumMassRatio { get; }

    /// <summary>Largest |χ| of either body.</summary>
    public double MaximumSpin { get; }

    /// <summary>Lower end of the luminosity distance.</summary>
    /// <value>Mpc.</value>
    public double MinimumDistanceMpc { get; }

    /// <summary>Upper end of the luminosity distance.</summary>
    /// <value>Mpc.</value>
    public double MaximumDistanceMpc { get; }

    /// <summary>Normalised log prior density of <paramref name="p"/>; −∞ outside the support.</summary>
    public double LogPrior(in MassiveBlackHoleBinaryParameters p)
    {
        if (!(p.ChirpMassMsun >= MinimumChirpMassMsun && p.ChirpMassMsun <= MaximumChirpMassMsun)
            || !(p.MassRatio >= 1.0 && p.MassRatio <= MaximumMassRatio)
            || !(Math.Abs(p.Spin1) <= MaximumSpin) || !(Math.Abs(p.Spin2) <= MaximumSpin)
            || !(p.CoalescenceTimeS >= EarliestCoalescenceS && p.CoalescenceTimeS <= LatestCoalescenceS)
            || !(p.DistanceMpc >= MinimumDistanceMpc && p.DistanceMpc <= MaximumDistanceMpc)
            || !(Math.Abs(p.EclipticLatitudeRad) <= 0.5 * Math.PI)
            || !(p.EclipticLongitudeRad >= 0 && p.EclipticLongitudeRad < 2.0 * Math.PI)
            || !(p.InclinationRad >= 0 && p.InclinationRad <= Math.PI)
            || !(p.PolarisationRad >= 0 && p.PolarisationRad < Math.PI)
            || !(p.ReferencePhaseRad >= 0 && p.ReferencePhaseRad < 2.0 * Math.PI))
            return double.NegativeInfinity;
        return _logNormalisation
            - Math.Log(p.ChirpMassMsun)
            + 2.0 * Math.Log(p.DistanceMpc)
            + Math.Log(Math.Cos(p.EclipticLatitudeRad))
            + Math.Log(Math.Sin(p.InclinationRad));
    }

    /// <summary>Maps eleven numbers in [0, 1) to parameters by the inverse cumulative distribution of each factor, in the order
    /// of <see cref="MassiveBlackHoleBinaryParameters.ColumnNames"/>: uniform numbers give a prior draw.</summary>
    /// <exception cref="ArgumentException">The span does not hold eleven numbers.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A number lies outside [0, 1].</exception>
    public MassiveBlackHoleBinaryParameters FromUnitCube(ReadOnlySpan<double> u)
    {
        if (u.Length != 11)
            throw new ArgumentException($"expected 11 numbers, got {u.Length}", nameof(u));
        for (int i = 0; i < 11; i++)
            if (!(u[i] >= 0 && u[i] <= 1))
                throw new ArgumentOutOfRangeException(nameof(u), u[i], "unit-cube coordinates must lie in [0, 1]");
        double dMin3 = Math.Pow(MinimumDistanceMpc, 3), dMax3 = Math.Pow(MaximumDistanceMpc, 3);
        return new MassiveBlackHoleBinaryParameters(
            MinimumChirpMassMsun * Math.Pow(MaximumChirpMassMsun / MinimumChirpMassMsun, u[0]),
            1.0 + (MaximumMassRatio - 1.0) * u[1],
            MaximumSpin * (2.0 * u[2] - 1.0),
            MaximumSpin * (2.0 * u[3] - 1.0),
            EarliestCoalescenceS + (LatestCoalescenceS - EarliestCoalescenceS) * u[4],
            Math.Cbrt(dMin3 + (dMax3 - dMin3) * u[5]),
            Math.Asin(2.0 * u[6] - 1.0),
            2.0 * Math.PI * u[7] * (1.0 - 1e-16),
            Math.Acos(1.0 - 2.0 * u[8]),
            Math.PI * u[9] * (1.0 - 1e-16),
            2.0 * Math.PI * u[10] * (1.0 - 1e-16));
    }

    /// <summary>A prior draw using <paramref name="nextUniform"/> (numbers in [0, 1)) eleven times.</summary>
    public MassiveBlackHoleBinaryParameters Draw(Func<double> nextUniform)
    {
        ArgumentNullException.ThrowIfNull(nextUniform);
        Span<double> u = stackalloc double[11];
        for (int i = 0; i < 11; i++) u[i] = nextUniform();
        return FromUnitCube(u);
    }

    private static void CheckRange(double low, double high, string name, double floor)
    {
        if (!double.IsFinite(low) || !double.IsFinite(high) || !(high > low) || !(low >= floor))
            throw new ArgumentOutOfRangeException(name, high, $"range [{low}, {high}] must be finite, non-empty and not below {floor}");
    }
}
