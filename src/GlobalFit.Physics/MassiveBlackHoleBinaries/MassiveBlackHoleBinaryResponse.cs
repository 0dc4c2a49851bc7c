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
/// <para>Errors: the orbit is frozen over the light time (~1e-4 of L in position) and the response is taken at the single time
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

    /// <summary>Response of the constellation <paramref name="orbits"/>.</summary>
    public MassiveBlackHoleBinaryResponse(IConstellationOrbits orbits)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        Orbits = orbits;
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
            double time = timesS[i];
            var x1 = invC * Orbits.Position(1, time);
            var x2 = invC * Orbits.Position(2, time);
            var x3 = invC * Orbits.Position(3, time);
            double k1 = k.Dot(x1), k2 = k.Dot(x2), k3 = k.Dot(x3);

            // Links along the three arms; each arm serves both directions (n flips sign, the pattern does not).
            Link(f, x1, x2, k1, k2, k, basis, kPlus, kCross, out var y12, out var y21);
            Link(f, x2, x3, k2, k3, k, basis, kPlus, kCross, out var y23, out var y32);
            Link(f, x3, x1, k3, k1, k, basis, kPlus, kCross, out var y31, out var y13);

            var (sz, cz) = Math.SinCos(-2.0 * Math.PI * f * armTime);
            var z = new Complex(cz, sz);
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
    private static void Link(double f, Vector3D xp, Vector3D xq, double kp, double kq, Vector3D k, PolarisationBasis basis,
        Complex kPlus, Complex kCross, out Complex ypq, out Complex yqp)
    {
        var d = xp - xq;
        double length = d.Length;
        var nHat = d / length;                  // from q to p
        var (patternPlus, patternCross) = basis.LinkPattern(nHat);
        var pattern = kPlus * patternPlus + kCross * patternCross;
        double kn = k.Dot(nHat);
        double piFL = Math.PI * f * length;
        var (sm, cm) = Math.SinCos(-Math.PI * f * (length + kp + kq));
        var common = new Complex(cm, sm) * pattern * new Complex(0.0, -piFL);
        ypq = common * Sinc(piFL * (1.0 - kn));
        yqp = common * Sinc(piFL * (1.0 + kn));
    }

    private static double Sinc(double x) => Math.Abs(x) < 1e-6 ? 1.0 - x * x / 6.0 : Math.Sin(x) / x;
}
