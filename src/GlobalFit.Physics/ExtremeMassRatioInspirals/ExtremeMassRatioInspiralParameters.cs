using System.Collections.Immutable;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The fourteen parameters of one extreme-mass-ratio inspiral in the analytic kludge.</summary>
/// <remarks>
/// <para>Barack &amp; Cutler 2004 (arXiv:gr-qc/0310125) describe a source by its masses, spin, sky position, spin
/// direction, distance, the angle λ between orbit and spin, and the orbital state at a reference time. Here the
/// reference time is the start of the data, at the Solar-system barycentre: the orbital frequency ν0, eccentricity e0,
/// mean anomaly Φ0, pericentre angle γ̃0 and precession phase α0 are the values at t = 0 of the data's time axis, with
/// t read as barycentric time. A source given by its plunge time instead is converted by
/// <see cref="InspiralTrajectory.FrequencyForPlungeTime"/>.</para>
/// <para>Angles: sky position as ecliptic latitude and longitude (as for the other classes); spin direction as
/// ecliptic colatitude θ_K and longitude φ_K; λ in [0, π] (λ &gt; π/2 is a retrograde orbit). Masses in the source frame
/// equal detector-frame masses here (no redshift is applied). The struct does not validate; <see cref="Validate"/>
/// checks values from user input and the prior rejects samples outside its bounds.</para>
/// </remarks>
/// <param name="CentralMassMsun">M, mass of the central black hole (column <c>central_mass_msun</c>).</param>
/// <param name="CompactMassMsun">μ, mass of the compact object (column <c>compact_mass_msun</c>).</param>
/// <param name="CentralSpin">χ = S/M² in [0, 1) (column <c>central_spin</c>).</param>
/// <param name="OrbitalFrequency0Hz">ν0, radial orbital frequency at t = 0 (column <c>orbital_frequency0_hz</c>).</param>
/// <param name="Eccentricity0">e0 in [0, 1) at t = 0 (column <c>eccentricity0</c>).</param>
/// <param name="OrbitInclinationRad">λ, angle between orbital angular momentum and spin (column <c>orbit_inclination_rad</c>).</param>
/// <param name="EclipticLatitudeRad">Source latitude β (column <c>beta_rad</c>).</param>
/// <param name="EclipticLongitudeRad">Source longitude (column <c>lambda_rad</c>).</param>
/// <param name="SpinThetaRad">θ_K, ecliptic colatitude of the spin (column <c>spin_theta_rad</c>).</param>
/// <param name="SpinPhiRad">φ_K, ecliptic longitude of the spin (column <c>spin_phi_rad</c>).</param>
/// <param name="DistanceMpc">Luminosity distance D (column <c>distance_mpc</c>).</param>
/// <param name="Phi0Rad">Φ0, mean anomaly at t = 0 (column <c>phi0_rad</c>).</param>
/// <param name="Gamma0Rad">γ̃0, pericentre angle from the node at t = 0 (column <c>gamma0_rad</c>).</param>
/// <param name="Alpha0Rad">α0, precession phase of L̂ about Ŝ at t = 0 (column <c>alpha0_rad</c>).</param>
public readonly record struct ExtremeMassRatioInspiralParameters(
    double CentralMassMsun,
    double CompactMassMsun,
    double CentralSpin,
    double OrbitalFrequency0Hz,
    double Eccentricity0,
    double OrbitInclinationRad,
    double EclipticLatitudeRad,
    double EclipticLongitudeRad,
    double SpinThetaRad,
    double SpinPhiRad,
    double DistanceMpc,
    double Phi0Rad,
    double Gamma0Rad,
    double Alpha0Rad)
{
    /// <summary>Class id of extreme-mass-ratio inspirals in configurations, files and catalogues.</summary>
    public const string ClassId = "extreme_mass_ratio_inspirals";

    /// <summary>Column name of <see cref="CentralMassMsun"/>.</summary>
    public const string CentralMassColumn = "central_mass_msun";

    /// <summary>Column name of <see cref="CompactMassMsun"/>.</summary>
    public const string CompactMassColumn = "compact_mass_msun";

    /// <summary>Column name of <see cref="CentralSpin"/>.</summary>
    public const string CentralSpinColumn = "central_spin";

    /// <summary>Column name of <see cref="OrbitalFrequency0Hz"/>.</summary>
    public const string OrbitalFrequencyColumn = "orbital_frequency0_hz";

    /// <summary>Column name of the alternative plunge-time parameter (seconds after the start of the data).</summary>
    public const string PlungeTimeColumn = "plunge_time_s";

    /// <summary>Column name of <see cref="Eccentricity0"/>.</summary>
    public const string EccentricityColumn = "eccentricity0";

    /// <summary>Column name of <see cref="OrbitInclinationRad"/>.</summary>
    public const string OrbitInclinationColumn = "orbit_inclination_rad";

    /// <summary>Column name of <see cref="EclipticLatitudeRad"/>.</summary>
    public const string EclipticLatitudeColumn = "beta_rad";

    /// <summary>Column name of <see cref="EclipticLongitudeRad"/>.</summary>
    public const string EclipticLongitudeColumn = "lambda_rad";

    /// <summary>Column name of <see cref="SpinThetaRad"/>.</summary>
    public const string SpinThetaColumn = "spin_theta_rad";

    /// <summary>Column name of <see cref="SpinPhiRad"/>.</summary>
    public const string SpinPhiColumn = "spin_phi_rad";

    /// <summary>Column name of <see cref="DistanceMpc"/>.</summary>
    public const string DistanceColumn = "distance_mpc";

    /// <summary>Column name of <see cref="Phi0Rad"/>.</summary>
    public const string Phi0Column = "phi0_rad";

    /// <summary>Column name of <see cref="Gamma0Rad"/>.</summary>
    public const string Gamma0Column = "gamma0_rad";

    /// <summary>Column name of <see cref="Alpha0Rad"/>.</summary>
    public const string Alpha0Column = "alpha0_rad";

    /// <summary>The fourteen columns in the order of the constructor.</summary>
    public static ImmutableArray<string> ColumnNames { get; } =
    [
        CentralMassColumn, CompactMassColumn, CentralSpinColumn, OrbitalFrequencyColumn, EccentricityColumn,
        OrbitInclinationColumn, EclipticLatitudeColumn, EclipticLongitudeColumn, SpinThetaColumn, SpinPhiColumn,
        DistanceColumn, Phi0Column, Gamma0Column, Alpha0Column,
    ];

    /// <summary>Throws unless the masses, frequency and distance are positive and finite, μ &lt; M, χ and e0 lie in
    /// [0, 1), λ and θ_K in [0, π], |β| ≤ π/2, and every angle is finite.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A value is out of range; the parameter name is its column name.</exception>
    public void Validate()
    {
        RequirePositive(CentralMassMsun, CentralMassColumn);
        RequirePositive(CompactMassMsun, CompactMassColumn);
        if (!(CompactMassMsun < CentralMassMsun))
            throw new ArgumentOutOfRangeException(CompactMassColumn, CompactMassMsun, "compact mass must be smaller than the central mass");
        RequirePositive(OrbitalFrequency0Hz, OrbitalFrequencyColumn);
        RequirePositive(DistanceMpc, DistanceColumn);
        if (!(CentralSpin >= 0 && CentralSpin < 1))
            throw new ArgumentOutOfRangeException(CentralSpinColumn, CentralSpin, "spin must lie in [0, 1)");
        if (!(Eccentricity0 >= 0 && Eccentricity0 < 1))
            throw new ArgumentOutOfRangeException(EccentricityColumn, Eccentricity0, "eccentricity must lie in [0, 1)");
        if (!(OrbitInclinationRad >= 0 && OrbitInclinationRad <= Math.PI))
            throw new ArgumentOutOfRangeException(OrbitInclinationColumn, OrbitInclinationRad, "orbit inclination must lie in [0, pi]");
        if (!(SpinThetaRad >= 0 && SpinThetaRad <= Math.PI))
            throw new ArgumentOutOfRangeException(SpinThetaColumn, SpinThetaRad, "spin colatitude must lie in [0, pi]");
        if (!(Math.Abs(EclipticLatitudeRad) <= 0.5 * Math.PI))
            throw new ArgumentOutOfRangeException(EclipticLatitudeColumn, EclipticLatitudeRad, "ecliptic latitude must lie in [-pi/2, pi/2]");
        RequireFinite(EclipticLongitudeRad, EclipticLongitudeColumn);
        RequireFinite(SpinPhiRad, SpinPhiColumn);
        RequireFinite(Phi0Rad, Phi0Column);
        RequireFinite(Gamma0Rad, Gamma0Column);
        RequireFinite(Alpha0Rad, Alpha0Column);
    }

    /// <summary>The parameters as an array in the order of <see cref="ColumnNames"/>.</summary>
    public double[] ToArray() =>
    [
        CentralMassMsun, CompactMassMsun, CentralSpin, OrbitalFrequency0Hz, Eccentricity0, OrbitInclinationRad,
        EclipticLatitudeRad, EclipticLongitudeRad, SpinThetaRad, SpinPhiRad, DistanceMpc, Phi0Rad, Gamma0Rad, Alpha0Rad,
    ];

    /// <summary>Parameters from values in the order of <see cref="ColumnNames"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The span does not hold fourteen values.</exception>
    public static ExtremeMassRatioInspiralParameters FromSpan(ReadOnlySpan<double> values)
    {
        if (values.Length != 14)
            throw new ArgumentOutOfRangeException(nameof(values), values.Length, "an inspiral has 14 parameters");
        return new(values[0], values[1], values[2], values[3], values[4], values[5], values[6], values[7], values[8],
            values[9], values[10], values[11], values[12], values[13]);
    }

    private static void RequirePositive(double value, string column)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentOutOfRangeException(column, value, "value must be positive and finite");
    }

    private static void RequireFinite(double value, string column)
    {
        if (!double.IsFinite(value))
            throw new ArgumentOutOfRangeException(column, value, "value must be finite");
    }
}
