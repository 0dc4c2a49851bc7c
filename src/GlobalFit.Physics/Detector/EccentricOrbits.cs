using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Detector;

/// <summary>Keplerian orbits of the three spacecraft, first order in <c>α_L = L/(2R)</c>; the arms flex.</summary>
/// <remarks>
/// <para>Construction of Dhurandhar, Nayak, Koshti &amp; Vinet 2005, CQG 22, 481 (arXiv:gr-qc/0410093), re-derived
/// here rather than copied (derived: Kepler ellipse written with <c>(cos ψ + e)</c> so that the Sun sits at a focus;
/// first-order e and ε from requiring equal arms to first order in α_L): spacecraft k (σ_k = 2π(k−1)/3) moves on an ellipse with the Sun at
/// a focus, eccentricity <c>e = α_L/√3</c> and inclination <c>ε = α_L</c>. Its eccentric anomaly ψ_k solves
/// <c>ψ_k + e sin ψ_k = 2πt/T − σ_k + κ</c> (Newton iteration), its in-orbit coordinates are
/// <c>X = R(cos ψ + e) cos ε</c>, <c>Y = R√(1−e²) sin ψ</c>, <c>Z = R(cos ψ + e) sin ε</c>, and (X, Y) is then rotated
/// by σ_k about the ecliptic pole. The usual initial phase φ0 is <c>−κ</c> here, so that κ is, to first order in e,
/// the ecliptic longitude of the constellation centre at t = 0 as in <see cref="RigidOrbits"/>.</para>
/// <para>With these first-order e and ε the arms flex by about ±6e6 m over a year (Yang 2025, arXiv:2501.00936,
/// quotes ~1.2e4 km peak to peak for this optimum).</para>
/// <para>Light times are solved from <c>|x_i(t) − x_j(t − τ)| = cτ</c> (<see cref="LinkGeometry.SolveLightTimeSeconds"/>),
/// so they include the flexing, the Sagnac effect and the point-ahead of the moving constellation.</para>
/// </remarks>
public sealed class EccentricOrbits : IConstellationOrbits
{
    private const int MaxKeplerIterations = 50;

    private readonly double _meanMotionRadS;
    private readonly double _cosInclination;
    private readonly double _sinInclination;
    private readonly double _semiMinorFactor;
    private readonly double[] _cosSigma = new double[3];
    private readonly double[] _sinSigma = new double[3];
    private readonly double[] _sigma = new double[3];

    /// <summary>Creates the orbits.</summary>
    /// <param name="armLengthM">Nominal arm length L; default 2.5e9 m.</param>
    /// <param name="orbitRadiusM">Semi-major axis R; default 1 au.</param>
    /// <param name="periodSeconds">Orbital period T; default the sidereal year.</param>
    /// <param name="initialOrbitalPhaseRad">κ: ecliptic longitude of the constellation centre at t = 0 (first order in e).</param>
    /// <exception cref="ArgumentOutOfRangeException">A length or the period is not positive and finite, the arm
    /// is not much shorter than the radius (L ≥ R/10), or the angle is not finite.</exception>
    public EccentricOrbits(
        double armLengthM = 2.5e9,
        double orbitRadiusM = PhysicalConstants.AstronomicalUnitM,
        double periodSeconds = PhysicalConstants.SiderealYearS,
        double initialOrbitalPhaseRad = 0.0)
    {
        OrbitArguments.CheckShape(armLengthM, orbitRadiusM, periodSeconds);
        OrbitArguments.CheckAngle(initialOrbitalPhaseRad, nameof(initialOrbitalPhaseRad));
        ArmLengthM = armLengthM;
        OrbitRadiusM = orbitRadiusM;
        PeriodSeconds = periodSeconds;
        InitialOrbitalPhaseRad = initialOrbitalPhaseRad;
        double alphaL = armLengthM / (2.0 * orbitRadiusM);
        Eccentricity = alphaL / Math.Sqrt(3.0);
        InclinationRad = alphaL;
        _meanMotionRadS = 2.0 * Math.PI / periodSeconds;
        _cosInclination = Math.Cos(InclinationRad);
        _sinInclination = Math.Sin(InclinationRad);
        _semiMinorFactor = Math.Sqrt(1.0 - Eccentricity * Eccentricity);
        for (int k = 0; k < 3; k++)
        {
            _sigma[k] = 2.0 * Math.PI * k / 3.0;
            _cosSigma[k] = Math.Cos(_sigma[k]);
            _sinSigma[k] = Math.Sin(_sigma[k]);
        }
    }

    /// <inheritdoc/>
    public double ArmLengthM { get; }

    /// <summary>Semi-major axis R of each spacecraft orbit.</summary>
    /// <value>m.</value>
    public double OrbitRadiusM { get; }

    /// <inheritdoc/>
    public double PeriodSeconds { get; }

    /// <summary>κ, the ecliptic longitude of the constellation centre at t = 0 (first order in e).</summary>
    /// <value>rad.</value>
    public double InitialOrbitalPhaseRad { get; }

    /// <summary>Eccentricity of each spacecraft orbit, <c>L/(2√3 R)</c>.</summary>
    public double Eccentricity { get; }

    /// <summary>Inclination of each spacecraft orbit to the ecliptic, <c>L/(2R)</c>.</summary>
    /// <value>rad.</value>
    public double InclinationRad { get; }

    /// <inheritdoc/>
    public Vector3D Position(int spacecraft, double timeSeconds)
    {
        SpacecraftLabel.Check(spacecraft, nameof(spacecraft));
        int k = spacecraft - 1;
        double meanAnomaly = _meanMotionRadS * timeSeconds - _sigma[k] + InitialOrbitalPhaseRad;
        double psi = SolveKepler(meanAnomaly);
        var (sinPsi, cosPsi) = Math.SinCos(psi);
        double inPlane = OrbitRadiusM * (cosPsi + Eccentricity);
        double x = inPlane * _cosInclination;
        double y = OrbitRadiusM * _semiMinorFactor * sinPsi;
        return new Vector3D(
            x * _cosSigma[k] - y * _sinSigma[k],
            x * _sinSigma[k] + y * _cosSigma[k],
            inPlane * _sinInclination);
    }

    /// <inheritdoc/>
    /// <remarks>Solved iteratively for the moving, flexing constellation (see the type remarks).</remarks>
    public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds) =>
        LinkGeometry.SolveLightTimeSeconds(this, receiver, sender, receptionTimeSeconds);

    /// <summary>Eccentric anomaly ψ with <c>ψ + e sin ψ = M</c>, by Newton iteration from <c>ψ = M − e sin M</c>.</summary>
    /// <remarks>Newton converges quadratically: after a step δ the error left is about (e/2) δ², so stopping once
    /// |δ| ≤ 1e-9 leaves less than 1e-20 rad. From the first-order start this takes two steps for e ~ 5e-3.</remarks>
    private double SolveKepler(double meanAnomaly)
    {
        // Reducing M to [−π, π] keeps the convergence test on an absolute scale of one radian.
        double m = Math.IEEERemainder(meanAnomaly, 2.0 * Math.PI);
        double psi = m - Eccentricity * Math.Sin(m);
        for (int iteration = 0; iteration < MaxKeplerIterations; iteration++)
        {
            var (sin, cos) = Math.SinCos(psi);
            double step = (psi + Eccentricity * sin - m) / (1.0 + Eccentricity * cos);
            psi -= step;
            if (Math.Abs(step) <= 1e-9)
                return psi;
        }
        throw new InvalidOperationException($"Kepler equation did not converge for mean anomaly {meanAnomaly} rad");
    }
}
