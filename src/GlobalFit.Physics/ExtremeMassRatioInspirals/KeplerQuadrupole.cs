using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The quadrupole strain tensor of a Kepler orbit in closed form: the sum of all harmonics of the analytic
/// kludge at fixed orbital elements.</summary>
/// <remarks>
/// <para><c>h_ij = (2μ/D) d²(r_i r_j)/dt² = (2μ/D)(2 v_i v_j + r_i a_j + a_i r_j)</c> with <c>a = −M r/|r|³</c> (quadrupole
/// formula, e.g. Peters &amp; Mathews 1963, Eq. 1), for the Kepler orbit
/// <c>r = a(cos E − e) P + a√(1 − e²) sin E Q</c>, <c>Φ = E − e sin E</c>, <c>a = M^{1/3}(2πν)^{−2/3}</c>, with P the
/// pericentre direction (at angle γ̃ from the node) and Q the in-plane axis 90° ahead of it. Barack &amp; Cutler 2004
/// (arXiv:gr-qc/0310125) expand the same tensor, with the elements Φ, ν, e, γ̃ and L̂ evolving slowly, in the
/// harmonics of Φ (their Eqs. 7–9); the tests check that the two agree.</para>
/// </remarks>
internal static class KeplerQuadrupole
{
    /// <summary>Eccentric anomaly E from the mean anomaly Φ (Kepler's equation, Newton's method from E = Φ + e sin Φ).</summary>
    public static double EccentricAnomaly(double meanAnomaly, double e)
    {
        double m = Math.IEEERemainder(meanAnomaly, 2 * Math.PI);
        double big = m + e * Math.Sin(m);
        for (int i = 0; i < 30; i++)
        {
            var (s, c) = Math.SinCos(big);
            double step = (big - e * s - m) / (1 - e * c);
            big -= step;
            if (Math.Abs(step) < 1e-14) break;
        }
        return big;
    }

    /// <summary>The tensor <c>d²(r_i r_j)/dt²</c> divided by <c>(Mω)^{2/3}</c>, ω = 2πν (so that <c>h = 2(μ/D)(Mω)^{2/3}</c>
    /// times it; <c>(μ/D)(Mω)^{2/3}</c> is Barack &amp; Cutler's amplitude A).</summary>
    public static SymmetricTensor ScaledSecondDerivative(double meanAnomaly, double e, Vector3D pericentre, Vector3D ahead)
    {
        double big = EccentricAnomaly(meanAnomaly, e);
        var (s, c) = Math.SinCos(big);
        double root = Math.Sqrt(1 - e * e);
        double denominator = 1 - e * c;
        // Units a = 1, ω = 1, M = a³ω² = 1: r, v = dr/dt and acceleration −r/|r|³.
        double x = c - e, y = root * s;
        double vx = -s / denominator, vy = root * c / denominator;
        double r = denominator;
        double inv3 = 1 / (r * r * r);
        var position = x * pericentre + y * ahead;
        var velocity = vx * pericentre + vy * ahead;
        var acceleration = -inv3 * position;
        return 2.0 * SymmetricTensor.Outer(velocity, velocity) + 2.0 * SymmetricTensor.Outer(position, acceleration);
    }
}
