using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinarySourceFisherTests
{
    private const int D = GalacticBinarySourceVector.Dimension;

    // The speed notes of GalacticBinarySourceFisher promise the same numbers as central differences of templates rendered
    // over the whole padded window with inner products over every bin; this is that computation, written out.
    private static double[] WholeWindowFisher(GalacticBinaryTemplateGenerator generator, GalacticBinaryBand band, double scale,
        GalacticBinarySourcePrior prior, double[] theta)
    {
        var schema = prior.Schema;
        double[] steps =
        [
            1e-3 * band.DfHz, 0.05 * schema.Parameters[1].Width, 1e-4 * Math.Max(theta[2], 1.0), 1e-4, 1e-4, 1e-4, 1e-4, 1e-4,
        ];
        var derivatives = new (Complex[] A, Complex[] E)[D];
        var shifted = new double[D];
        for (int i = 0; i < D; i++)
        {
            var (a, e) = (new Complex[band.Window.Count], new Complex[band.Window.Count]);
            theta.CopyTo(shifted, 0);
            shifted[i] += steps[i];
            generator.AddResponse(GalacticBinarySourceVector.ToParameters(shifted, scale), band.Window, a, e, Span<Complex>.Empty);
            for (int k = 0; k < a.Length; k++) (a[k], e[k]) = (a[k] * -1.0, e[k] * -1.0);
            theta.CopyTo(shifted, 0);
            shifted[i] -= steps[i];
            generator.AddResponse(GalacticBinarySourceVector.ToParameters(shifted, scale), band.Window, a, e, Span<Complex>.Empty);
            double factor = -1.0 / (2.0 * steps[i]);
            for (int k = 0; k < a.Length; k++) (a[k], e[k]) = (a[k] * factor, e[k] * factor);
            derivatives[i] = (a, e);
        }
        var matrix = new double[D * D];
        for (int i = 0; i < D; i++)
            for (int j = i; j < D; j++)
            {
                double value = InnerProduct.Real(derivatives[i].A, derivatives[j].A, band.InverseA, band.DfHz)
                    + InnerProduct.Real(derivatives[i].E, derivatives[j].E, band.InverseE, band.DfHz);
                if (i == j) value += 1.0 / (schema.Parameters[i].Width * schema.Parameters[i].Width);
                matrix[i * D + j] = value;
                matrix[j * D + i] = value;
            }
        return matrix;
    }

    [Fact]
    public void Cached_matrices_over_the_templates_bins_equal_whole_window_differences_bit_for_bit()
    {
        // An odd window start and sources near both edges exercise the even-offset rule and the clipping at the window.
        var window = new BinWindow(7777, 160);
        double df = 1 / (30 * 86400.0), scale = 1e23;
        var data = new BandTestData(30, window, [], 8);
        var band = data.Residual(window);
        var prior = new GalacticBinarySourcePrior(window.First * df, window.End * df, -1e-16, 1e-15, new SnrAmplitudePrior(10, 1e4));
        GalacticBinaryParameters[] sources =
        [
            new((7777 + 50.2) * df, 1e-16, 2e-22, 0.3, 1.0, 0.5, 0.2, 0.1),
            new((7777 + 3.7) * df, 0, 1.5e-22, -0.6, 4.0, 1.9, 1.2, 2.5),
            new((7777 + 158.1) * df, 5e-16, 1e-22, 1.1, 0.3, 1.0, 2.8, 4.0),
        ];
        var thetas = sources.Select(s =>
        {
            var v = new double[D];
            GalacticBinarySourceVector.FromParameters(s, scale, v);
            return v;
        }).ToArray();
        var expected = thetas.Select(t => WholeWindowFisher(data.Generator, band, scale, prior, t)).ToArray();
        // Capacity 2: the third source empties the cache, so hits, misses and recomputation after eviction all occur.
        var fisher = new GalacticBinarySourceFisher(data.Generator, band, scale, prior.Schema, cacheCapacity: 2);
        var uncached = new GalacticBinarySourceFisher(data.Generator, band, scale, prior.Schema);
        var matrix = new double[D * D];
        foreach (int i in new[] { 0, 1, 0, 2, 1, 0, 2 })
        {
            fisher.FisherMatrix(thetas[i], matrix);
            Assert.Equal(expected[i], matrix);
            uncached.FisherMatrix(thetas[i], matrix);
            Assert.Equal(expected[i], matrix);
        }
    }

    [Fact]
    public void A_negative_cache_capacity_is_refused()
    {
        var window = new BinWindow(7777, 64);
        var data = new BandTestData(30, window, [], 8, noise: false);
        var prior = new GalacticBinarySourcePrior(window.First * data.DfHz, window.End * data.DfHz, -1e-16, 1e-15, new SnrAmplitudePrior(10, 1e4));
        var error = Assert.Throws<ArgumentOutOfRangeException>(() =>
            new GalacticBinarySourceFisher(data.Generator, data.Residual(window), 1e23, prior.Schema, cacheCapacity: -1));
        Assert.Equal("cacheCapacity", error.ParamName);
    }
}
