using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class PlaneWaveLinksTests
{
    /// <summary>Spacecraft fixed in space: 1 on the x axis, 2 at the origin, 3 on the y axis.</summary>
    private sealed class StaticOrbits(double armLengthM) : IConstellationOrbits
    {
        public double ArmLengthM => armLengthM;

        public double PeriodSeconds => double.PositiveInfinity;

        public Vector3D Position(int spacecraft, double timeSeconds) => spacecraft switch
        {
            1 => new Vector3D(armLengthM, 0, 0),
            2 => new Vector3D(0, 0, 0),
            3 => new Vector3D(0, armLengthM, 0),
            _ => throw new ArgumentOutOfRangeException(nameof(spacecraft)),
        };

        public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds) =>
            LinkGeometry.ArmLengthM(this, receiver, sender, receptionTimeSeconds) / PhysicalConstants.SpeedOfLightMS;
    }

    private static readonly StaticOrbits Orbits = new(2.5e9);
    private static readonly FunctionStrain Wave = new(t => Math.Cos(2.0 * Math.PI * 1e-2 * t), t => 0.5 * Math.Sin(2.0 * Math.PI * 1e-2 * t));

    [Fact]
    public void A_wave_running_along_the_beam_produces_no_signal()
    {
        // Source: two-point formula of Estabrook & Wahlquist 1975 (GRG 6, 439): for k = n the pattern n.eps.n and the strain difference both vanish
        // (the photon surfs the wave), so the limit is 0; beta = 0, lambda = pi gives k = (1, ~1e-16, 0) = n_12 exactly
        // in floating point, which would otherwise give 0/0.
        var links = new PlaneWaveLinks(Wave, new PolarisationBasis(new SkyPosition(0.0, Math.PI), 0.3), Orbits);
        Assert.Equal(0.0, links.Measurement(1, 2, 123.0), 1e-30);
        Assert.True(double.IsFinite(links.Measurement(2, 1, 123.0)));
    }

    [Fact]
    public void Link_across_a_wave_front_measures_half_the_pattern_times_the_strain_change_over_the_light_time()
    {
        // Source: two-point formula of Estabrook & Wahlquist 1975 with k.n = 0 and both spacecraft on the same wave front (k.x = 0):
        // y_ij = (n.eps.n / 2)[h(t - L/c) - h(t)]. Wave along z (beta = -pi/2), arm along x, static spacecraft;
        // 1e-14 absolute on signals of order 1 (rounding).
        var basis = new PolarisationBasis(new SkyPosition(-0.5 * Math.PI, 0.2), 0.3);
        var links = new PlaneWaveLinks(Wave, basis, Orbits);
        double lightTime = 2.5e9 / PhysicalConstants.SpeedOfLightMS;
        var n = new Vector3D(1, 0, 0);
        var (plus, cross) = basis.LinkPattern(n);
        for (double t = 0; t < 200; t += 7.3)
        {
            var (hpEmit, hcEmit) = Wave.At(t - lightTime);
            var (hpNow, hcNow) = Wave.At(t);
            double expected = 0.5 * (plus * (hpEmit - hpNow) + cross * (hcEmit - hcNow));
            Assert.Equal(expected, links.Measurement(1, 2, t), 1e-14);
        }
    }
}
