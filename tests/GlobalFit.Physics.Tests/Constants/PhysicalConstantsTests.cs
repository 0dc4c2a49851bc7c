using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Tests.Constants;

public class PhysicalConstantsTests
{
    // Source: derived: GM_sun/c^3 and GM_sun/c^2 from the IAU 2015 Resolution B3 nominal GM_sun (Prsa et al. 2016)
    // and the exact SI c, printed to 15 significant figures, so 1e-13 relative.
    [Fact]
    public void Solar_mass_in_seconds_matches_the_value_derived_from_the_nominal_solar_mass_parameter()
    {
        Assert.Equal(4.92549094764127e-6, PhysicalConstants.SolarMassSeconds, 4.92549094764127e-6 * 1e-13);
        Assert.Equal(1476.62503805012, PhysicalConstants.SolarMassMetres, 1476.62503805012 * 1e-13);
    }

    // Source: IAU 2015 Resolution B2 (parsec = 648000/π au exactly) and IAU 2012 Resolution B2 (au); derived: 17 digits.
    [Fact]
    public void Parsec_follows_its_exact_definition_in_astronomical_units()
    {
        Assert.Equal(30856775814913673.0, PhysicalConstants.ParsecM, 30856775814913673.0 * 1e-15);
    }

    // Source: CODATA 2018 G and IAU 2015 GM_sun; derived: M_sun = GM_sun/G to 7 digits (limited by G).
    [Fact]
    public void Solar_mass_in_kilograms_is_the_solar_mass_parameter_over_G()
    {
        Assert.Equal(1.988410e30, PhysicalConstants.SolarMassKg, 1.988410e30 * 1e-6);
    }

    // Source: IAU Julian year (365.25 d exactly) and the J2000 sidereal year of 365.256363004 d (standard
    // reference tables; not checked against the IERS conventions themselves).
    [Fact]
    public void Year_lengths_match_their_definitions()
    {
        Assert.Equal(31557600.0, PhysicalConstants.JulianYearS);
        Assert.Equal(31558149.7635, PhysicalConstants.SiderealYearS, 1e-4);
    }
}
