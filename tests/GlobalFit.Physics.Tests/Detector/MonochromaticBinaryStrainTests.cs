using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class MonochromaticBinaryStrainTests
{
    private static MonochromaticBinaryStrain Source(double iota = 0.8, double phi0 = 0.25, double fdot = 0.0) =>
        new(frequencyHz: 2e-3, frequencyDerivativeHzS: fdot, amplitude: 1e-22, inclinationRad: iota, polarisationRad: 0.6,
            initialPhaseRad: phi0, sky: new SkyPosition(0.4, 1.9));

    [Fact]
    public void Polarisation_amplitudes_follow_the_inclination()
    {
        // Source: leading quadrupole order (Peters 1964) in our sign convention (MonochromaticBinaryStrain remarks):
        // h+ = A(1 + cos^2 i) cos Phi, hx = 2 A cos i sin Phi; face-on strain per polarisation 2A.
        // Phi(0) = 0 gives h+ = A+ and Phi(1/(4 f0)) = pi/2 gives hx = Ax. Rounding-level tolerance.
        var faceOn = Source(iota: 0.0, phi0: 0.0);
        Assert.Equal(2e-22, faceOn.At(0.0).Plus, 1e-36);
        Assert.Equal(2e-22, faceOn.At(125.0).Cross, 1e-36);
        var inclined = Source(iota: 0.8, phi0: 0.0);
        Assert.Equal(1e-22 * (1 + Math.Cos(0.8) * Math.Cos(0.8)), inclined.At(0.0).Plus, 1e-36);
        Assert.Equal(2e-22 * Math.Cos(0.8), inclined.At(125.0).Cross, 1e-36);
        var edgeOn = Source(iota: 0.5 * Math.PI, phi0: 0.0);
        Assert.Equal(0.0, edgeOn.At(125.0).Cross, 1e-36);
    }

    [Fact]
    public void Phase_grows_at_the_instantaneous_frequency()
    {
        // Source: definition of the phase, Phi = phi0 + 2 pi f0 t + pi fdot t^2, so dPhi/dt = 2 pi (f0 + fdot t); a central
        // difference over 1 s is exact for a quadratic up to rounding of Phi ~ 1e5 rad (1e-11 relative).
        var source = Source(fdot: 1e-13);
        double t = 1.0e7;
        double rate = (source.PhaseRad(t + 0.5) - source.PhaseRad(t - 0.5)) / (2.0 * Math.PI);
        Assert.Equal(2e-3 + 1e-13 * t, rate, 1e-11 * 2e-3 * 1e3);
        Assert.Equal(0.25, source.PhaseRad(0.0), 1e-15);
    }

    [Fact]
    public void Bad_parameters_are_rejected()
    {
        var sky = new SkyPosition(0, 0);
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(0.0, 0, 1e-22, 0, 0, 0, sky));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(1e-3, double.NaN, 1e-22, 0, 0, 0, sky));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(1e-3, 0, -1e-22, 0, 0, 0, sky));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(1e-3, 0, 1e-22, double.NaN, 0, 0, sky));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(1e-3, 0, 1e-22, 0, double.PositiveInfinity, 0, sky));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MonochromaticBinaryStrain(1e-3, 0, 1e-22, 0, 0, double.NaN, sky));
    }
}
