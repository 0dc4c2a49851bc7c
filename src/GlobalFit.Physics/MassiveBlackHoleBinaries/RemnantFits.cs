namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>Mass and spin of the black hole left by the merger of two black holes with aligned spins.</summary>
/// <remarks>
/// <para>The fits used by IMRPhenomD: Husa et al. 2016, PRD 93, 044006 (arXiv:1508.07250), Sec. VII (final spin and
/// radiated energy), as used by Khan et al. 2016 (arXiv:1508.07253). In units of the initial total mass M = m1 + m2 = 1,
/// with <c>S = m1² χ1 + m2² χ2</c> and <c>Ŝ = S/(m1² + m2²)</c>:
/// <c>a_f = S + 2√3 η − 4.39925 η² + 9.39729 η³ − 13.1809 η⁴ + (−0.0850918 η − 5.83703 η²) S
/// + (0.101467 η − 2.09677 η²) S² + (−1.35468 η + 4.10896 η²) S³ + (−0.867697 η + 2.06405 η²) S⁴</c> and
/// <c>E_rad = η (0.0559745 + 0.580951 η − 0.960673 η² + 3.35241 η³) (1 + (−0.00303023 − 2.00661 η + 7.70506 η²) Ŝ)
/// / (1 + (−0.67144 − 1.47569 η + 7.30468 η²) Ŝ)</c>.</para>
/// <para>Coefficients from memory (six significant figures), checked in the tests against numerical relativity
/// (Scheel et al. 2009, arXiv:0810.1767; Lovelace et al. 2012, arXiv:1110.2229) and the test-particle limit.</para>
/// </remarks>
public static class RemnantFits
{
    /// <summary>Dimensionless spin a_f of the remnant.</summary>
    /// <param name="eta">Symmetric mass ratio η = m1 m2 / M², in (0, 1/4].</param>
    /// <param name="spin1">χ1 of the heavier body, in [−1, 1].</param>
    /// <param name="spin2">χ2 of the lighter body, in [−1, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">η or a spin is outside its range.</exception>
    public static double FinalSpin(double eta, double spin1, double spin2)
    {
        Check(eta, spin1, spin2);
        double s = TotalSpin(eta, spin1, spin2);
        double eta2 = eta * eta, eta3 = eta2 * eta, eta4 = eta3 * eta;
        return s + 2.0 * Math.Sqrt(3.0) * eta - 4.39925 * eta2 + 9.39729 * eta3 - 13.1809 * eta4
            + (-0.0850918 * eta - 5.83703 * eta2) * s
            + (0.101467 * eta - 2.09677 * eta2) * s * s
            + (-1.35468 * eta + 4.10896 * eta2) * s * s * s
            + (-0.867697 * eta + 2.06405 * eta2) * s * s * s * s;
    }

    /// <summary>Energy radiated by the whole coalescence, as a fraction of the initial total mass.</summary>
    /// <param name="eta">Symmetric mass ratio η, in (0, 1/4].</param>
    /// <param name="spin1">χ1 of the heavier body, in [−1, 1].</param>
    /// <param name="spin2">χ2 of the lighter body, in [−1, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">η or a spin is outside its range.</exception>
    public static double RadiatedEnergy(double eta, double spin1, double spin2)
    {
        Check(eta, spin1, spin2);
        double eta2 = eta * eta, eta3 = eta2 * eta;
        double sHat = TotalSpin(eta, spin1, spin2) / (1.0 - 2.0 * eta);
        return eta * (0.0559745 + 0.580951 * eta - 0.960673 * eta2 + 3.35241 * eta3)
            * (1.0 + (-0.00303023 - 2.00661 * eta + 7.70506 * eta2) * sHat)
            / (1.0 + (-0.67144 - 1.47569 * eta + 7.30468 * eta2) * sHat);
    }

    /// <summary>Remnant mass in units of the initial total mass, <c>1 − E_rad</c>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">η or a spin is outside its range.</exception>
    public static double FinalMass(double eta, double spin1, double spin2) => 1.0 - RadiatedEnergy(eta, spin1, spin2);

    /// <summary><c>S = m1² χ1 + m2² χ2</c> in units M = 1, with m1 ≥ m2.</summary>
    private static double TotalSpin(double eta, double spin1, double spin2)
    {
        double delta = Math.Sqrt(Math.Max(0.0, 1.0 - 4.0 * eta));
        double m1 = 0.5 * (1.0 + delta), m2 = 0.5 * (1.0 - delta);
        return m1 * m1 * spin1 + m2 * m2 * spin2;
    }

    private static void Check(double eta, double spin1, double spin2)
    {
        if (!(eta > 0 && eta <= 0.25))
            throw new ArgumentOutOfRangeException(nameof(eta), eta, "symmetric mass ratio must lie in (0, 1/4]");
        if (!(Math.Abs(spin1) <= 1.0))
            throw new ArgumentOutOfRangeException(nameof(spin1), spin1, "spin must lie in [-1, 1]");
        if (!(Math.Abs(spin2) <= 1.0))
            throw new ArgumentOutOfRangeException(nameof(spin2), spin2, "spin must lie in [-1, 1]");
    }
}
