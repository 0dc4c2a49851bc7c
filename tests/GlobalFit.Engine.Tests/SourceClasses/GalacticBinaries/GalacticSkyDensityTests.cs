using GlobalFit.Engine.SourceClasses.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public sealed class GalacticSkyDensityTests
{
    // Ecliptic coordinates of the Galactic centre, λ = 266.84°, β = −5.54° (from memory; the standard J2000 value).
    private const double CentreLambda = 266.84 * Math.PI / 180, CentreBeta = -5.54 * Math.PI / 180;

    // s = 2e23 per unit amplitude is what a one-month window at 3 mHz has (derived from the demo's truth: an SNR-15.4 binary
    // of amplitude 7.3e-23), so ρ̂ ≥ 5 keeps binaries out to a few kpc.
    private static GalacticSkyDensity Density() => new(GalacticPopulationSettings.Defaults, 3e-3, 2e23, 5.0);

    // A probability density on the sphere: Σ density × cell area = 1 (sums of a few hundred terms; tolerance 1e-12).
    [Fact]
    public void The_density_integrates_to_one_over_the_sphere()
    {
        var density = Density();
        double area = 4 * Math.PI / (GalacticSkyDensity.LatitudeCells * GalacticSkyDensity.LongitudeCells);
        double total = 0;
        for (int i = 0; i < GalacticSkyDensity.LatitudeCells; i++)
            for (int j = 0; j < GalacticSkyDensity.LongitudeCells; j++)
            {
                double sinBeta = -1 + (i + 0.5) * 2.0 / GalacticSkyDensity.LatitudeCells;
                double lambda = (j + 0.5) * 2 * Math.PI / GalacticSkyDensity.LongitudeCells;
                total += Math.Exp(density.LogDensity(sinBeta, lambda)) * area;
            }
        Assert.Equal(1.0, total, 1e-12);
        Assert.True(density.Kept > 1000, $"only {density.Kept} loud draws");
    }

    // The disc seen from 8 kpc: the loud binaries crowd toward the centre, so the density there exceeds the isotropic
    // 1/(4π) several times, and toward the anticentre it falls under it (bounded below by the isotropic floor ε/(4π)).
    [Fact]
    public void The_galactic_centre_is_denser_than_the_anticentre_and_the_floor_holds()
    {
        var density = Density();
        double isotropic = 1 / (4 * Math.PI);
        double centre = Math.Exp(density.LogDensity(Math.Sin(CentreBeta), CentreLambda));
        double anticentre = Math.Exp(density.LogDensity(-Math.Sin(CentreBeta), CentreLambda - Math.PI));
        Assert.True(centre > 3 * isotropic, $"centre {centre / isotropic:F2} × isotropic");
        Assert.True(anticentre < isotropic, $"anticentre {anticentre / isotropic:F2} × isotropic");
        Assert.True(anticentre >= GalacticSkyDensity.IsotropicFraction * isotropic * (1 - 1e-12));
    }

    [Fact]
    public void Bad_arguments_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticSkyDensity(GalacticPopulationSettings.Defaults, 0, 1e22, 5));
        Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticSkyDensity(GalacticPopulationSettings.Defaults, 3e-3, double.NaN, 5));
        Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticSkyDensity(GalacticPopulationSettings.Defaults, 3e-3, 1e22, -1));
    }
}
