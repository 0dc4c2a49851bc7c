using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>Leading-order (quadrupole, circular orbit) relations between a binary's masses, distance, frequency,
/// frequency drift and amplitude.</summary>
/// <remarks>
/// Chirp mass <c>Mc = (m1 m2)^(3/5)/(m1 + m2)^(1/5)</c> and amplitude <c>A = 2 (G Mc)^(5/3) (π f)^(2/3)/(c⁴ D)</c>
/// (standard quadrupole results; equation numbers not given, from memory); Peters 1964 (Phys. Rev. 136, B1224) drift
/// <c>ḟ = (96/5) π^(8/3) (G Mc/c³)^(5/3) f^(11/3)</c> (as in Cutler &amp; Flanagan 1994, arXiv:gr-qc/9402014); its
/// derivative <c>f̈ = (11/3) ḟ²/f</c> and time to coalescence <c>τ = (3/8) f/ḟ</c> (derived: differentiate and
/// integrate the drift). Masses enter as <c>G M/c³ = T_sun (M/M_sun)</c> (IAU nominal GM_sun), which carries ten
/// digits where the mass in kg carries five. Mass-transferring binaries can have ḟ &lt; 0; these relations do not
/// describe them. All members are pure.
/// </remarks>
public static class QuadrupoleBinary
{
    /// <summary>Chirp mass of components <paramref name="mass1Msun"/> and <paramref name="mass2Msun"/>.</summary>
    /// <value>Solar masses.</value>
    /// <exception cref="ArgumentOutOfRangeException">A mass is not positive and finite.</exception>
    public static double ChirpMassMsun(double mass1Msun, double mass2Msun)
    {
        RequirePositive(mass1Msun, nameof(mass1Msun));
        RequirePositive(mass2Msun, nameof(mass2Msun));
        return Math.Pow(mass1Msun * mass2Msun, 0.6) / Math.Pow(mass1Msun + mass2Msun, 0.2);
    }

    /// <summary>Strain amplitude A of a binary of chirp mass <paramref name="chirpMassMsun"/> at gravitational-wave
    /// frequency <paramref name="frequencyHz"/> and distance <paramref name="distanceM"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not positive and finite.</exception>
    public static double Amplitude(double chirpMassMsun, double frequencyHz, double distanceM)
    {
        RequirePositive(chirpMassMsun, nameof(chirpMassMsun));
        RequirePositive(frequencyHz, nameof(frequencyHz));
        RequirePositive(distanceM, nameof(distanceM));
        double massSeconds = PhysicalConstants.SolarMassSeconds * chirpMassMsun;
        return 2.0 * Math.Pow(massSeconds, 5.0 / 3.0) * Math.Pow(Math.PI * frequencyHz, 2.0 / 3.0)
            * PhysicalConstants.SpeedOfLightMS / distanceM;
    }

    /// <summary>Quadrupole frequency drift ḟ.</summary>
    /// <value>Hz/s.</value>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not positive and finite.</exception>
    public static double FrequencyDerivativeHzS(double chirpMassMsun, double frequencyHz)
    {
        RequirePositive(chirpMassMsun, nameof(chirpMassMsun));
        RequirePositive(frequencyHz, nameof(frequencyHz));
        double massSeconds = PhysicalConstants.SolarMassSeconds * chirpMassMsun;
        return 96.0 / 5.0 * Math.Pow(Math.PI, 8.0 / 3.0) * Math.Pow(massSeconds, 5.0 / 3.0) * Math.Pow(frequencyHz, 11.0 / 3.0);
    }

    /// <summary>Second derivative <c>f̈ = (11/3) ḟ²/f</c> implied by the quadrupole law.</summary>
    /// <value>Hz/s².</value>
    /// <exception cref="ArgumentOutOfRangeException">f is not positive and finite, or ḟ is not finite.</exception>
    public static double SecondFrequencyDerivativeHzS2(double frequencyHz, double frequencyDerivativeHzS)
    {
        RequirePositive(frequencyHz, nameof(frequencyHz));
        if (!double.IsFinite(frequencyDerivativeHzS))
            throw new ArgumentOutOfRangeException(nameof(frequencyDerivativeHzS), frequencyDerivativeHzS, "frequency derivative must be finite");
        return 11.0 / 3.0 * frequencyDerivativeHzS * frequencyDerivativeHzS / frequencyHz;
    }

    /// <summary>Time to coalescence <c>τ = (3/8) f/ḟ</c> of a quadrupole-driven inspiral.</summary>
    /// <value>s.</value>
    /// <exception cref="ArgumentOutOfRangeException">f or ḟ is not positive and finite.</exception>
    public static double TimeToCoalescenceSeconds(double frequencyHz, double frequencyDerivativeHzS)
    {
        RequirePositive(frequencyHz, nameof(frequencyHz));
        RequirePositive(frequencyDerivativeHzS, nameof(frequencyDerivativeHzS));
        return 3.0 / 8.0 * frequencyHz / frequencyDerivativeHzS;
    }

    private static void RequirePositive(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentOutOfRangeException(name, value, "value must be positive and finite");
    }
}
