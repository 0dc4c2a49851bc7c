using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class OptimalSnrTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(3e-3)]
    [InlineData(1.2e-2)]
    public void Snr_averaged_over_orientations_matches_the_sky_averaged_formula(double frequencyHz)
    {
        // Source: derived (SensitivityCurve.AveragedSnr): rho_bar^2 = (16/5) A^2 T / S_n(f0) averaged over sky,
        // inclination, polarisation (and phase), with S_n the exact two-channel sky-averaged sensitivity
        // (SensitivityCurve.ExactStrainPsd, in the convention of Robson, Cornish & Liu 2019), so
        // A and E only. Monte Carlo over 2000 seeded isotropic orientations, one month of data (the sky average does not
        // depend on the orbital phase). The per-source rho^2 spreads by ~100 % (antenna patterns
        // and inclination), so the mean of 2000 carries a standard error of ~2.2 %; we assert within 4 standard errors
        // computed from the sample (false-failure rate ~6e-5 per row). Measured ratio 1.004 (3 mHz) and 1.005 (12 mHz).
        const int draws = 2000;
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 15.0);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var curve = new SensitivityCurve(InstrumentNoiseSettings.Default);
        var random = new Random(404);
        double sum = 0, sumSquares = 0, amplitude = 1e-22;
        for (int i = 0; i < draws; i++)
        {
            var source = new GalacticBinaryParameters(frequencyHz, 0.0, amplitude, Math.Asin(2 * random.NextDouble() - 1),
                2 * Math.PI * random.NextDouble(), Math.Acos(2 * random.NextDouble() - 1), Math.PI * random.NextDouble(), 2 * Math.PI * random.NextDouble());
            double rho = GalacticBinarySnr.Optimal(generator, source, noise, includeT: false);
            sum += rho * rho;
            sumSquares += rho * rho * rho * rho;
        }
        double mean = sum / draws;
        double standardError = Math.Sqrt((sumSquares / draws - mean * mean) / draws);
        double expected = 16.0 / 5.0 * amplitude * amplitude * generator.DurationSeconds / curve.ExactStrainPsd(frequencyHz);
        output.WriteLine($"f0 = {frequencyHz}: <rho^2>/rho_bar^2 = {mean / expected:F4} +- {standardError / expected:F4}");
        Assert.True(Math.Abs(mean - expected) <= 4.0 * standardError, $"ratio {mean / expected:F4}, standard error {standardError / expected:F4}");
    }

    [Fact]
    public void Snr_scales_with_amplitude_and_T_adds_little_at_low_frequency()
    {
        // rho is linear in A (exact up to rounding: 1e-12). Derived low-frequency limits (InstrumentNoiseModel): T is suppressed by x^2 relative to A/E
        // at low f, so at 1 mHz (x = 0.05) including T changes rho by < 1e-3.
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 15.0);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var source = new GalacticBinaryParameters(1e-3, 0.0, 1e-22, 0.3, 1.0, 0.5, 0.2, 0.1);
        double rho = GalacticBinarySnr.Optimal(generator, source, noise, includeT: false);
        Assert.Equal(3.0 * rho, GalacticBinarySnr.Optimal(generator, source with { Amplitude = 3e-22 }, noise, includeT: false), 1e-12 * rho);
        double withT = GalacticBinarySnr.Optimal(generator, source, noise);
        Assert.InRange(withT / rho - 1.0, 0.0, 1e-3);
    }
}
