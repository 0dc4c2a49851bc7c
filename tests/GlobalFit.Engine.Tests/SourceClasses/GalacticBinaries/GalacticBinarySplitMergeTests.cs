using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Random;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public sealed class GalacticBinarySplitMergeTests
{
    private const double BinHz = 1.0 / (30 * 86400.0);
    private static readonly GalacticBinarySplitMerge Map = new(4 * BinHz, 1.1e-15);

    // A source away from every wrap point, so that finite differences do not straddle one.
    private static readonly double[] Source = [2.1e-3, 3e-16, 40.0, 0.3, 2.0, -0.2, 1.2, 3.5];

    // Typical size of each coordinate's auxiliary variable: a bin, a tenth of the ḟ prior, order one otherwise.
    private static readonly double[] Scale = [BinHz, 1e-16, 1, 1, 1, 1, 1, 1];

    // The sampler's acceptance needs merge to invert split exactly (Green 1995, Biometrika 82, 711, §3.3). Tolerance: the
    // round trip costs a few roundings per coordinate (cos/sin/atan2, wrap), ~1e-15 relative on values of order 1–1e3.
    [Fact]
    public void Merge_undoes_split_for_random_auxiliary_draws()
    {
        var random = RandomStream.FromSeed(11);
        Span<double> u = stackalloc double[8], first = stackalloc double[8], second = stackalloc double[8];
        Span<double> merged = stackalloc double[8], recovered = stackalloc double[8];
        int tried = 0;
        for (int draw = 0; draw < 1000; draw++)
        {
            double logDensity = Map.DrawAuxiliary(Source, u, ref random);
            if (!(logDensity > double.NegativeInfinity)) continue;
            tried++;
            Assert.True(Map.TrySplit(Source, u, first, second, out double splitJacobian));
            Assert.True(Map.TryMerge(first, second, merged, recovered, out double mergeJacobian));
            Assert.Equal(splitJacobian, mergeJacobian, 1e-12);
            Assert.Equal(logDensity, Map.LogAuxiliaryDensity(merged, recovered), 1e-9);
            for (int i = 0; i < 8; i++)
            {
                Assert.Equal(Source[i], merged[i], Math.Abs(Source[i]) * 1e-12);
                Assert.Equal(u[i], recovered[i], Scale[i] * 1e-9);
            }
        }
        // Only draws with a periodic difference beyond half a period are refused: P(|δλ| ≥ π) = 0.0017 (σ = 1),
        // P(|δψ| ≥ π/2) = 0.0497 (σ = 0.8), P(|δφ0| ≥ π) = 0.0362 (σ = 1.5), so 914.4 ± 8.9 of 1000 draws are kept
        // (binomial); the 5σ band [870, 959] has a false-failure rate of 6e-7.
        Assert.InRange(tried, 870, 959);
    }

    // ln|J| = ln ρ̂ (derived in GalacticBinarySplitMerge's remarks) against the determinant of a central-difference
    // Jacobian of the 16 → 16 split map. Steps are 1e-6 of each coordinate's scale: truncation ~1e-12, round-off ~1e-9
    // relative per entry, so the determinant agrees to ~1e-7; tolerance 1e-5 relative.
    [Theory]
    [InlineData(0.3, 1.5e-6)]
    [InlineData(1.2, -0.7e-6)]
    [InlineData(0.05, 0.2e-6)]
    public void The_split_jacobian_matches_finite_differences(double angle, double separationHz)
    {
        double[] point = [.. Source, 0, 0, 0, 0, 0, 0, 0, 0];
        double[] auxiliary = [separationHz, 2e-16, angle, 0.2, -0.5, 0.3, 0.4, -1.0];
        auxiliary.CopyTo(point, 8);
        double[] scale = [.. Scale, .. Scale];
        var jacobian = new double[16, 16];
        for (int j = 0; j < 16; j++)
        {
            double h = 1e-6 * scale[j];
            var plus = (double[])point.Clone();
            var minus = (double[])point.Clone();
            plus[j] += h;
            minus[j] -= h;
            double[] up = Split(plus), down = Split(minus);
            for (int i = 0; i < 16; i++) jacobian[i, j] = (up[i] - down[i]) / (2 * h);
        }
        Assert.True(Map.TrySplit(Source, auxiliary, new double[8], new double[8], out double logJacobian));
        Assert.Equal(Math.Log(Source[2]), logJacobian, 1e-12);
        double expected = Math.Exp(logJacobian);
        Assert.Equal(expected, Math.Abs(Determinant(jacobian)), expected * 1e-5);
    }

    [Fact]
    public void Pairs_further_apart_than_the_separation_limit_do_not_merge()
    {
        double[] first = [.. Source], second = [.. Source];
        second[0] += 4.5 * BinHz;
        Assert.False(Map.TryMerge(first, second, new double[8], new double[8], out _));
        second[0] = Source[0] + 3.5 * BinHz;
        Assert.True(Map.TryMerge(first, second, new double[8], new double[8], out _));
    }

    private static double[] Split(double[] point)
    {
        var first = new double[8];
        var second = new double[8];
        Assert.True(Map.TrySplit(point.AsSpan(0, 8), point.AsSpan(8, 8), first, second, out _));
        return [.. first, .. second];
    }

    // LU decomposition with partial pivoting.
    private static double Determinant(double[,] matrix)
    {
        int n = matrix.GetLength(0);
        var m = (double[,])matrix.Clone();
        double det = 1.0;
        for (int c = 0; c < n; c++)
        {
            int pivot = c;
            for (int r = c + 1; r < n; r++)
                if (Math.Abs(m[r, c]) > Math.Abs(m[pivot, c])) pivot = r;
            if (m[pivot, c] == 0.0) return 0.0;
            if (pivot != c)
            {
                for (int k = 0; k < n; k++) (m[c, k], m[pivot, k]) = (m[pivot, k], m[c, k]);
                det = -det;
            }
            det *= m[c, c];
            for (int r = c + 1; r < n; r++)
            {
                double factor = m[r, c] / m[c, c];
                for (int k = c; k < n; k++) m[r, k] -= factor * m[c, k];
            }
        }
        return det;
    }
}
