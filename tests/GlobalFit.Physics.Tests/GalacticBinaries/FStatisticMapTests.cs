using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class FStatisticMapTests(ITestOutputHelper output)
{
    private static readonly GalacticBinaryTemplateGenerator Generator = new(30 * 86400.0, 15.0);
    private static readonly GalacticBinaryParameters Source = new(3.0002e-3, 0.0, 4e-23, 0.5, 2.3, 1.0, 0.7, 2.0);

    private static (FStatisticMap Map, FStatisticTestBand Band) LoudSourceMap(int latitudeCount, int longitudeCount)
    {
        var band = new FStatisticTestBand(Generator, Source.FrequencyHz, 4);
        band.AddSignal(Source);
        band.AddNoise(seed: 9);
        // Ten bins centred on the source's carrier, two cells per bin, one fdot cell around zero.
        var centre = Generator.TemplateBins(Source.FrequencyHz, 0).First + Generator.TemplateBins(Source.FrequencyHz, 0).Count / 2;
        var grid = FStatisticGrid.ForWindow(new BinWindow(centre - 5, 10), Generator.FrequencyResolutionHz, 2,
            -1e-16, 1e-16, 1, latitudeCount, longitudeCount);
        return (FStatisticMap.Compute(new FStatistic(Generator), band.Band, grid), band);
    }

    [Fact]
    public void Map_peaks_within_a_bin_of_the_injected_frequency()
    {
        // An SNR ~6 source in one month: the largest F on the grid must sit within one bin of f0 (the F-statistic
        // main lobe is about one bin wide, Jaranowski, Krolak & Schutz 1998). Sky cells are coarse (4 x 8).
        var (map, _) = LoudSourceMap(4, 8);
        var best = map.Grid.Centre(map.BestCell());
        output.WriteLine($"best cell f0 = {best.FrequencyHz:E8} (injected {Source.FrequencyHz:E8}), F = {map.Values[map.BestCell()]:F2}");
        Assert.InRange(best.FrequencyHz, Source.FrequencyHz - Generator.FrequencyResolutionHz, Source.FrequencyHz + Generator.FrequencyResolutionHz);
    }

    [Fact]
    public void Birth_density_integrates_to_one()
    {
        // Exact: the cell probabilities sum to 1 (to rounding, 1e-12). Monte Carlo: 40000 uniform points over the box
        // (f0, fdot, beta, lambda) estimate the integral of exp(LogDensity) as box volume x sample mean; the standard
        // error is computed from the sample and we assert within 4 of it (false-failure rate ~6e-5).
        var (map, _) = LoudSourceMap(3, 6);
        var density = new FStatisticBirthDensity(map, temperature: 5.0, uniformFraction: 0.2);
        double total = Enumerable.Range(0, map.Grid.CellCount).Sum(density.CellProbability);
        Assert.Equal(1.0, total, 1e-12);
        var grid = map.Grid;
        var random = new Random(17);
        const int points = 40000;
        double boxVolume = grid.FrequencyCellHz * grid.FrequencyCount * grid.DerivativeCellHzS * grid.DerivativeCount * Math.PI * 2 * Math.PI;
        double sum = 0, sumSquares = 0;
        for (int i = 0; i < points; i++)
        {
            var point = new GalacticBinaryIntrinsics(
                grid.FrequencyStartHz + random.NextDouble() * grid.FrequencyCellHz * grid.FrequencyCount,
                grid.DerivativeStartHzS + random.NextDouble() * grid.DerivativeCellHzS * grid.DerivativeCount,
                (random.NextDouble() - 0.5) * Math.PI, random.NextDouble() * 2 * Math.PI);
            double value = boxVolume * Math.Exp(density.LogDensity(point));
            sum += value;
            sumSquares += value * value;
        }
        double mean = sum / points, error = Math.Sqrt((sumSquares / points - mean * mean) / points);
        output.WriteLine($"Monte Carlo integral {mean:F4} +- {error:F4}");
        Assert.InRange(mean, 1 - 4 * error, 1 + 4 * error);
        Assert.Equal(double.NegativeInfinity, density.LogDensity(grid.Centre(0) with { FrequencyHz = grid.FrequencyStartHz - 1e-9 }));
    }

    [Fact]
    public void Draws_follow_the_cell_probabilities_and_are_uniform_in_sine_latitude_within_a_cell()
    {
        // 30000 draws; Pearson chi-square of the cell counts against the cell probabilities (120 cells: 20 frequency
        // cells x 3 x 2 sky cells; 119 dof): the 99.99 % point of chi-square(119) is ~185 (Wilson-Hilferty), so the
        // false-failure rate is ~1e-4. Measured 119.3. Every draw
        // must lie in the cell it was drawn for, and have a finite log density. Within cells sin(beta) is uniform: the
        // mean of the within-cell fraction of sin(beta) must be 1/2 within 4 standard errors (sqrt(1/12/30000)).
        var (map, _) = LoudSourceMap(3, 2);
        var density = new FStatisticBirthDensity(map, temperature: 10.0, uniformFraction: 0.3);
        var grid = map.Grid;
        var counts = new int[grid.CellCount];
        var random = new Random(23);
        Span<double> uniforms = stackalloc double[FStatisticBirthDensity.UniformsPerDraw];
        const int draws = 30000;
        double fractionSum = 0;
        for (int i = 0; i < draws; i++)
        {
            for (int u = 0; u < uniforms.Length; u++) uniforms[u] = random.NextDouble();
            var point = density.Draw(uniforms);
            int cell = grid.CellOf(point);
            Assert.True(cell >= 0);
            Assert.True(double.IsFinite(density.LogDensity(point)));
            counts[cell]++;
            double sinBetaFraction = (Math.Sin(point.EclipticLatitudeRad) + 1.0) * 0.5 * grid.LatitudeCount;
            fractionSum += sinBetaFraction - Math.Floor(sinBetaFraction);
        }
        double chiSquare = 0;
        for (int c = 0; c < counts.Length; c++)
        {
            double expected = draws * density.CellProbability(c);
            chiSquare += (counts[c] - expected) * (counts[c] - expected) / expected;
        }
        double fractionMean = fractionSum / draws;
        output.WriteLine($"chi-square {chiSquare:F1} for {counts.Length - 1} dof; mean within-cell sin(beta) fraction {fractionMean:F4}");
        Assert.True(chiSquare < 185, $"chi-square {chiSquare}");
        Assert.InRange(fractionMean, 0.5 - 4 * Math.Sqrt(1.0 / 12 / draws), 0.5 + 4 * Math.Sqrt(1.0 / 12 / draws));
    }

    [Fact]
    public void Bad_density_settings_are_rejected()
    {
        var (map, _) = LoudSourceMap(2, 2);
        Assert.Throws<ArgumentOutOfRangeException>(() => new FStatisticBirthDensity(map, temperature: 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new FStatisticBirthDensity(map, uniformFraction: 1.5));
        Assert.Throws<ArgumentException>(() => new FStatisticBirthDensity(map).Draw(new double[4]));
        Assert.Throws<ArgumentOutOfRangeException>(() => FStatisticGrid.ForWindow(new BinWindow(10, 4), 1e-6, 1, 1.0, 0.0, 1, 2, 2));
    }
}
