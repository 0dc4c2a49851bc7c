using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class PhenomDWaveformTests
{
    [Fact]
    public void Face_on_plus_amplitude_at_low_frequency_is_the_newtonian_quadrupole_amplitude()
    {
        // Source: stationary-phase amplitude of the Newtonian quadrupole chirp, |h̃+| = √(5/24) π^{−2/3} 𝓜^{5/6} f^{−7/6} / D
        // for a face-on source (G = c = 1; e.g. Cutler & Flanagan 1994, PRD 49, 2658, Eq. 3.3 with the angular factors of a
        // face-on binary). At M f = 1e-6 the 1PN correction is 3e-4, so 1e-3 relative.
        const double chirpMass = 4e5, q = 2.5, distance = 1e4;
        double total = BinaryMasses.TotalMass(chirpMass, q);
        var waveform = new PhenomDWaveform(total, q, 0.2, 0.1, distance, 0.0);
        double f = 1e-6 / waveform.TotalMassSeconds;
        Span<double> amplitude = stackalloc double[1], phase = stackalloc double[1], time = stackalloc double[1];
        waveform.Evaluate([f], amplitude, phase, time);
        var (kPlus, _) = MassiveBlackHoleBinaryResponse.PolarisationFactors(0.0, 0.3);
        double chirpSeconds = chirpMass * PhysicalConstants.SolarMassSeconds;
        double distanceSeconds = distance * PhysicalConstants.MegaparsecM / PhysicalConstants.SpeedOfLightMS;
        double newtonian = Math.Sqrt(5.0 / 24.0) * Math.Pow(Math.PI, -2.0 / 3.0) * Math.Pow(chirpSeconds, 5.0 / 6.0) * Math.Pow(f, -7.0 / 6.0) / distanceSeconds;
        Assert.Equal(1.0, Complex.Abs(kPlus) * amplitude[0] / newtonian, 1e-3);
    }

    [Fact]
    public void Time_to_coalescence_at_low_frequency_is_the_newtonian_chirp_time()
    {
        // Source: quadrupole chirp, t_c − t(f) = (5/256) 𝓜 (π𝓜 f)^{−8/3} (e.g. Cutler & Flanagan 1994, Eq. 3.4 at leading order).
        // At M f = 5e-6 the 1PN correction (4/3)(743/336 + 11η/4)(πMf)^{2/3} is 0.3 %, so 0.6 % relative.
        const double chirpMass = 4e5, q = 1.0;
        double total = BinaryMasses.TotalMass(chirpMass, q);
        var waveform = new PhenomDWaveform(total, q, 0, 0, 1e4, 1e7);
        double f = 5e-6 / waveform.TotalMassSeconds;
        Span<double> amplitude = stackalloc double[1], phase = stackalloc double[1], time = stackalloc double[1];
        waveform.Evaluate([f], amplitude, phase, time);
        double chirpSeconds = chirpMass * PhysicalConstants.SolarMassSeconds;
        double newtonian = 5.0 / 256.0 * chirpSeconds * Math.Pow(Math.PI * chirpSeconds * f, -8.0 / 3.0);
        Assert.Equal(1.0, (1e7 - time[0]) / newtonian, 6e-3);
    }

    [Fact]
    public void Amplitude_peak_arrives_at_the_coalescence_time()
    {
        var waveform = new PhenomDWaveform(1e6, 3, 0.5, 0.5, 1e4, 12345.0);
        Span<double> amplitude = stackalloc double[1], phase = stackalloc double[1], time = stackalloc double[1];
        waveform.Evaluate([waveform.PeakFrequencyHz], amplitude, phase, time);
        Assert.Equal(12345.0, time[0], 1e-6);
    }

    [Theory]
    [InlineData(0.0, 1.0, 0.0)]
    [InlineData(1e6, -1.0, 0.0)]
    [InlineData(1e6, 1.0, double.NaN)]
    public void Out_of_range_arguments_are_refused(double totalMass, double distance, double tc) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new PhenomDWaveform(totalMass, 2, 0, 0, distance, tc));
}
