using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Series;

public class TukeyWindowTests
{
    // Source: Harris 1978, Proc. IEEE 66, 51: the Tukey window with α = 1 is the Hann window
    // w[n] = ½(1 − cos(2πn/(N−1))), and α = 0 is rectangular.
    [Theory]
    [InlineData(16)]
    [InlineData(17)]
    public void Full_taper_is_the_hann_window(int n)
    {
        var w = Enumerable.Repeat(1.0, n).ToArray();
        TukeyWindow.Apply(w, 1.0);
        for (int i = 0; i < n; i++)
            Assert.Equal(0.5 * (1 - Math.Cos(2 * Math.PI * i / (n - 1))), w[i], 1e-15);
    }

    [Fact]
    public void Zero_taper_leaves_samples_untouched_and_partial_taper_keeps_a_flat_top()
    {
        var w = Enumerable.Repeat(1.0, 100).ToArray();
        TukeyWindow.Apply(w, 0.0);
        Assert.All(w, v => Assert.Equal(1.0, v));
        TukeyWindow.Apply(w, 0.2);
        Assert.Equal(0.0, w[0]);
        Assert.Equal(0.0, w[99]);
        Assert.All(w[11..89], v => Assert.Equal(1.0, v));
        for (int i = 0; i < 100; i++) Assert.Equal(TukeyWindow.Weight(i, 100, 0.2), w[i], 1e-15);
    }

    // The mean square of the Hann window tends to 3/8 (Harris 1978, Table 1 "incoherent power gain" is its
    // value normalised differently; 3/8 follows from ∫ sin⁴ = 3/8 over a period).
    [Fact]
    public void Mean_square_of_the_hann_window_approaches_three_eighths()
    {
        Assert.Equal(0.375, TukeyWindow.MeanSquare(100001, 1.0), 1e-4);
    }

    [Fact]
    public void Fractions_outside_zero_to_one_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => TukeyWindow.Apply(new double[4], 1.5));
        Assert.Throws<ArgumentOutOfRangeException>(() => TukeyWindow.Weight(0, 4, -0.1));
    }
}
