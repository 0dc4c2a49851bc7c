using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Astrometry;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticPopulationTests
{
    private static GalacticPopulationSettings Settings(int count = 20000, double height = 0.3, double sun = 8.0) =>
        new(count, 1e-4, 1e-2, -11.0 / 3.0, 0.35, 0.1, 0.15, 1.0, 2.5, height, sun);

    private static DrawnBinary[] Draw(GalacticPopulationSettings s, ulong seed = 3)
    {
        var stream = RandomStream.FromSeed(seed);
        return GalacticPopulation.Draw(s, ref stream);
    }

    // For p(f) ∝ f^a on [lo, hi], E[f] = (b/(b+1)) (hi^{b+1} − lo^{b+1}) / (hi^b − lo^b), b = a + 1 (direct integration).
    // 4σ bound with σ from the sample standard deviation: false-failure rate 6e-5.
    [Fact]
    public void Frequencies_follow_the_power_law()
    {
        var f = Draw(Settings()).Select(b => b.FrequencyHz).ToArray();
        double a = -11.0 / 3.0, b = a + 1, lo = 1e-4, hi = 1e-2;
        double expected = b / (b + 1) * (Math.Pow(hi, b + 1) - Math.Pow(lo, b + 1)) / (Math.Pow(hi, b) - Math.Pow(lo, b));
        double mean = f.Average();
        double sd = Math.Sqrt(f.Sum(x => (x - mean) * (x - mean)) / (f.Length - 1));
        Assert.InRange(mean, expected - 4 * sd / Math.Sqrt(f.Length), expected + 4 * sd / Math.Sqrt(f.Length));
        Assert.All(f, x => Assert.InRange(x, lo, hi));
        Assert.Equal(lo, GalacticPopulation.PowerLaw(lo, hi, a, 0.0), lo * 1e-12);
        // At u = 1 the inverse CDF subtracts lo^b ≈ 2e5 × hi^b, so round-off is ~ε × 2e5 relative.
        Assert.Equal(hi, GalacticPopulation.PowerLaw(lo, hi, a, 1.0), hi * 1e-9);
        Assert.Equal(Math.Sqrt(lo * hi), GalacticPopulation.PowerLaw(lo, hi, -1.0, 0.5), 1e-15); // log-uniform median
    }

    // Seen from the Galactic centre (sun radius → 0) a disc of negligible thickness gives distances with the
    // Gamma(2, R_d) law of the radius: mean 2 R_d, sd √2 R_d; 4σ bound.
    [Fact]
    public void Disc_radii_follow_the_exponential_surface_density()
    {
        var d = Draw(Settings(height: 1e-6, sun: 1e-9)).Select(b => b.DistanceM / PhysicalConstants.KiloparsecM).ToArray();
        double sigma = Math.Sqrt(2) * 2.5 / Math.Sqrt(d.Length);
        Assert.InRange(d.Average(), 5.0 - 4 * sigma, 5.0 + 4 * sigma);
    }

    // A disc of negligible thickness lies in the Galactic plane, so every drawn ecliptic direction must be
    // perpendicular to the Galactic north pole expressed in ecliptic coordinates; this checks the frame chain.
    [Fact]
    public void A_thin_disc_lies_on_the_galactic_plane_of_the_ecliptic_sky()
    {
        var pole = CelestialFrames.GalacticToEcliptic(new Vector3D(0, 0, 1));
        foreach (var b in Draw(Settings(count: 500, height: 1e-7)))
            Assert.Equal(0.0, CelestialFrames.Direction(b.LambdaRad, b.BetaRad).Dot(pole), 1e-6);
    }

    [Fact]
    public void Chirp_masses_respect_the_truncation_and_orientations_are_isotropic()
    {
        var draws = Draw(Settings());
        Assert.All(draws, b => Assert.InRange(b.ChirpMassMsun, 0.15, 1.0));
        // cos ι uniform on [−1, 1]: mean 0, sd 1/√3; ψ uniform on [0, π): mean π/2. 4σ bounds.
        double n = draws.Length;
        Assert.InRange(draws.Average(b => Math.Cos(b.InclinationRad)), -4 / Math.Sqrt(3 * n), 4 / Math.Sqrt(3 * n));
        Assert.InRange(draws.Average(b => b.PolarisationRad), Math.PI / 2 - 4 * Math.PI / Math.Sqrt(12 * n), Math.PI / 2 + 4 * Math.PI / Math.Sqrt(12 * n));
        Assert.All(draws, b => Assert.True(b.DistanceM >= GalacticPopulation.MinimumDistanceKpc * PhysicalConstants.KiloparsecM));
    }

    [Fact]
    public void The_same_stream_gives_the_same_population()
    {
        Assert.Equal(Draw(Settings(count: 100), seed: 9), Draw(Settings(count: 100), seed: 9));
        Assert.NotEqual(Draw(Settings(count: 100), seed: 9), Draw(Settings(count: 100), seed: 10));
    }
}
