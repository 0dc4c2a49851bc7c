using GlobalFit.Physics.Numerics;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The orbit-averaged evolution equations of the analytic kludge: mean anomaly Φ, radial orbital frequency
/// ν, pericentre angle γ̃, eccentricity e and precession phase α of the orbital angular momentum about the spin.</summary>
/// <remarks>
/// <para>Barack &amp; Cutler 2004, Phys. Rev. D 69, 082005 (arXiv:gr-qc/0310125), Eqs. (27)–(31) (equation numbers
/// from memory, unverified), with <c>y = 2πMν</c>, χ the spin and λ the fixed angle between orbital angular
/// momentum and spin (G = c = 1, masses as times):</para>
/// <para><c>dΦ/dt = 2πν</c>;
/// <c>dν/dt = (96/10π)(μ/M³) y^{11/3} (1−e²)^{−9/2} {(1 + 73/24 e² + 37/96 e⁴)(1−e²)
/// + y^{2/3}(1273/336 − 2561/224 e² − 3885/128 e⁴ − 13147/5376 e⁶)
/// − y χ cos λ (1−e²)^{−1/2}(73/12 + 1211/24 e² + 3143/96 e⁴ + 65/64 e⁶)}</c>;
/// <c>dγ̃/dt = 6πν y^{2/3}(1−e²)^{−1}[1 + ¼ y^{2/3}(1−e²)^{−1}(26 − 15e²)] − 12πν χ cos λ y (1−e²)^{−3/2}</c>;
/// <c>de/dt = −(e/15)(μ/M²)(1−e²)^{−7/2} y^{8/3}[(304 + 121e²)(1−e²)(1 + 12y^{2/3}) − (1/56) y^{2/3}(8·16705 + 12·9082e² − 25211e⁴)]
/// + e (μ/M²) χ cos λ y^{11/3}(1−e²)^{−4}(1364/5 + 5032/15 e² + 263/10 e⁴)</c>;
/// <c>dα/dt = 4πν χ y (1−e²)^{−3/2}</c>.</para>
/// <para>The coefficients are recalled, not read from the paper (from memory, unverified). What is checked here by
/// limits (tests): the leading terms of dν/dt and de/dt are Peters 1964 (Phys. Rev. 136, B1224) orbit-averaged
/// radiation reaction; 1273/336 follows from the test-mass circular chirp at 1PN; dγ̃/dt at e = 0 is the
/// Schwarzschild periastron advance 3x + 19.5x² (x = y^{2/3}); the spin terms are the Lense–Thirring rates. The
/// eccentric 1PN coefficients (attributed to Junker &amp; Schäfer 1992) and the eccentric spin-orbit coefficients
/// (attributed to Ryan 1995/96) could not be checked.</para>
/// <para>State order: <c>[Φ, ν, γ̃, e, α]</c> (rad, Hz, rad, 1, rad), time in seconds. Immutable.</para>
/// </remarks>
public readonly struct KludgeOrbitEquations : IOdeSystem
{
    /// <summary>Index of the mean anomaly Φ in the state.</summary>
    public const int Phase = 0;

    /// <summary>Index of the radial orbital frequency ν in the state.</summary>
    public const int Frequency = 1;

    /// <summary>Index of the pericentre angle γ̃ in the state.</summary>
    public const int Pericentre = 2;

    /// <summary>Index of the eccentricity e in the state.</summary>
    public const int Eccentricity = 3;

    /// <summary>Index of the precession phase α in the state.</summary>
    public const int Precession = 4;

    /// <summary>Number of state components.</summary>
    public const int StateSize = 5;

    private readonly bool _corrections;

    /// <summary>Creates the equations for one source.</summary>
    /// <param name="centralMassSeconds">M, mass of the central black hole as a time (G M/c³).</param>
    /// <param name="compactMassSeconds">μ, mass of the compact object as a time.</param>
    /// <param name="spin">χ = S/M², in [0, 1).</param>
    /// <param name="cosInclination">cos λ, cosine of the angle between orbital angular momentum and spin.</param>
    /// <exception cref="ArgumentOutOfRangeException">A mass is not positive and finite, χ lies outside [0, 1), or
    /// cos λ outside [−1, 1].</exception>
    public KludgeOrbitEquations(double centralMassSeconds, double compactMassSeconds, double spin, double cosInclination)
        : this(centralMassSeconds, compactMassSeconds, spin, cosInclination, true)
    {
    }

    /// <summary>With <paramref name="corrections"/> false, only the leading (Peters 1964) radiation reaction and no
    /// precession: the Newtonian limit the tests compare with closed forms.</summary>
    internal KludgeOrbitEquations(double centralMassSeconds, double compactMassSeconds, double spin, double cosInclination, bool corrections)
    {
        if (!(centralMassSeconds > 0) || !double.IsFinite(centralMassSeconds))
            throw new ArgumentOutOfRangeException(nameof(centralMassSeconds), centralMassSeconds, "central mass must be positive and finite");
        if (!(compactMassSeconds > 0) || !double.IsFinite(compactMassSeconds))
            throw new ArgumentOutOfRangeException(nameof(compactMassSeconds), compactMassSeconds, "compact mass must be positive and finite");
        if (!(spin >= 0 && spin < 1))
            throw new ArgumentOutOfRangeException(nameof(spin), spin, "spin must lie in [0, 1)");
        if (!(Math.Abs(cosInclination) <= 1))
            throw new ArgumentOutOfRangeException(nameof(cosInclination), cosInclination, "cosine of the inclination must lie in [-1, 1]");
        CentralMassSeconds = centralMassSeconds;
        CompactMassSeconds = compactMassSeconds;
        Spin = spin;
        CosInclination = cosInclination;
        _corrections = corrections;
    }

    /// <summary>M as a time.</summary>
    /// <value>s.</value>
    public double CentralMassSeconds { get; }

    /// <summary>μ as a time.</summary>
    /// <value>s.</value>
    public double CompactMassSeconds { get; }

    /// <summary>χ.</summary>
    public double Spin { get; }

    /// <summary>cos λ.</summary>
    public double CosInclination { get; }

    /// <inheritdoc/>
    public int Dimension => StateSize;

    /// <inheritdoc/>
    public void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates)
    {
        double nu = state[Frequency];
        double e = state[Eccentricity];
        rates[Phase] = 2.0 * Math.PI * nu;
        rates[Frequency] = FrequencyRate(nu, e);
        rates[Pericentre] = PericentreRate(nu, e);
        rates[Eccentricity] = EccentricityRate(nu, e);
        rates[Precession] = PrecessionRate(nu, e);
    }

    /// <summary>dν/dt.</summary>
    /// <value>Hz/s.</value>
    public double FrequencyRate(double nu, double e)
    {
        double m = CentralMassSeconds, mu = CompactMassSeconds;
        double y = 2.0 * Math.PI * m * nu;
        double y23 = Math.Cbrt(y * y);
        double e2 = e * e, e4 = e2 * e2, e6 = e4 * e2;
        double oneMinus = 1.0 - e2;
        double brace = (1.0 + 73.0 / 24 * e2 + 37.0 / 96 * e4) * oneMinus;
        if (_corrections)
        {
            brace += y23 * (1273.0 / 336 - 2561.0 / 224 * e2 - 3885.0 / 128 * e4 - 13147.0 / 5376 * e6)
                   - y * Spin * CosInclination / Math.Sqrt(oneMinus) * (73.0 / 12 + 1211.0 / 24 * e2 + 3143.0 / 96 * e4 + 65.0 / 64 * e6);
        }
        return 96.0 / (10.0 * Math.PI) * (mu / (m * m * m)) * YPower(y, y23) * Math.Pow(oneMinus, -4.5) * brace;
    }

    /// <summary>dγ̃/dt.</summary>
    /// <value>rad/s.</value>
    public double PericentreRate(double nu, double e)
    {
        if (!_corrections) return 0.0;
        double y = 2.0 * Math.PI * CentralMassSeconds * nu;
        double y23 = Math.Cbrt(y * y);
        double oneMinus = 1.0 - e * e;
        return 6.0 * Math.PI * nu * y23 / oneMinus * (1.0 + 0.25 * y23 / oneMinus * (26.0 - 15.0 * e * e))
             - 12.0 * Math.PI * nu * Spin * CosInclination * y / (oneMinus * Math.Sqrt(oneMinus));
    }

    /// <summary>de/dt.</summary>
    /// <value>1/s.</value>
    public double EccentricityRate(double nu, double e)
    {
        double m = CentralMassSeconds, mu = CompactMassSeconds;
        double y = 2.0 * Math.PI * m * nu;
        double y23 = Math.Cbrt(y * y);
        double e2 = e * e, e4 = e2 * e2;
        double oneMinus = 1.0 - e2;
        double y83 = y * y * y23;
        double bracket = _corrections
            ? (304.0 + 121.0 * e2) * oneMinus * (1.0 + 12.0 * y23) - y23 / 56.0 * (8.0 * 16705 + 12.0 * 9082 * e2 - 25211.0 * e4)
            : (304.0 + 121.0 * e2) * oneMinus;
        double rate = -(e / 15.0) * (mu / (m * m)) * Math.Pow(oneMinus, -3.5) * y83 * bracket;
        if (_corrections)
        {
            double o2 = oneMinus * oneMinus;
            rate += e * (mu / (m * m)) * Spin * CosInclination * YPower(y, y23) / (o2 * o2)
                  * (1364.0 / 5 + 5032.0 / 15 * e2 + 263.0 / 10 * e4);
        }
        return rate;
    }

    /// <summary>dα/dt, the Lense–Thirring precession rate of the orbital angular momentum about the spin.</summary>
    /// <value>rad/s.</value>
    public double PrecessionRate(double nu, double e)
    {
        if (!_corrections) return 0.0;
        double y = 2.0 * Math.PI * CentralMassSeconds * nu;
        double oneMinus = 1.0 - e * e;
        return 4.0 * Math.PI * nu * Spin * y / (oneMinus * Math.Sqrt(oneMinus));
    }

    /// <summary>The radial orbital frequency at which the orbit reaches the Schwarzschild separatrix,
    /// <c>ν_p = (2πM)^{−1} [(1 − e²)/(6 + 2e)]^{3/2}</c> (semi-latus rectum p = 6 + 2e).</summary>
    /// <remarks>Barack &amp; Cutler 2004 (arXiv:gr-qc/0310125) end their inspirals here, ignoring the spin in the plunge
    /// condition (from memory, unverified); p = 6 + 2e is the separatrix of Schwarzschild geodesics (Cutler, Kennefick
    /// &amp; Poisson 1994, Phys. Rev. D 50, 3816; reference from memory).</remarks>
    /// <value>Hz.</value>
    public double PlungeFrequency(double e)
    {
        double ratio = (1.0 - e * e) / (6.0 + 2.0 * e);
        return ratio * Math.Sqrt(ratio) / (2.0 * Math.PI * CentralMassSeconds);
    }

    private static double YPower(double y, double y23) => y * y * y * y23; // y^{11/3} = y³ y^{2/3}
}
