using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Series;

public class ComplexDftTests
{
    private static Complex[] Random(int n, int seed)
    {
        var random = new System.Random(seed);
        return Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
    }

    // The definition X_k = Σ x_n e^{-2πikn/N}, evaluated directly with exact integer phase reduction.
    private static Complex[] Direct(Complex[] x, int sign)
    {
        int n = x.Length;
        var result = new Complex[n];
        for (int k = 0; k < n; k++)
            for (int j = 0; j < n; j++)
                result[k] += x[j] * Complex.FromPolarCoordinates(1, sign * 2 * Math.PI * ((long)k * j % n) / n);
        return result;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(105)]   // 3·5·7
    [InlineData(487)]   // the prime factor of a year at 5 s cadence
    [InlineData(1000)]
    [InlineData(256)]   // power of two: radix-2 path
    public void Forward_and_inverse_equal_the_direct_sums(int n)
    {
        var x = Random(n, n);
        var forward = (Complex[])x.Clone();
        ComplexDft.Forward(forward);
        var inverse = (Complex[])x.Clone();
        ComplexDft.Inverse(inverse);
        var expectedForward = Direct(x, -1);
        var expectedInverse = Direct(x, +1);
        // Bluestein round-off grows like ε log M times the signal norm √N; 1e-12 √N leaves a wide margin.
        double tolerance = 1e-12 * Math.Sqrt(n);
        for (int k = 0; k < n; k++)
        {
            Assert.True((forward[k] - expectedForward[k]).Magnitude < tolerance, $"forward bin {k}");
            Assert.True((inverse[k] - expectedInverse[k]).Magnitude < tolerance, $"inverse bin {k}");
        }
    }

    [Fact]
    public void Large_non_power_of_two_round_trip_keeps_full_precision()
    {
        // 2·3^4·5·487·8 = 3,155,760: half a year at 5 s, the packed length of a full year.
        const int n = 3_155_760;
        var x = Random(n, 5);
        var y = (Complex[])x.Clone();
        ComplexDft.Forward(y);
        ComplexDft.Inverse(y);
        double worst = 0;
        for (int i = 0; i < n; i++) worst = Math.Max(worst, (y[i] / n - x[i]).Magnitude);
        // Exact integer reduction of the chirp phase keeps this at round-off (~1e-15); a floating-point
        // πk²/N carries phase errors of order N ε ≈ 1e-9 at this length, which this bound would catch.
        Assert.True(worst < 1e-12, $"worst round-trip error {worst}");
    }
}
