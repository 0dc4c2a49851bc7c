using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryBandModelTests
{
    // ln L = (d|h) − ½(h|h) for h the sum of overlapping templates equals ½(d|d) − ½(d − h|d − h) computed directly on
    // the window (derived: expand the Gaussian likelihood with the inner product of Cutler & Flanagan 1994). Tolerance 1e-9 relative: only summation order differs.
    [Fact]
    public void The_pairwise_likelihood_equals_the_residual_norm_of_the_summed_templates()
    {
        var window = new BinWindow(7776, 128);
        double df = 1 / (30 * 86400.0);
        GalacticBinaryParameters[] sources =
        [
            new((7776 + 50.2) * df, 0, 2e-22, 0.3, 1.0, 0.5, 0.2, 0.1),
            new((7776 + 52.9) * df, 1e-16, 1.5e-22, -0.6, 4.0, 1.9, 1.2, 2.5),
            new((7776 + 70.5) * df, 0, 1e-22, 1.1, 0.3, 1.0, 2.8, 4.0),
        ];
        var data = new BandTestData(30, window, [sources[0]], 8);
        var band = data.Residual(window);
        double scale = 1e23;
        var prior = new GalacticBinarySourcePrior(window.First * df, window.End * df, -1e-16, 1e-15, new SnrAmplitudePrior(10, 1e4));
        var model = new GalacticBinaryBandModel(data.Generator, prior, band, scale, 5, 64);
        var vector = new double[3 * GalacticBinarySourceVector.Dimension];
        for (int j = 0; j < 3; j++) GalacticBinarySourceVector.FromParameters(sources[j], scale, vector.AsSpan(j * GalacticBinarySourceVector.Dimension));
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        model.AddTemplates(vector, 3, a, e, Span<Complex>.Empty);
        var ra = band.DataA.Zip(a, (x, y) => x - y).ToArray();
        var re = band.DataE.Zip(e, (x, y) => x - y).ToArray();
        double expected = 0.5 * (InnerProduct.SquaredNorm(band.DataA, band.InverseA, df) + InnerProduct.SquaredNorm(band.DataE, band.InverseE, df))
            - 0.5 * (InnerProduct.SquaredNorm(ra, band.InverseA, df) + InnerProduct.SquaredNorm(re, band.InverseE, df));
        double actual = model.LogLikelihood(vector, 3);
        Assert.Equal(expected, actual, Math.Abs(expected) * 1e-9);
        // A second call is served from the template cache and must give the identical number.
        Assert.Equal(actual, model.LogLikelihood(vector, 3));
        Assert.Equal(0.0, model.LogLikelihood([], 0));
    }

    [Fact]
    public void The_count_prior_is_uniform_up_to_the_cap()
    {
        var data = new BandTestData(30, new BinWindow(7776, 64), [], 1, noise: false);
        var prior = new GalacticBinarySourcePrior(3e-3, 3.01e-3, -1e-16, 1e-15, new SnrAmplitudePrior(10, 1e4));
        var model = new GalacticBinaryBandModel(data.Generator, prior, data.Residual(data.Bins), 1e23, 4, 16);
        Assert.Equal(-Math.Log(5), model.LogCountPrior(0));
        Assert.Equal(-Math.Log(5), model.LogCountPrior(4));
        Assert.Equal(double.NegativeInfinity, model.LogCountPrior(5));
    }
}
