using GlobalFit.Physics.Constants;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class QuadrupoleBinaryTests
{
    // Source: derived: the quadrupole formulas (Peters 1964; Cutler & Flanagan 1994, arXiv:gr-qc/9402014, for the
    // chirp-mass form of the drift) evaluated independently with T_sun from the IAU 2015 nominal GM_sun, printed to 7
    // significant figures, so 1e-6 relative covers the rounding (≤ 5e-7).
    private const double SevenFigures = 1e-6;

    [Fact]
    public void Chirp_mass_of_two_equal_white_dwarfs_matches_the_reference()
    {
        // Derived: Mc = (m1 m2)^(3/5)/(m1 + m2)^(1/5) = 0.522330338 for m1 = m2 = 0.6 Msun (9 figures, so 1e-8 relative).
        Assert.Equal(0.522330338, QuadrupoleBinary.ChirpMassMsun(0.6, 0.6), 1e-8 * 0.522330338);
    }

    [Theory]
    // Derived: fdot = (96/5) pi^(8/3) (G Mc/c^3)^(5/3) f^(11/3), fddot = (11/3) fdot^2/f, tau = 3f/(8 fdot) in Julian years.
    [InlineData(0.5, 0.003, 1.025285e-16, 1.284812e-29, 3.476993e+05)]
    [InlineData(1.0, 0.001, 5.795845e-18, 1.231700e-31, 2.050268e+06)]
    [InlineData(0.3, 0.01, 3.616753e-15, 4.796331e-27, 3.285553e+04)]
    public void Frequency_evolution_matches_the_reference_rows(double chirpMassMsun, double frequencyHz, double fdot, double fddot, double coalescenceJulianYears)
    {
        double actualFdot = QuadrupoleBinary.FrequencyDerivativeHzS(chirpMassMsun, frequencyHz);
        Assert.Equal(fdot, actualFdot, SevenFigures * fdot);
        Assert.Equal(fddot, QuadrupoleBinary.SecondFrequencyDerivativeHzS2(frequencyHz, actualFdot), SevenFigures * fddot);
        double years = QuadrupoleBinary.TimeToCoalescenceSeconds(frequencyHz, actualFdot) / PhysicalConstants.JulianYearS;
        Assert.Equal(coalescenceJulianYears, years, SevenFigures * coalescenceJulianYears);
    }

    [Theory]
    // Derived: A = 2 (G Mc)^(5/3) (pi f)^(2/3)/(c^4 D), D in kpc (IAU 2015 parsec).
    [InlineData(0.5, 0.003, 1.0, 3.893858e-22)]
    [InlineData(1.0, 0.001, 10.0, 5.943140e-23)]
    public void Amplitude_matches_the_reference_rows(double chirpMassMsun, double frequencyHz, double distanceKpc, double expected)
    {
        Assert.Equal(expected, QuadrupoleBinary.Amplitude(chirpMassMsun, frequencyHz, distanceKpc * PhysicalConstants.KiloparsecM), SevenFigures * expected);
    }

    [Fact]
    public void Time_to_coalescence_agrees_with_the_closed_form_in_chirp_mass()
    {
        // Derived (integrate the Peters 1964 drift): tau = (3/8) f/fdot = (5/256)(pi f)^(-8/3)(G Mc/c^3)^(-5/3); an identity, so 1e-12.
        double mc = 0.7, f = 4e-3;
        double closedForm = 5.0 / 256.0 * Math.Pow(Math.PI * f, -8.0 / 3.0) * Math.Pow(PhysicalConstants.SolarMassSeconds * mc, -5.0 / 3.0);
        double tau = QuadrupoleBinary.TimeToCoalescenceSeconds(f, QuadrupoleBinary.FrequencyDerivativeHzS(mc, f));
        Assert.Equal(closedForm, tau, 1e-12 * closedForm);
    }

    [Fact]
    public void Non_physical_inputs_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadrupoleBinary.ChirpMassMsun(0.0, 1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadrupoleBinary.Amplitude(1.0, 1e-3, double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadrupoleBinary.FrequencyDerivativeHzS(-1.0, 1e-3));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadrupoleBinary.TimeToCoalescenceSeconds(1e-3, -1e-17));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadrupoleBinary.SecondFrequencyDerivativeHzS2(1e-3, double.PositiveInfinity));
    }

    [Fact]
    public void Parameter_columns_use_the_project_names_and_validation_names_the_column()
    {
        // Source: the project's parameter names (DEVELOPERS.md, "Conventions that everything relies on").
        Assert.Equal(new[] { "f0_hz", "fdot_hz_s", "amplitude", "beta_rad", "lambda_rad", "iota_rad", "psi_rad", "phi0_rad" },
            GalacticBinaryParameters.ColumnNames.ToArray());
        var bad = new GalacticBinaryParameters(1e-3, 0, 1e-22, 2.0, 0, 0, 0, 0);
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => bad.Validate());
        Assert.Equal("beta_rad", error.ParamName);
        new GalacticBinaryParameters(1e-3, 0, 1e-22, 0.3, 0, 0, 0, 0).Validate();
    }
}
