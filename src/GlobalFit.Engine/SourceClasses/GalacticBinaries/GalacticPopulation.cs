using GlobalFit.Engine.Simulation;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Astrometry;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>One binary drawn from a <see cref="GalacticPopulationSettings"/>: its intrinsic properties, distance,
/// ecliptic sky position and orientation.</summary>
/// <param name="FrequencyHz">Gravitational-wave frequency at the start of the observation.</param>
/// <param name="ChirpMassMsun">Chirp mass in solar masses.</param>
/// <param name="DistanceM">Distance from the Sun in metres.</param>
/// <param name="BetaRad">Ecliptic latitude.</param>
/// <param name="LambdaRad">Ecliptic longitude in [0, 2π).</param>
/// <param name="InclinationRad">Inclination, with cos ι uniform on [−1, 1].</param>
/// <param name="PolarisationRad">Polarisation angle, uniform on [0, π).</param>
/// <param name="InitialPhaseRad">Initial phase, uniform on [0, 2π).</param>
public readonly record struct DrawnBinary(
    double FrequencyHz, double ChirpMassMsun, double DistanceM, double BetaRad, double LambdaRad,
    double InclinationRad, double PolarisationRad, double InitialPhaseRad);

/// <summary>Draws binaries from an invented Galactic population: a power-law frequency distribution, a truncated
/// normal chirp mass and an exponential disc seen from the Sun, converted to ecliptic coordinates.</summary>
/// <remarks>The disc: surface density ∝ e^{−R/R_d} (so R follows a Gamma(2, R_d) law), vertical density ∝ e^{−|z|/h},
/// uniform azimuth; a common simple model of the thin disc (e.g. Binney &amp; Tremaine 2008, Galactic Dynamics, §2.7;
/// the scale values are this scenario's own choices). Isotropic orientations. Deterministic for a given stream.</remarks>
public static class GalacticPopulation
{
    /// <summary>Nearest allowed distance; closer draws are redrawn (a binary at the Sun's position would have infinite amplitude).</summary>
    public const double MinimumDistanceKpc = 0.01;

    /// <summary>Draws <see cref="GalacticPopulationSettings.Count"/> binaries from <paramref name="random"/>.</summary>
    public static DrawnBinary[] Draw(GalacticPopulationSettings settings, ref RandomStream random)
    {
        var result = new DrawnBinary[settings.Count];
        for (int i = 0; i < result.Length; i++) result[i] = DrawOne(settings, ref random);
        return result;
    }

    private static DrawnBinary DrawOne(GalacticPopulationSettings s, ref RandomStream random)
    {
        double f = PowerLaw(s.MinFrequencyHz, s.MaxFrequencyHz, s.FrequencyPower, random.NextDouble());
        double mc;
        do mc = s.ChirpMassMeanMsun + s.ChirpMassSdMsun * random.NextGaussian();
        while (mc < s.ChirpMassMinMsun || mc > s.ChirpMassMaxMsun);

        Vector3D heliocentric;
        do
        {
            double radius = -s.DiscScaleLengthKpc * Math.Log(random.NextDoubleNonZero() * random.NextDoubleNonZero());
            double azimuth = random.NextUniform(0, 2 * Math.PI);
            double height = s.DiscScaleHeightKpc * Math.Log(random.NextDoubleNonZero()) * (random.NextDouble() < 0.5 ? -1 : 1);
            // Galactocentric frame with the Sun at (−R0, 0, 0): the heliocentric vector then points along the
            // galactic axes (x towards the centre, z towards the north pole).
            heliocentric = new Vector3D(radius * Math.Cos(azimuth) + s.SunRadiusKpc, radius * Math.Sin(azimuth), height);
        }
        while (heliocentric.Length < MinimumDistanceKpc);

        var (lambda, beta) = CelestialFrames.Angles(CelestialFrames.GalacticToEcliptic(heliocentric));
        double cosIota = random.NextUniform(-1, 1);
        return new DrawnBinary(
            f, mc, heliocentric.Length * PhysicalConstants.KiloparsecM, beta, lambda,
            Math.Acos(cosIota), random.NextUniform(0, Math.PI), random.NextUniform(0, 2 * Math.PI));
    }

    /// <summary>Inverse CDF of p(f) ∝ f^a on [lo, hi] at quantile <paramref name="u"/>.</summary>
    public static double PowerLaw(double lo, double hi, double a, double u)
    {
        if (Math.Abs(a + 1) < 1e-12) return lo * Math.Pow(hi / lo, u);
        double b = a + 1;
        double loB = Math.Pow(lo, b), hiB = Math.Pow(hi, b);
        return Math.Pow(loB + u * (hiB - loB), 1 / b);
    }
}
