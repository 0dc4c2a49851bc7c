namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The harmonic content of the quadrupole radiation of a Kepler orbit: the coefficients of harmonic n of the
/// mean anomaly, the power per harmonic g(n, e) and the total enhancement f(e).</summary>
/// <remarks>
/// <para>Peters &amp; Mathews 1963, Phys. Rev. 131, 435: power in harmonic n is <c>P_circ g(n, e)</c> with
/// <c>g(n, e) = (n⁴/32){[J_{n−2} − 2e J_{n−1} + (2/n) J_n + 2e J_{n+1} − J_{n+2}]² + (1 − e²)[J_{n−2} − 2J_n + J_{n+2}]²
/// + (4/(3n²)) J_n²}</c> (Eq. 20, equation numbers from memory; all J at argument n e), and <c>Σ_n g(n, e) = f(e) = (1 + 73/24 e² + 37/96 e⁴)(1 − e²)^{−7/2}</c>
/// (Eq. 17). The bracketed combinations are the same that Barack &amp; Cutler 2004 (arXiv:gr-qc/0310125, Eqs. 7–8) use
/// for the waveform amplitudes a_n, b_n, c_n: <see cref="Alpha"/>, <see cref="Beta"/>, <see cref="RadialBessel"/>.
/// Formulas recalled (from memory) and checked by the sum rule in the tests. Thread-safe.</para>
/// </remarks>
public static class PetersMathewsHarmonics
{
    /// <summary>f(e), the eccentricity enhancement of the radiated power.</summary>
    /// <exception cref="ArgumentOutOfRangeException">e lies outside [0, 1).</exception>
    public static double Enhancement(double e)
    {
        CheckEccentricity(e);
        double e2 = e * e;
        return (1 + 73.0 / 24 * e2 + 37.0 / 96 * e2 * e2) * Math.Pow(1 - e2, -3.5);
    }

    /// <summary>g(n, e), the fraction of the circular-orbit power radiated in harmonic n.</summary>
    /// <exception cref="ArgumentOutOfRangeException">n is not positive or e lies outside [0, 1).</exception>
    public static double Power(int n, double e)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(n);
        CheckEccentricity(e);
        double alpha = Alpha(n, e), beta = Beta(n, e), j = RadialBessel(n, e);
        return Math.Pow(n, 4) / 32.0 * (alpha * alpha + beta * beta + 4.0 / (3.0 * n * n) * j * j);
    }

    /// <summary><c>α_n = J_{n−2} − 2e J_{n−1} + (2/n) J_n + 2e J_{n+1} − J_{n+2}</c> at argument n e.</summary>
    public static double Alpha(int n, double e)
    {
        double x = n * e;
        return IntegerBessel.J(n - 2, x) - 2 * e * IntegerBessel.J(n - 1, x) + 2.0 / n * IntegerBessel.J(n, x)
             + 2 * e * IntegerBessel.J(n + 1, x) - IntegerBessel.J(n + 2, x);
    }

    /// <summary><c>β_n = (1 − e²)^{1/2} [J_{n−2} − 2J_n + J_{n+2}]</c> at argument n e.</summary>
    public static double Beta(int n, double e)
    {
        double x = n * e;
        return Math.Sqrt(1 - e * e) * (IntegerBessel.J(n - 2, x) - 2 * IntegerBessel.J(n, x) + IntegerBessel.J(n + 2, x));
    }

    /// <summary><c>J_n(n e)</c>, the coefficient of the radial (breathing) part of harmonic n.</summary>
    public static double RadialBessel(int n, double e) => IntegerBessel.J(n, n * e);

    /// <summary>The number of harmonics that carry a fraction <c>1 − <paramref name="lostPowerFraction"/></c> of the
    /// radiated power: the smallest N with <c>Σ_{n ≤ N} g(n, e) ≥ (1 − ε) f(e)</c>.</summary>
    /// <remarks>Barack &amp; Cutler's own truncation rule could not be retrieved; this power criterion (common practice)
    /// replaces it. The default ε = 1e-3 keeps 99.9 % of the power, e.g. 8 harmonics at e = 0.3, 11 at e = 0.4 and
    /// 15 at e = 0.5 (tests).</remarks>
    /// <exception cref="ArgumentOutOfRangeException">e lies outside [0, 0.95] or ε outside (0, 1).</exception>
    public static int HarmonicCount(double e, double lostPowerFraction = 1e-3)
    {
        if (!(e >= 0 && e <= 0.95))
            throw new ArgumentOutOfRangeException(nameof(e), e, "eccentricity must lie in [0, 0.95] for the harmonic count");
        if (!(lostPowerFraction > 0 && lostPowerFraction < 1))
            throw new ArgumentOutOfRangeException(nameof(lostPowerFraction), lostPowerFraction, "lost power fraction must lie in (0, 1)");
        double target = (1 - lostPowerFraction) * Enhancement(e);
        double sum = 0;
        for (int n = 1; n < 10_000; n++)
        {
            sum += Power(n, e);
            if (sum >= target) return n;
        }
        return 10_000;
    }

    private static void CheckEccentricity(double e)
    {
        if (!(e >= 0 && e < 1))
            throw new ArgumentOutOfRangeException(nameof(e), e, "eccentricity must lie in [0, 1)");
    }
}
