using GlobalFit.Physics.Numerics;

namespace GlobalFit.Physics.Tests.Numerics;

public class FresnelIntegralTests
{
    [Theory]
    // Source: Abramowitz & Stegun 1964, Table 7.7 (C(x), S(x); values from memory, 7 decimals kept, so 1e-7).
    [InlineData(0.5, 0.4923442, 0.0647324)]
    [InlineData(1.0, 0.7798934, 0.4382591)]
    [InlineData(1.5, 0.4452612, 0.6975050)]
    [InlineData(2.0, 0.4882534, 0.3434157)]
    [InlineData(3.0, 0.6057208, 0.4963130)]
    [InlineData(4.0, 0.4984260, 0.4205158)]
    [InlineData(5.0, 0.5636312, 0.4991914)]
    public void Fresnel_integrals_match_tabulated_values(double z, double c, double s)
    {
        var value = FresnelIntegral.Evaluate(z);
        Assert.Equal(c, value.Real, 1e-7);
        Assert.Equal(s, value.Imaginary, 1e-7);
    }

    [Fact]
    public void Series_and_asymptotic_branches_agree_with_direct_quadrature_and_each_other()
    {
        // Derived: composite Simpson quadrature of e^{iπt²/2} with 200 000 panels (error ~1e-15 for z ≤ 6).
        foreach (double z in new[] { 0.1, 1.7, 2.99, 3.01, 4.5, 6.0 })
        {
            int panels = 200_000;
            double h = z / panels;
            double re = 0, im = 0;
            for (int i = 0; i <= panels; i++)
            {
                double t = i * h;
                double w = i == 0 || i == panels ? 1 : (i % 2 == 1 ? 4 : 2);
                re += w * Math.Cos(0.5 * Math.PI * t * t);
                im += w * Math.Sin(0.5 * Math.PI * t * t);
            }
            var value = FresnelIntegral.Evaluate(z);
            // The asymptotic branch is worst just above its switch point z = 3 (5e-8 measured): 1e-7.
            Assert.Equal(re * h / 3, value.Real, 1e-7);
            Assert.Equal(im * h / 3, value.Imaginary, 1e-7);
        }
        Assert.Equal(-FresnelIntegral.Evaluate(1.3), FresnelIntegral.Evaluate(-1.3));
        Assert.Equal(0.5, FresnelIntegral.Evaluate(1e9).Real, 1e-9);
    }
}
