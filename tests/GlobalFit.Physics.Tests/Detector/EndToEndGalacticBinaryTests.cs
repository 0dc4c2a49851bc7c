using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.Series;
using Xunit;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class EndToEndGalacticBinaryTests(ITestOutputHelper output)
{
    [Fact]
    [Trait("Category", "Long")]
    public void One_year_brute_force_spectrum_of_a_galactic_binary_matches_the_reference_band_power_and_peak()
    {
        // Source: derived: an independent brute-force computation at full cadence, sharing no code with globalfit
        // (two-point link formula of Estabrook & Wahlquist 1975, rigid orbits of Cornish & Rubbo 2003, emitter at
        // emission time, delays L/c, FFT of the whole year), gave sum of |X~_k|^2 over bins q-32..q+31 = 3.126994e11 s^2
        // and peak |X~_k| (at bin q+2) = 2.233624e5 s, for the parameters below. The orbital period is
        // the Julian year there. X~ uses the continuous convention of
        // FourierTransform (dt x DFT), as that computation does. Tolerance 1e-6 relative: 7 figures printed (rounding
        // <= 1.6e-7) and both computations follow the same model; measured 1.1e-7 (band power) and 7e-9 (peak).
        // About 30 s at full cadence, hence Long.
        const double year = PhysicalConstants.JulianYearS, dt = 15.0;
        const int q = 63115;
        var orbits = new RigidOrbits(2.5e9, PhysicalConstants.AstronomicalUnitM, year, initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);
        var source = new MonochromaticBinaryStrain(q / year, 0.0, 1.0, inclinationRad: 0.8, polarisationRad: 0.6,
            initialPhaseRad: 0.25, sky: new SkyPosition(0.4, 1.9));
        int count = checked((int)(year / dt));
        var response = SlowReferenceResponse.Compute(source, orbits, 0.0, dt, count);
        var spectrum = FourierTransform.Forward(response.X);
        double bandPower = 0, peak = 0;
        int peakBin = -1;
        for (int k = q - 32; k < q + 32; k++)
        {
            double power = spectrum.Values[k].Magnitude * spectrum.Values[k].Magnitude;
            bandPower += power;
            if (spectrum.Values[k].Magnitude > peak)
                (peak, peakBin) = (spectrum.Values[k].Magnitude, k);
        }
        output.WriteLine($"band power {bandPower:E7} s^2 (rel. diff {bandPower / 3.126994e11 - 1:E2}); peak {peak:E7} s at q{peakBin - q:+0;-0} (rel. diff {peak / 2.233624e5 - 1:E2})");
        Assert.Equal(q + 2, peakBin);
        Assert.Equal(3.126994e11, bandPower, 1e-6 * 3.126994e11);
        Assert.Equal(2.233624e5, peak, 1e-6 * 2.233624e5);
    }
}
