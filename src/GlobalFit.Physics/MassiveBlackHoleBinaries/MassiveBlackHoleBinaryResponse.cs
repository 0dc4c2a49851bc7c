using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>Frequency-domain TDI response (first-generation A, E, T) of the constellation to a chirping (2,2)-mode signal.</summary>
/// <remarks>
/// <para>For a signal whose frequency sweeps monotonically, the part of the response that varies with the orbit is evaluated at
/// the time t(f) at which frequency f is emitted (stationary phase; Marsat &amp; Baker 2018, arXiv:1806.10734, leading order;
/// Cornish &amp; Rubbo 2003, arXiv:gr-qc/0209011 for the link response). With the project's transform
/// <c>x̃(f) = ∫ x(t) e^{−2πift} dt</c>, a delay τ multiplies by <c>e^{−2πifτ}</c>, and the one-way link ij (received at i, sent by
/// j, <c>n = (x_i − x_j)/|x_i − x_j|</c>, positions and arm L in light-seconds at t(f)) of <see cref="PlaneWaveLinks"/> becomes
/// (derived from its time-domain formula with the positions held fixed)
/// <c>ỹ_ij(f) = −iπfL sinc(πfL(1 − k·n)) e^{−iπf(L + k·(x_i + x_j))} (n·P·n) h̃22(f)</c>,
/// where <c>P = K+ ε+(ψ) + K× ε×(ψ)</c> (tensors of <see cref="PolarisationBasis"/>), <c>K+ = √(5/64π)(1 + cos²ι) e^{−2iφ_ref}</c>,
/// <c>K× = −2i cos ι √(5/64π) e^{−2iφ_ref}</c>, i.e. <c>h̃+ = K+ h̃22</c>, <c>h̃× = K× h̃22</c> (Khan et al. 2016, arXiv:1508.07253, with
/// the −2Y22 and −2Y2−2 harmonics; this reproduces the galactic-binary convention <c>h+ ∝ (1 + cos²ι) cos Φ</c>,
/// <c>h× ∝ 2 cos ι sin Φ</c>). Michelson TDI with equal constant arms (<c>z = e^{−2πifL}</c>, L the nominal arm):
/// <c>X̃ = (1 − z²)(r̃12 − r̃13)</c> with <c>r̃ij = ỹij + z ỹji</c>, Y, Z cyclic, and A, E, T as in
/// <see cref="Series.TdiCombination"/>. No long-wavelength approximation is made.</para>
/// <para>Errors: all arms are taken at the nominal length L in the link factors as in the TDI delays (exact for
/// <see cref="RigidOrbits"/>; for flexing orbits a ~1 % arm change shifts a link phase by πfΔL, ~0.01 rad at 40 mHz). The orbit is
/// frozen over the light time (~1e-4 of L in position) and the response is taken at the single time
/// t(f); the next-order terms (Marsat &amp; Baker 2018) matter only for slowly chirping signals. Tests compare with the slow
/// time-domain reference (<see cref="SlowReferenceResponse"/>).</para>
/// <para>Immutable and thread-safe when the orbits are.</para>
/// </remarks>
public sealed class MassiveBlackHoleBinaryResponse
{
    private static readonly double HarmonicNorm = Math.Sqrt(5.0 / (64.0 * Math.PI));
    private static readonly double InvSqrt2 = 1.0 / Math.Sqrt(2.0);
    private static readonly double InvSqrt6 = 1.0 / Math.Sqrt(6.0);
    private static readonly double InvSqrt3 = 1.0 / Math.Sqrt(3.0);
    private readonly ConstellationSnapshot _snapshot;

    /// <summary>Response of the constellation <paramref name="orbits"/>.</summary>
    public MassiveBlackHoleBinaryResponse(IConstellationOrbits orbits)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        Orbits = orbits;
        _snapshot = new ConstellationSnapshot(orbits);
        ArmLightTimeS = orbits.ArmLengthM / PhysicalConstants.SpeedOfLightMS;
    }

    /// <summary>The constellation.</summary>
    public IConstellationOrbits Orbits { get; }

    /// <summary>Nominal arm light time used in the TDI delays.</summary>
    /// <value>s.</value>
    public double ArmLightTimeS { get; }

    /// <summary>Writes the transfer functions <c>T_c(f)</c> with <c>c̃(f) = T_c(f) h̃22(f)</c> for c = A, E, T into the caller's spans.
    /// Allocation-free.</summary>
    /// <param name="frequenciesHz">Positive frequencies.</param>
    /// <param name="timesS">t(f) for each frequency, on the orbits' time axis.</param>
    /// <param name="sky">Source direction.</param>
    /// <param name="polarisationRad">ψ.</param>
    /// <param name="inclinationRad">ι.</param>
    /// <param name="referencePhaseRad">φ_ref.</param>
    /// <param name="a">Transfer to A (same length as the frequencies).</param>
    /// <param name="e">Transfer to E.</param>
    /// <param name="t">Transfer to T; may be empty to skip it.</param>
    /// <exception cref="ArgumentException">A span's length does not match.</exception>
    public void Transfer(
        ReadOnlySpan<double> frequenciesHz,
        ReadOnlySpan<double> timesS,
        SkyPosition sky,
        double polarisationRad,
        double inclinationRad,
        double referencePhaseRad,
        Span<Complex> a,
        Span<Complex> e,
        Span<Complex> t)
    {
        int n = frequenciesHz.Length;
        if (timesS.Length != n || a.Length != n || e.Length != n || (t.Length != n && !t.IsEmpty))
            throw new ArgumentException("times and output spans must match the frequency count (T may be empty)");
        var basis = new PolarisationBasis(sky, polarisationRad);
        var (kPlus, kCross) = PolarisationFactors(inclinationRad, referencePhaseRad);
        var k = basis.K;
        const double invC = 1.0 / PhysicalConstants.SpeedOfLightMS;
        double armTime = ArmLightTimeS;
        bool withT = !t.IsEmpty;

        for (int i = 0; i < n; i++)
        {
            double f = frequenciesHz[i];
            _snapshot.Positions(timesS[i], out var p1, out var p2, out var p3);
            var x1 = invC * p1;
            var x2 = invC * p2;
            var x3 = invC * p3;
            double piF = Math.PI * f;
            // e^{−iπf k·x_p} per spacecraft: each link's phase e^{−iπf(L + k·(x_p + x_q))} is a product of two of them and
            // e^{−iπfL}.
            var (s1, c1) = Math.SinCos(-piF * k.Dot(x1));
            var (s2, c2) = Math.SinCos(-piF * k.Dot(x2));
            var (s3, c3) = Math.SinCos(-piF * k.Dot(x3));
            var e1 = new Complex(c1, s1);
            var e2 = new Complex(c2, s2);
            var e3 = new Complex(c3, s3);
            // πfL with the nominal arm serves the link phases, the sincs and the TDI delay z = e^{−2πifL}.
            double piFL = piF * armTime;
            var (sinArm, cosArm) = Math.SinCos(piFL);
            var halfDelay = new Complex(cosArm, -sinArm);          // e^{−iπfL}

            // Links along the three arms; each arm serves both directions (n flips sign, the pattern does not).
            Link(piFL, sinArm, cosArm, x1, x2, halfDelay * e1 * e2, k, basis, kPlus, kCross, out var y12, out var y21);
            Link(piFL, sinArm, cosArm, x2, x3, halfDelay * e2 * e3, k, basis, kPlus, kCross, out var y23, out var y32);
            Link(piFL, sinArm, cosArm, x3, x1, halfDelay * e3 * e1, k, basis, kPlus, kCross, out var y31, out var y13);

            var z = halfDelay * halfDelay;
            var oneMinusZ2 = 1.0 - z * z;
            var x = oneMinusZ2 * (y12 + z * y21 - y13 - z * y31);
            var y = oneMinusZ2 * (y23 + z * y32 - y21 - z * y12);
            var zz = oneMinusZ2 * (y31 + z * y13 - y32 - z * y23);
            a[i] = (zz - x) * InvSqrt2;
            e[i] = (x - 2.0 * y + zz) * InvSqrt6;
            if (withT) t[i] = (x + y + zz) * InvSqrt3;
        }
    }

    /// <summary><c>K+</c> and <c>K×</c>: h̃+ and h̃× per unit h̃22 (see the type remarks).</summary>
    public static (Complex Plus, Complex Cross) PolarisationFactors(double inclinationRad, double referencePhaseRad)
    {
        double cosIota = Math.Cos(inclinationRad);
        var phase = Complex.FromPolarCoordinates(HarmonicNorm, -2.0 * referencePhaseRad);
        return (phase * (1.0 + cosIota * cosIota), phase * new Complex(0.0, -2.0 * cosIota));
    }

    /// <summary>The two one-way links along the arm between spacecraft <c>p</c> and <c>q</c>: y_pq (received at p) and y_qp.</summary>
    /// <param name="piFL">πfL with the nominal arm L.</param>
    /// <param name="sinArm">sin(πfL).</param>
    /// <param name="cosArm">cos(πfL).</param>
    /// <param name="xp">Position of p in light-seconds.</param>
    /// <param name="xq">Position of q in light-seconds.</param>
    /// <param name="phase"><c>e^{−iπf(L + k·(x_p + x_q))}</c>.</param>
    /// <param name="k">Propagation direction.</param>
    /// <param name="basis">Polarisation frame.</param>
    /// <param name="kPlus">K+.</param>
    /// <param name="kCross">K×.</param>
    /// <param name="ypq">ỹ_pq per unit h̃22.</param>
    /// <param name="yqp">ỹ_qp per unit h̃22.</param>
    private static void Link(double piFL, double sinArm, double cosArm, Vector3D xp, Vector3D xq, Complex phase, Vector3D k,
        PolarisationBasis basis, Complex kPlus, Complex kCross, out Complex ypq, out Complex yqp)
    {
        var d = xp - xq;
        var nHat = d / d.Length;                // from q to p
        var (patternPlus, patternCross) = basis.LinkPattern(nHat);
        var pattern = kPlus * patternPlus + kCross * patternCross;
        double kn = k.Dot(nHat);
        // sin(πfL(1 ∓ k·n)) from the sines and cosines of πfL and πfL k·n.
        var (sinB, cosB) = Math.SinCos(piFL * kn);
        var common = phase * pattern * new Complex(0.0, -piFL);
        ypq = common * SincFromSine(sinArm * cosB - cosArm * sinB, piFL * (1.0 - kn));
        yqp = common * SincFromSine(sinArm * cosB + cosArm * sinB, piFL * (1.0 + kn));
    }

    /// <summary>sin(x)/x given sin(x); the limit 1 − x²/6 where x is tiny (and sin(x)/x loses digits).</summary>
    private static double SincFromSine(double sine, double x) => Math.Abs(x) < 1e-4 ? 1.0 - x * x / 6.0 : sine / x;
}
