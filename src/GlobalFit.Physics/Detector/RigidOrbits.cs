using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Detector;

/// <summary>First-order analytic orbits that keep the constellation an exactly rigid equilateral triangle.</summary>
/// <remarks>
/// <para>Cornish &amp; Rubbo 2003, PRD 67, 022001 (arXiv:gr-qc/0209011; formula from memory, its geometric properties
/// derived: numerical check that the arms stay equal to 1e-14 and the plane tilted by 60°): with
/// <c>α = 2πt/T + κ</c>, <c>β_n = 2π(n−1)/3 + λ0</c> and
/// <c>e = L/(2√3 R)</c>,
/// <c>x_n = R cos α + (eR/2)[cos(2α − β_n) − 3 cos β_n]</c>, <c>y_n = R sin α + (eR/2)[sin(2α − β_n) − 3 sin β_n]</c>,
/// <c>z_n = −√3 eR cos(α − β_n)</c>. The centroid moves on a circle of radius R, the triangle plane is tilted
/// 60° to the ecliptic and the triangle turns once per period within that plane, against the orbital sense.</para>
/// <para>Light times are the constant L/c: the point-ahead correction (~1e-4 of L/c) and the Sagnac difference
/// between the two senses of circulation (~1e-5 s; derived: 4AΩ_n/c² for the triangle's area A and its rotation rate
/// Ω_n = Ω/2 about its normal, Ω = 2π/yr) are ignored, consistently with the rigid model.</para>
/// <para>The default period is the sidereal year, the period of an orbit fixed relative to the stars; the
/// default radius is 1 au.</para>
/// </remarks>
public sealed class RigidOrbits : IConstellationOrbits
{
    private readonly double _angularFrequency;
    private readonly double _epicycleRadiusM;
    private readonly double[] _cosBeta = new double[3];
    private readonly double[] _sinBeta = new double[3];

    /// <summary>Creates the orbits.</summary>
    /// <param name="armLengthM">Arm length L; default 2.5e9 m.</param>
    /// <param name="orbitRadiusM">Radius R of the guiding-centre orbit; default 1 au.</param>
    /// <param name="periodSeconds">Orbital period T; default the sidereal year.</param>
    /// <param name="initialOrbitalPhaseRad">κ: ecliptic longitude of the constellation centre at t = 0.</param>
    /// <param name="initialOrientationRad">λ0: orientation of the triangle within its plane at t = 0.</param>
    /// <exception cref="ArgumentOutOfRangeException">A length or the period is not positive and finite, the arm
    /// is not much shorter than the radius (L ≥ R/10), or an angle is not finite.</exception>
    public RigidOrbits(
        double armLengthM = 2.5e9,
        double orbitRadiusM = PhysicalConstants.AstronomicalUnitM,
        double periodSeconds = PhysicalConstants.SiderealYearS,
        double initialOrbitalPhaseRad = 0.0,
        double initialOrientationRad = 0.0)
    {
        OrbitArguments.CheckShape(armLengthM, orbitRadiusM, periodSeconds);
        OrbitArguments.CheckAngle(initialOrbitalPhaseRad, nameof(initialOrbitalPhaseRad));
        OrbitArguments.CheckAngle(initialOrientationRad, nameof(initialOrientationRad));
        ArmLengthM = armLengthM;
        OrbitRadiusM = orbitRadiusM;
        PeriodSeconds = periodSeconds;
        InitialOrbitalPhaseRad = initialOrbitalPhaseRad;
        InitialOrientationRad = initialOrientationRad;
        Eccentricity = armLengthM / (2.0 * Math.Sqrt(3.0) * orbitRadiusM);
        _angularFrequency = 2.0 * Math.PI / periodSeconds;
        _epicycleRadiusM = Eccentricity * orbitRadiusM;
        for (int n = 0; n < 3; n++)
        {
            double beta = 2.0 * Math.PI * n / 3.0 + initialOrientationRad;
            _cosBeta[n] = Math.Cos(beta);
            _sinBeta[n] = Math.Sin(beta);
        }
    }

    /// <inheritdoc/>
    public double ArmLengthM { get; }

    /// <summary>Radius R of the guiding-centre orbit.</summary>
    /// <value>m.</value>
    public double OrbitRadiusM { get; }

    /// <inheritdoc/>
    public double PeriodSeconds { get; }

    /// <summary>κ, the ecliptic longitude of the constellation centre at t = 0.</summary>
    /// <value>rad.</value>
    public double InitialOrbitalPhaseRad { get; }

    /// <summary>λ0, the orientation of the triangle within its plane at t = 0.</summary>
    /// <value>rad.</value>
    public double InitialOrientationRad { get; }

    /// <summary>Eccentricity of each spacecraft orbit, <c>e = L/(2√3 R)</c>.</summary>
    public double Eccentricity { get; }

    /// <inheritdoc/>
    public Vector3D Position(int spacecraft, double timeSeconds)
    {
        SpacecraftLabel.Check(spacecraft, nameof(spacecraft));
        int n = spacecraft - 1;
        double alpha = _angularFrequency * timeSeconds + InitialOrbitalPhaseRad;
        var (sinAlpha, cosAlpha) = Math.SinCos(alpha);
        double cosBeta = _cosBeta[n], sinBeta = _sinBeta[n];
        // cos(2α − β), sin(2α − β) and cos(α − β) by angle addition, to avoid three more trig calls.
        double cos2Alpha = cosAlpha * cosAlpha - sinAlpha * sinAlpha;
        double sin2Alpha = 2.0 * sinAlpha * cosAlpha;
        double cos2AlphaMinusBeta = cos2Alpha * cosBeta + sin2Alpha * sinBeta;
        double sin2AlphaMinusBeta = sin2Alpha * cosBeta - cos2Alpha * sinBeta;
        double cosAlphaMinusBeta = cosAlpha * cosBeta + sinAlpha * sinBeta;
        double half = 0.5 * _epicycleRadiusM;
        return new Vector3D(
            OrbitRadiusM * cosAlpha + half * (cos2AlphaMinusBeta - 3.0 * cosBeta),
            OrbitRadiusM * sinAlpha + half * (sin2AlphaMinusBeta - 3.0 * sinBeta),
            -Math.Sqrt(3.0) * _epicycleRadiusM * cosAlphaMinusBeta);
    }

    /// <inheritdoc/>
    /// <remarks>Always L/c in this model (see the type remarks).</remarks>
    public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds)
    {
        SpacecraftLabel.CheckLink(receiver, sender);
        return ArmLengthM / PhysicalConstants.SpeedOfLightMS;
    }
}
