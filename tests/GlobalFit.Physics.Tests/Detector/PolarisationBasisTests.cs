using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class PolarisationBasisTests
{
    private static readonly Vector3D[] Axes = [new(1, 0, 0), new(0, 1, 0), new(0, 0, 1)];

    public static TheoryData<double, double, double> Directions => new()
    {
        { 0.0, 0.0, 0.0 },
        { 0.4, 1.9, 0.6 },
        { -1.2, 4.0, -0.3 },
        { 0.5 * Math.PI, 0.7, 2.0 },
    };

    [Theory]
    [MemberData(nameof(Directions))]
    public void Triad_is_orthonormal_and_right_handed_with_k_pointing_away_from_the_source(double beta, double lambda, double psi)
    {
        // Source: our convention (PolarisationBasis remarks; derived: the triad is orthonormal and right-handed):
        // k = -(cos b cos l, cos b sin l, sin b). Rounding-level tolerance.
        var sky = new SkyPosition(beta, lambda);
        var basis = new PolarisationBasis(sky, psi);
        Assert.Equal(1.0, basis.U.Length, 1e-15);
        Assert.Equal(1.0, basis.V.Length, 1e-15);
        Assert.Equal(0.0, basis.U.Dot(basis.V), 1e-15);
        Assert.Equal(0.0, (basis.U.Cross(basis.V) - basis.K).Length, 1e-15);
        Assert.Equal(0.0, (basis.K + sky.TowardsSource).Length, 1e-15);
        Assert.Equal(sky.PropagationDirection, basis.K);
    }

    [Theory]
    [MemberData(nameof(Directions))]
    public void Polarisation_tensors_are_transverse_traceless_and_normalised(double beta, double lambda, double psi)
    {
        // Source: TT-gauge polarisation tensors (derived from e+ = uu - vv, ex = uv + vu): eps.k = 0, tr eps = 0, eps+ : eps+ = epsx : epsx = 2,
        // eps+ : epsx = 0. Components are read through the contractions with the coordinate axes. 1e-14 absolute.
        var basis = new PolarisationBasis(new SkyPosition(beta, lambda), psi);
        double plusNorm = 0, crossNorm = 0, overlap = 0, plusTrace = 0, crossTrace = 0;
        foreach (var a in Axes)
        {
            plusTrace += basis.PlusContraction(a, a);
            crossTrace += basis.CrossContraction(a, a);
            Assert.Equal(0.0, basis.PlusContraction(basis.K, a), 1e-14);
            Assert.Equal(0.0, basis.CrossContraction(a, basis.K), 1e-14);
            foreach (var b in Axes)
            {
                double p = basis.PlusContraction(a, b), c = basis.CrossContraction(a, b);
                Assert.Equal(p, basis.PlusContraction(b, a), 1e-15);
                plusNorm += p * p;
                crossNorm += c * c;
                overlap += p * c;
            }
        }
        Assert.Equal(0.0, plusTrace, 1e-14);
        Assert.Equal(0.0, crossTrace, 1e-14);
        Assert.Equal(2.0, plusNorm, 1e-14);
        Assert.Equal(2.0, crossNorm, 1e-14);
        Assert.Equal(0.0, overlap, 1e-14);
    }

    [Fact]
    public void Rotating_psi_by_an_eighth_turn_turns_plus_into_cross_and_a_quarter_turn_flips_the_sign()
    {
        // Source: our convention (PolarisationBasis remarks): eps+(psi) = cos 2psi e+ + sin 2psi ex, epsx(psi) = -sin 2psi e+ + cos 2psi ex, so
        // eps+(psi + pi/4) = epsx(psi) and eps+(psi + pi/2) = -eps+(psi). 1e-15 absolute on unit-vector contractions.
        var sky = new SkyPosition(0.4, 1.9);
        var a = new Vector3D(0.3, -0.8, 0.52).Normalized();
        var b = new Vector3D(-0.1, 0.2, 0.97).Normalized();
        var start = new PolarisationBasis(sky, 0.6);
        var eighth = new PolarisationBasis(sky, 0.6 + Math.PI / 4);
        var quarter = new PolarisationBasis(sky, 0.6 + Math.PI / 2);
        Assert.Equal(start.CrossContraction(a, b), eighth.PlusContraction(a, b), 1e-15);
        Assert.Equal(-start.PlusContraction(a, b), quarter.PlusContraction(a, b), 1e-15);
        Assert.Equal(-start.CrossContraction(a, b), quarter.CrossContraction(a, b), 1e-15);
        var (plus, cross) = start.LinkPattern(a);
        Assert.Equal(start.PlusContraction(a, a), plus, 1e-15);
        Assert.Equal(start.CrossContraction(a, a), cross, 1e-15);
    }

    [Fact]
    public void Source_on_the_x_axis_has_the_documented_frame()
    {
        // Source: our convention (PolarisationBasis remarks) at beta = lambda = 0: u = (0, 0, -1), v = (0, -1, 0), k = (-1, 0, 0); so a link along z
        // sees e+ = 1 and one along y sees e+ = -1.
        var basis = new PolarisationBasis(new SkyPosition(0, 0), 0);
        Assert.Equal(new Vector3D(0, 0, -1), basis.U);
        Assert.Equal(new Vector3D(0, -1, 0), basis.V);
        Assert.Equal(1.0, basis.LinkPattern(new Vector3D(0, 0, 1)).Plus, 1e-15);
        Assert.Equal(-1.0, basis.LinkPattern(new Vector3D(0, 1, 0)).Plus, 1e-15);
    }

    [Fact]
    public void Out_of_range_angles_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new SkyPosition(1.6, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SkyPosition(double.NaN, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SkyPosition(0.0, double.PositiveInfinity));
        Assert.Throws<ArgumentOutOfRangeException>(() => new PolarisationBasis(new SkyPosition(0, 0), double.NaN));
    }
}
