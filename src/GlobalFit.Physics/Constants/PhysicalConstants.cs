namespace GlobalFit.Physics.Constants;

/// <summary>Physical and astronomical constants in SI units, each with its defining source.</summary>
/// <remarks>
/// Masses are carried as times or lengths (<see cref="SolarMassSeconds"/>, <see cref="SolarMassMetres"/>)
/// because the solar mass parameter GM is known to ten digits while G, and so the solar mass in kg,
/// is known to five.
/// </remarks>
public static class PhysicalConstants
{
    /// <summary>Speed of light in vacuum.</summary>
    /// <value>m/s, exact (SI definition).</value>
    public const double SpeedOfLightMS = 299_792_458.0;

    /// <summary>Newtonian constant of gravitation.</summary>
    /// <value>m^3 kg^-1 s^-2; CODATA 2018 recommended value (relative uncertainty 2.2e-5).</value>
    public const double GravitationalConstant = 6.67430e-11;

    /// <summary>Nominal solar mass parameter GM_sun.</summary>
    /// <value>m^3/s^2, exact by IAU 2015 Resolution B3 (Prsa et al. 2016, AJ 152, 41).</value>
    public const double SolarMassParameterM3S2 = 1.3271244e20;

    /// <summary>Solar mass expressed as a time, GM_sun/c^3.</summary>
    /// <value>s (4.925490947641e-6).</value>
    public const double SolarMassSeconds = SolarMassParameterM3S2 / (SpeedOfLightMS * SpeedOfLightMS * SpeedOfLightMS);

    /// <summary>Solar mass expressed as a length, GM_sun/c^2.</summary>
    /// <value>m (1476.625038).</value>
    public const double SolarMassMetres = SolarMassParameterM3S2 / (SpeedOfLightMS * SpeedOfLightMS);

    /// <summary>Solar mass in kilograms, GM_sun/G; limited by the uncertainty of G.</summary>
    /// <value>kg.</value>
    public const double SolarMassKg = SolarMassParameterM3S2 / GravitationalConstant;

    /// <summary>Astronomical unit.</summary>
    /// <value>m, exact by IAU 2012 Resolution B2.</value>
    public const double AstronomicalUnitM = 149_597_870_700.0;

    /// <summary>Parsec, (648000/π) au.</summary>
    /// <value>m, exact by IAU 2015 Resolution B2.</value>
    public const double ParsecM = 648_000.0 / Math.PI * AstronomicalUnitM;

    /// <summary>Kiloparsec.</summary>
    /// <value>m.</value>
    public const double KiloparsecM = 1e3 * ParsecM;

    /// <summary>Megaparsec.</summary>
    /// <value>m.</value>
    public const double MegaparsecM = 1e6 * ParsecM;

    /// <summary>Julian year, 365.25 days of 86400 s. Observation times are counted in Julian years.</summary>
    /// <value>s, exact by IAU usage.</value>
    public const double JulianYearS = 365.25 * 86_400.0;

    /// <summary>Sidereal year at J2000, 365.256363004 days; the period of the analytic orbits.</summary>
    /// <value>s.</value>
    public const double SiderealYearS = 365.256363004 * 86_400.0;
}
