using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>Everything about one inspiral that does not change along its trajectory: evolution equations, initial
/// state, directions, amplitude scale and the constant tensors of its precession sidebands.</summary>
/// <remarks>
/// <para>The strain of the analytic kludge, written as a tensor in the precessing orbital frame (derived here from
/// the Kepler quadrupole, see <see cref="KeplerQuadrupole"/>, and equal to Barack &amp; Cutler 2004 Eqs. 7–11, see the
/// tests), is <c>h = Re Σ_n [ −nA(α_n + β_n) e^{i(nΦ + 2γ̃)} M̄ − nA(α_n − β_n) e^{i(nΦ − 2γ̃)} M + 4A J_n(ne) e^{inΦ} I ]</c>
/// with <c>m = node + i·ahead</c>, <c>M = m ⊗ m</c>, <c>I = node ⊗ node + ahead ⊗ ahead</c> and A = (2πMν)^{2/3} μ/D;
/// α_n, β_n as in <see cref="PetersMathewsHarmonics"/>. Call the three terms of harmonic n its voices s = +1, −1, 0.</para>
/// <para>The frame turns about Ŝ with α, so each of M̄, M, I is a trigonometric polynomial of degree 2 in α:
/// <c>V_s(α) = Σ_{k=−2}^{2} V_{s,k} e^{ikα}</c>. The five V_{s,k} are found exactly by a five-point discrete Fourier
/// transform in α. Every voice thus splits into five sidebands with phase <c>nΦ + 2sγ̃ + kα</c> and a constant tensor:
/// the fast Lense–Thirring modulation (periods of hours) moves into the phase, and what is left in the amplitudes changes
/// only with e, ν and the detector's yearly motion. The tensors are stored after the transverse-traceless projection
/// along the line of sight.</para>
/// </remarks>
internal sealed class KludgeSource
{
    /// <summary>Sidebands per voice (k = −2 … 2).</summary>
    public const int SidebandCount = 5;

    public KludgeSource(in ExtremeMassRatioInspiralParameters p) => Set(p);

    /// <summary>An empty holder, filled by <see cref="Set"/> (reused without allocating).</summary>
    public KludgeSource()
    {
    }

    /// <summary>Recomputes everything for new parameters.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid.</exception>
    public void Set(in ExtremeMassRatioInspiralParameters p)
    {
        p.Validate();
        double m = p.CentralMassMsun * PhysicalConstants.SolarMassSeconds;
        double mu = p.CompactMassMsun * PhysicalConstants.SolarMassSeconds;
        Equations = new KludgeOrbitEquations(m, mu, p.CentralSpin, Math.Cos(p.OrbitInclinationRad));
        Parameters = p;
        TowardsSource = new SkyPosition(p.EclipticLatitudeRad, p.EclipticLongitudeRad).TowardsSource;
        var (st, ct) = Math.SinCos(p.SpinThetaRad);
        var (sp, cp) = Math.SinCos(p.SpinPhiRad);
        Orientation = new OrbitOrientation(new Vector3D(st * cp, st * sp, ct), Math.Cos(p.OrbitInclinationRad));
        double distanceSeconds = p.DistanceMpc * PhysicalConstants.MegaparsecM / PhysicalConstants.SpeedOfLightMS;
        MassOverDistance = mu / distanceSeconds;
        FillSidebands();
    }

    public ExtremeMassRatioInspiralParameters Parameters { get; private set; }

    public KludgeOrbitEquations Equations { get; private set; }

    public Vector3D TowardsSource { get; private set; }

    public OrbitOrientation Orientation { get; private set; }

    /// <summary>μ/D (dimensionless).</summary>
    public double MassOverDistance { get; private set; }

    /// <summary>Transverse-traceless sideband tensors, index <c>VoiceIndex(s) · 5 + (k + 2)</c>.</summary>
    public ComplexSymmetricTensor[] Sidebands { get; } = new ComplexSymmetricTensor[3 * SidebandCount];

    /// <summary>Initial state [Φ0, ν0, γ̃0, e0, α0].</summary>
    public void InitialState(Span<double> state)
    {
        state[KludgeOrbitEquations.Phase] = Parameters.Phi0Rad;
        state[KludgeOrbitEquations.Frequency] = Parameters.OrbitalFrequency0Hz;
        state[KludgeOrbitEquations.Pericentre] = Parameters.Gamma0Rad;
        state[KludgeOrbitEquations.Eccentricity] = Parameters.Eccentricity0;
        state[KludgeOrbitEquations.Precession] = Parameters.Alpha0Rad;
    }

    /// <summary>A = (2πMν)^{2/3} μ/D.</summary>
    public double Amplitude(double nu)
    {
        double y = 2 * Math.PI * Equations.CentralMassSeconds * nu;
        return Math.Cbrt(y * y) * MassOverDistance;
    }

    /// <summary>Storage index of voice s ∈ {+1, −1, 0}.</summary>
    public static int VoiceIndex(int s) => s switch { 1 => 0, -1 => 1, _ => 2 };

    /// <summary>Coefficient of voice s of harmonic n in units of A: −n(α_n + β_n), −n(α_n − β_n) or 4J_n(ne).</summary>
    public static void VoiceCoefficients(int n, double e, out double plus, out double minus, out double radial)
    {
        double x = n * e;
        double jm2 = IntegerBessel.J(n - 2, x), jm1 = IntegerBessel.J(n - 1, x), j0 = IntegerBessel.J(n, x);
        double jp1 = IntegerBessel.J(n + 1, x), jp2 = IntegerBessel.J(n + 2, x);
        double alpha = jm2 - 2 * e * jm1 + 2.0 / n * j0 + 2 * e * jp1 - jp2;
        double beta = Math.Sqrt(1 - e * e) * (jm2 - 2 * j0 + jp2);
        plus = -n * (alpha + beta);
        minus = -n * (alpha - beta);
        radial = 4 * j0;
    }

    private void FillSidebands()
    {
        Span<ComplexSymmetricTensor> samples = stackalloc ComplexSymmetricTensor[3 * SidebandCount];
        for (int q = 0; q < SidebandCount; q++)
        {
            double alpha = 2 * Math.PI * q / SidebandCount;
            var (node, ahead) = Orientation.PlaneAxes(alpha);
            var mm = ComplexSymmetricTensor.Outer(node, ahead, node, ahead);
            var zero = new Vector3D(0, 0, 0);
            var plane = ComplexSymmetricTensor.Outer(node, zero, node, zero) + ComplexSymmetricTensor.Outer(ahead, zero, ahead, zero);
            samples[VoiceIndex(1) * SidebandCount + q] = mm.Conjugate();
            samples[VoiceIndex(-1) * SidebandCount + q] = mm;
            samples[VoiceIndex(0) * SidebandCount + q] = plane;
        }
        for (int v = 0; v < 3; v++)
            for (int k = -2; k <= 2; k++)
            {
                var sum = default(ComplexSymmetricTensor);
                for (int q = 0; q < SidebandCount; q++)
                {
                    double angle = -k * 2 * Math.PI * q / SidebandCount;
                    sum += new Complex(Math.Cos(angle) / SidebandCount, Math.Sin(angle) / SidebandCount) * samples[v * SidebandCount + q];
                }
                Sidebands[v * SidebandCount + k + 2] = sum.TransverseTraceless(TowardsSource);
            }
    }
}
