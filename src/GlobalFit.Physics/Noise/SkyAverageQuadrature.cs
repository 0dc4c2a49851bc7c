using System.Numerics;
using MathNet.Numerics.Integration;

namespace GlobalFit.Physics.Noise;

/// <summary>Sky- and polarisation-averaged squared responses of the TDI channels at one dimensionless frequency.</summary>
/// <param name="X">R_X = ⟨|X|²⟩/(16x² sin²x).</param>
/// <param name="A">R_A, same normalisation.</param>
/// <param name="E">R_E, same normalisation.</param>
/// <param name="T">R_T, same normalisation.</param>
/// <param name="AE">⟨A E*⟩/(16x² sin²x), zero for an isotropic average.</param>
internal readonly record struct SkyAverages(double X, double A, double E, double T, Complex AE);

/// <summary>
/// Direct quadrature of the static, equal-arm TDI response to a unit-amplitude plane wave of one
/// polarisation, averaged over the sky and the polarisation angle.
/// </summary>
/// <remarks>
/// <para>Link response (midpoint/sinc form of the two-point formula of Estabrook &amp; Wahlquist 1975; derived:
/// monochromatic wave, referred to the arm's midpoint): with arm positions in units of L and <c>u = k·n_ij</c>,
/// <c>ỹ_ij = (−ix/2) e^{−ix/2} (n_ij·H·n_ij) sinc[x(1 − u)/2] e^{−ix k·p_mid}</c>. Round trips
/// <c>r_ij = y_ij + D y_ji</c>, <c>D = e^{−ix}</c>, and <c>X = (1 − D²)(r_12 − r_13)</c> (<see cref="Detector.MichelsonTdi"/>
/// with equal static arms) with Y, Z cyclic; A, E, T as in <see cref="Series.TdiCombination"/>. Since
/// <c>|1 − D²|² = 4 sin²x</c>, the normalised response
/// <c>|X|²/(16x² sin²x)</c> equals <c>|r_12 − r_13|²/(4x²)</c>, and dropping the common factor
/// <c>(−ix/2) e^{−ix/2}</c> of every link leaves a quantity that is finite at x = 0 and at the zeros of sin x.</para>
/// <para>Averages: polarisation by <c>½(|F₊|² + |F×|²)</c> (equal to the ψ average), sky by a product
/// rule, Gauss–Legendre in <c>cos θ</c> and the trapezoid rule in φ, both spectrally convergent for this
/// smooth integrand. The triangle lies in the z = 0 plane, so the reflection z → −z leaves every averaged
/// quantity unchanged and only the upper hemisphere is integrated.</para>
/// </remarks>
internal static class SkyAverageQuadrature
{
    private static readonly double Sqrt3 = Math.Sqrt(3.0);

    /// <summary>Number of <c>cos θ</c> nodes on the hemisphere for frequency x: measured to agree with twice as
    /// many nodes to 1e-12 absolute for 0 ≤ x ≤ 40 (e.g. 10 nodes reach 3e-12 at x = 10 and 16 reach 1e-12 at x = 20).</summary>
    internal static int DefaultLatitudeNodes(double x) => 10 + (int)Math.Ceiling(0.6 * x);

    /// <summary>Averages at <paramref name="x"/> with the default node count.</summary>
    internal static SkyAverages Average(double x) => Average(x, DefaultLatitudeNodes(x));

    /// <summary>Averages at <paramref name="x"/> with <paramref name="latitudeNodes"/> Gauss nodes in <c>cos θ</c>
    /// on [0, 1] and twice as many (plus eight) trapezoid nodes in φ.</summary>
    internal static SkyAverages Average(double x, int latitudeNodes)
    {
        var rule = new GaussLegendreRule(0.0, 1.0, latitudeNodes);
        int azimuthNodes = 2 * latitudeNodes + 8;
        double sumX = 0, sumA = 0, sumE = 0, sumT = 0;
        Complex sumAE = 0;
        var delay = Complex.FromPolarCoordinates(1.0, -x);
        for (int i = 0; i < latitudeNodes; i++)
        {
            double mu = rule.Abscissas[i];
            double sinTheta = Math.Sqrt(Math.Max(0.0, 1.0 - mu * mu));
            double ringX = 0, ringA = 0, ringE = 0, ringT = 0;
            Complex ringAE = 0;
            for (int j = 0; j < azimuthNodes; j++)
            {
                double phi = 2.0 * Math.PI * j / azimuthNodes;
                var (x2, a2, e2, t2, ae) = Direction(x, mu, sinTheta, phi, delay);
                ringX += x2; ringA += a2; ringE += e2; ringT += t2; ringAE += ae;
            }
            double w = rule.Weights[i] / azimuthNodes;
            sumX += w * ringX; sumA += w * ringA; sumE += w * ringE; sumT += w * ringT; sumAE += w * ringAE;
        }
        // |X|²/(16x² sin²x) = |X'|²/16 with X' = r_12 − r_13 built from the reduced links; ½ for the polarisation average.
        const double norm = 1.0 / 32.0;
        return new SkyAverages(norm * sumX, norm * sumA, norm * sumE, norm * sumT, norm * sumAE);
    }

    private static (double X, double A, double E, double T, Complex AE) Direction(double x, double mu, double sinTheta, double phi, Complex delay)
    {
        double cosPhi = Math.Cos(phi), sinPhi = Math.Sin(phi);
        double kx = sinTheta * cosPhi, ky = sinTheta * sinPhi;
        double ux = mu * cosPhi, uy = mu * sinPhi; // u = (cosθ cosφ, cosθ sinφ, −sinθ); its z part meets no arm
        double vx = -sinPhi, vy = cosPhi;

        // Arms as p_i − p_j for (1,2), (2,3), (3,1) with p1 = 0, p2 = (1,0,0), p3 = (1/2, √3/2, 0).
        var arm12 = Arm(-1.0, 0.0, kx, ky, ux, uy, vx, vy, x, 0.5, 0.0);
        var arm23 = Arm(0.5, -0.5 * Sqrt3, kx, ky, ux, uy, vx, vy, x, 0.75, 0.25 * Sqrt3);
        var arm31 = Arm(0.5, 0.5 * Sqrt3, kx, ky, ux, uy, vx, vy, x, 0.25, 0.25 * Sqrt3);

        double x2 = 0, a2 = 0, e2 = 0, t2 = 0;
        Complex ae = 0;
        for (int polarisation = 0; polarisation < 2; polarisation++)
        {
            // Link i←j along arm (i,j) uses u = k·n_ij; the reverse link j←i uses −u.
            Complex y12 = arm12.Link(polarisation, forward: true), y21 = arm12.Link(polarisation, forward: false);
            Complex y23 = arm23.Link(polarisation, forward: true), y32 = arm23.Link(polarisation, forward: false);
            Complex y31 = arm31.Link(polarisation, forward: true), y13 = arm31.Link(polarisation, forward: false);
            Complex r12 = y12 + delay * y21, r13 = y13 + delay * y31;
            Complex r23 = y23 + delay * y32, r21 = y21 + delay * y12;
            Complex r31 = y31 + delay * y13, r32 = y32 + delay * y23;
            Complex mx = r12 - r13, my = r23 - r21, mz = r31 - r32;
            Complex a = (mz - mx) / Math.Sqrt(2.0);
            Complex e = (mx - 2.0 * my + mz) / Math.Sqrt(6.0);
            Complex t = (mx + my + mz) / Sqrt3;
            x2 += mx.Real * mx.Real + mx.Imaginary * mx.Imaginary;
            a2 += a.Real * a.Real + a.Imaginary * a.Imaginary;
            e2 += e.Real * e.Real + e.Imaginary * e.Imaginary;
            t2 += t.Real * t.Real + t.Imaginary * t.Imaginary;
            ae += a * Complex.Conjugate(e);
        }
        return (x2, a2, e2, t2, ae);
    }

    private static ArmTerms Arm(double nx, double ny, double kx, double ky, double ux, double uy, double vx, double vy,
        double x, double midX, double midY)
    {
        double nu = nx * ux + ny * uy, nv = nx * vx + ny * vy;
        double kn = nx * kx + ny * ky;
        var midpoint = Complex.FromPolarCoordinates(1.0, -x * (kx * midX + ky * midY));
        return new ArmTerms(nu * nu - nv * nv, 2.0 * nu * nv,
            midpoint * Sinc(0.5 * x * (1.0 - kn)), midpoint * Sinc(0.5 * x * (1.0 + kn)));
    }

    private static double Sinc(double z) => Math.Abs(z) < 1e-8 ? 1.0 - z * z / 6.0 : Math.Sin(z) / z;

    /// <summary>Per-arm pieces: the two polarisation projections and the transfer factor of each direction.</summary>
    private readonly record struct ArmTerms(double Plus, double Cross, Complex Forward, Complex Backward)
    {
        public Complex Link(int polarisation, bool forward) => (polarisation == 0 ? Plus : Cross) * (forward ? Forward : Backward);
    }
}
