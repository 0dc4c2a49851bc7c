using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class SkyReflectionTests(ITestOutputHelper output)
{
    private static readonly RigidOrbits Orbits = new(initialOrbitalPhaseRad: 0.4, initialOrientationRad: 1.3);
    private static readonly MassiveBlackHoleBinaryParameters Source = new(4e5, 2, 0.3, 0.1, 1.1e7, 2e4, 0.5, 2.0, 0.7, 0.9, 1.4);

    [Theory]
    [InlineData(1e-5)]
    [InlineData(1e-4)]
    [InlineData(3e-2)]
    public void Reflected_source_gives_the_same_response_of_a_frozen_constellation(double frequency)
    {
        // Constellation at t_c: the A and E responses (including the arrival delay, via t_c) agree at any frequency, since the
        // reflection fixes every arm and every in-plane offset (derived in SkyReflection). Rounding only; we allow 1e-9.
        var (reflected, _) = SkyReflection.Reflect(Source, Orbits);
        var original = Transfer(Source, frequency);
        var mirror = Transfer(reflected, frequency);
        double scale = Math.Sqrt(original.A.Magnitude * original.A.Magnitude + original.E.Magnitude * original.E.Magnitude);
        double difference = Math.Sqrt(Math.Pow((original.A - mirror.A).Magnitude, 2) + Math.Pow((original.E - mirror.E).Magnitude, 2)) / scale;
        const double bound = 1e-9;
        output.WriteLine($"f = {frequency}: relative difference {difference:E2}; reflected sky ({reflected.EclipticLatitudeRad:F4}, {reflected.EclipticLongitudeRad:F4})");
        Assert.True(difference < bound, $"difference {difference}");
        Assert.NotEqual(Source.EclipticLatitudeRad, reflected.EclipticLatitudeRad, 3);
    }

    [Fact]
    public void Reflecting_twice_returns_to_the_source()
    {
        // Up to the plane's rotation between t_c and t_c' (≤ 2e-4 rad), so 1e-3 rad and 1 ms after the shift back.
        var (once, _) = SkyReflection.Reflect(Source, Orbits);
        var (twice, _) = SkyReflection.Reflect(once, Orbits);
        Assert.Equal(Source.EclipticLatitudeRad, twice.EclipticLatitudeRad, 1e-3);
        Assert.Equal(Source.EclipticLongitudeRad, twice.EclipticLongitudeRad, 1e-3);
        Assert.Equal(Source.PolarisationRad, twice.PolarisationRad, 1e-3);
        Assert.Equal(Source.InclinationRad, twice.InclinationRad, 1e-12);
        Assert.Equal(Source.CoalescenceTimeS, twice.CoalescenceTimeS, 1.0);
    }

    [Fact]
    public void Jacobian_matches_finite_differences_of_the_map()
    {
        // Numerical 5×5 Jacobian over (β, λ, ι, ψ, t_c) by central differences (step 1e-6; truncation ~1e-12, rounding ~1e-9
        // relative on t_c shifts of ~500 s), against |J| = cos β / cos β', which neglects the t_c dependence of the plane and of
        // the centre (orbital speed over light speed, 1e-4): 3e-4 relative.
        var (reflected, logJacobian) = SkyReflection.Reflect(Source, Orbits);
        var jacobian = new double[5, 5];
        for (int j = 0; j < 5; j++)
        {
            var plus = Get(SkyReflection.Reflect(Shift(Source, j, 1e-6), Orbits).Reflected);
            var minus = Get(SkyReflection.Reflect(Shift(Source, j, -1e-6), Orbits).Reflected);
            for (int i = 0; i < 5; i++) jacobian[i, j] = (plus[i] - minus[i]) / 2e-6;
        }
        double determinant = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(jacobian).Determinant();
        output.WriteLine($"|det| {Math.Abs(determinant):F8}, formula {Math.Exp(logJacobian):F8}");
        Assert.Equal(Math.Exp(logJacobian), Math.Abs(determinant), 3e-4 * Math.Exp(logJacobian));
        Assert.Equal(Math.Cos(Source.EclipticLatitudeRad) / Math.Cos(reflected.EclipticLatitudeRad), Math.Exp(logJacobian), 1e-12);
    }

    private static double[] Get(MassiveBlackHoleBinaryParameters p) =>
        [p.EclipticLatitudeRad, p.EclipticLongitudeRad, p.InclinationRad, p.PolarisationRad, p.CoalescenceTimeS];

    private static MassiveBlackHoleBinaryParameters Shift(MassiveBlackHoleBinaryParameters p, int index, double step) => index switch
    {
        0 => p with { EclipticLatitudeRad = p.EclipticLatitudeRad + step },
        1 => p with { EclipticLongitudeRad = p.EclipticLongitudeRad + step },
        2 => p with { InclinationRad = p.InclinationRad + step },
        3 => p with { PolarisationRad = p.PolarisationRad + step },
        _ => p with { CoalescenceTimeS = p.CoalescenceTimeS + step },
    };

    /// <summary>A and E per unit h̃22 with the orbit frozen at t_c, times the arrival factor e^{−2πif t_c}.</summary>
    private static (Complex A, Complex E) Transfer(MassiveBlackHoleBinaryParameters p, double frequency)
    {
        var response = new MassiveBlackHoleBinaryResponse(Orbits);
        Span<Complex> a = stackalloc Complex[1], e = stackalloc Complex[1];
        response.Transfer([frequency], [Source.CoalescenceTimeS], new SkyPosition(p.EclipticLatitudeRad, p.EclipticLongitudeRad),
            p.PolarisationRad, p.InclinationRad, p.ReferencePhaseRad, a, e, Span<Complex>.Empty);
        var arrival = Complex.FromPolarCoordinates(1.0, -2 * Math.PI * frequency * p.CoalescenceTimeS);
        return (a[0] * arrival, e[0] * arrival);
    }
}
