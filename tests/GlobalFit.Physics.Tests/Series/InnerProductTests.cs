using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Series;

public class InnerProductTests
{
    private static Complex[] RandomSpectrum(int n, int seed)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
    }

    [Fact]
    public void Inner_product_of_a_series_with_itself_is_its_squared_norm()
    {
        var a = RandomSpectrum(101, 1);
        var w = Enumerable.Range(0, 101).Select(k => 1.0 + k).ToArray();
        double self = InnerProduct.Real(a, a, w, 0.5);
        Assert.Equal(InnerProduct.SquaredNorm(a, w, 0.5), self, 1e-12 * self);
    }

    [Fact]
    public void Inner_product_is_the_noise_weighted_sum_of_the_definition()
    {
        // Written out from (a|b) = 4 Re Σ a b* / S Δf (Cutler & Flanagan 1994) for three bins.
        Complex[] a = [new(1, 2), new(-3, 0.5), new(0, 1)];
        Complex[] b = [new(2, -1), new(1, 1), new(4, -2)];
        double[] psd = [2.0, 4.0, 8.0];
        var w = new double[3];
        InnerProduct.InvertPsd(psd, w);
        double expected = 4 * 0.1 * ((1 * 2 + 2 * -1) / 2.0 + (-3 * 1 + 0.5 * 1) / 4.0 + (0 * 4 + 1 * -2) / 8.0);
        Assert.Equal(expected, InnerProduct.Real(a, b, w, 0.1), 1e-15);
        Assert.Equal(expected, InnerProduct.ComplexProduct(a, b, w, 0.1).Real, 1e-15);
    }

    [Fact]
    public void Complex_inner_product_rotates_with_a_constant_phase()
    {
        var a = RandomSpectrum(64, 2);
        var w = Enumerable.Repeat(1.0, 64).ToArray();
        var rotated = a.Select(v => v * Complex.FromPolarCoordinates(1, 0.7)).ToArray();
        Complex z = InnerProduct.ComplexProduct(rotated, a, w, 1.0);
        Assert.Equal(0.7, z.Phase, 1e-12);
        Assert.Equal(InnerProduct.SquaredNorm(a, w, 1.0), z.Magnitude, 1e-12);
    }

    [Fact]
    public void Bins_with_zero_psd_get_zero_weight()
    {
        var w = new double[3];
        InnerProduct.InvertPsd([0.0, double.PositiveInfinity, 4.0], w);
        Assert.Equal([0.0, 0.0, 0.25], w);
    }

    [Fact]
    public void Mismatched_lengths_are_rejected()
    {
        Assert.Throws<ArgumentException>(() => InnerProduct.Real(new Complex[3], new Complex[4], new double[3], 1));
    }

    // (h|h) = h0² T / S for h0 cos(2π f0 t) with a flat PSD (derived: Parseval with the inner product of Cutler &
    // Flanagan 1994).
    [Fact]
    public void Snr_of_a_sinusoid_in_white_noise_matches_the_closed_form()
    {
        const int n = 1 << 14;
        const double dt = 10.0, h0 = 1e-21, psd = 1e-40;
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = h0 * Math.Cos(2 * Math.PI * 1000 * i / n);
        var fs = FourierTransform.Forward(new TimeSeries(0, dt, x));
        var w = Enumerable.Repeat(1.0 / psd, fs.Count).ToArray();
        double snr2 = InnerProduct.SquaredNorm(fs.Values, w, fs.DfHz);
        Assert.Equal(h0 * h0 * n * dt / psd, snr2, 1e-9 * snr2);
    }
}
