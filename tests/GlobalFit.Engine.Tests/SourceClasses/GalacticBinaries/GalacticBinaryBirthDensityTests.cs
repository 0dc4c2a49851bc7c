using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryBirthDensityTests
{
    private static (BandTestData Data, GalacticBinaryBirthDensity Birth, GalacticBinaryBand Band, double Scale, GalacticBinaryParameters Truth) Setup()
    {
        var window = new BinWindow(7776, 96);
        var truthShape = new GalacticBinaryParameters((7776 + 40.4) / (30 * 86400.0), 0, 1e-22, 0.4, 2.5, 0.7, 0.9, 1.9);
        var truth = new BandTestData(30, window, [], 1, noise: false).WithSnr(truthShape, 30);
        var data = new BandTestData(30, window, [truth], 4);
        var band = data.Residual(window);
        double scale = GalacticBinaryBandModel.AverageSnrPerUnitAmplitude(data.Generator, band, truth.FrequencyHz);
        var grid = FStatisticGrid.ForWindow(new BinWindow(7776 + 20, 40), data.DfHz, 1, -1e-16, 1e-15, 1, 4, 8);
        var map = new FStatisticCellDensity(FStatisticMap.Compute(new FStatistic(data.Generator), band, grid), 0.1);
        return (data, new GalacticBinaryBirthDensity(new FStatistic(data.Generator), band, map, scale), band, scale, truth);
    }

    private static double[] Vector(in GalacticBinaryParameters source, double scale)
    {
        var values = new double[GalacticBinarySourceVector.Dimension];
        GalacticBinarySourceVector.FromParameters(source, scale, values);
        return values;
    }

    // Derived: d⁴x = 4A³(1 − cos²ι)³ dA d(cos ι) dψ dφ0, in GalacticBinaryBirthDensity's remarks; checked against the
    // determinant of a central-difference Jacobian of FStatisticAmplitudes.FromExtrinsics (step 1e-6 relative, so the
    // truncation error is ~1e-12 and round-off ~1e-10 relative; tolerance 1e-6 relative).
    [Theory]
    [InlineData(1.0, 0.3, 0.4, 1.0)]
    [InlineData(2.5, -0.8, 2.0, 5.0)]
    [InlineData(0.3, 0.05, 1.3, 3.3)]
    public void The_amplitude_jacobian_matches_finite_differences(double amplitude, double cosIota, double psi, double phi)
    {
        double[] point = [amplitude, cosIota, psi, phi];
        var jacobian = new double[16];
        for (int j = 0; j < 4; j++)
        {
            double h = 1e-6 * Math.Max(1.0, Math.Abs(point[j]));
            var plus = (double[])point.Clone();
            var minus = (double[])point.Clone();
            plus[j] += h;
            minus[j] -= h;
            var up = Components(plus);
            var down = Components(minus);
            for (int i = 0; i < 4; i++) jacobian[i * 4 + j] = (up[i] - down[i]) / (2 * h);
        }
        double expected = Math.Exp(GalacticBinaryBirthDensity.LogAmplitudeJacobian(amplitude, cosIota));
        Assert.Equal(expected, Math.Abs(Determinant(jacobian)), expected * 1e-6);
    }

    // The log density a draw reports must be the density LogDensity gives the drawn point (a death move scores the
    // source with LogDensity; a mismatch would bias the source count). Tolerance: the two paths differ only by the
    // round trips sin/asin and ToExtrinsics/FromExtrinsics, ~1e-12 relative on values of order 100.
    [Fact]
    public void A_draw_reports_the_density_of_the_point_it_drew()
    {
        var (_, birth, _, _, _) = Setup();
        var random = RandomStream.ForPath(3, 1, 2);
        var source = new double[GalacticBinarySourceVector.Dimension];
        int checkedDraws = 0;
        for (int n = 0; n < 50; n++)
        {
            double reported = birth.Draw(source, ref random);
            if (!double.IsFinite(reported)) continue;
            Assert.Equal(reported, birth.LogDensity(source), 1e-7);
            checkedDraws++;
        }
        Assert.True(checkedDraws > 40);
    }

    // For fixed intrinsics the amplitude part is the likelihood's own Gaussian: ln b differs between two amplitude sets
    // by Δ ln L (Physics band likelihood, GalacticBinaryBandLikelihood) plus the Jacobian difference.
    // Tolerance 1e-6 of the ln L scale (~450 at SNR 30): the F-statistic basis and the rendered template agree to round-off.
    [Fact]
    public void The_amplitude_density_has_the_shape_of_the_likelihood()
    {
        var (data, birth, band, scale, truth) = Setup();
        var likelihood = new GalacticBinaryBandLikelihood(data.Generator, band);
        var other = truth with { Amplitude = truth.Amplitude * 0.8, InclinationRad = 0.9, PolarisationRad = 1.0, InitialPhaseRad = 2.2 };
        double expected = likelihood.LogLikelihoodRatio(truth) - likelihood.LogLikelihoodRatio(other)
            + GalacticBinaryBirthDensity.LogAmplitudeJacobian(truth.Amplitude, Math.Cos(truth.InclinationRad))
            - GalacticBinaryBirthDensity.LogAmplitudeJacobian(other.Amplitude, Math.Cos(other.InclinationRad));
        double actual = birth.LogDensity(Vector(truth, scale)) - birth.LogDensity(Vector(other, scale));
        Assert.Equal(expected, actual, 1e-6 * 450);
    }

    [Fact]
    public void A_source_outside_the_map_has_zero_density()
    {
        var (_, birth, _, scale, truth) = Setup();
        Assert.Equal(double.NegativeInfinity, birth.LogDensity(Vector(truth with { FrequencyHz = truth.FrequencyHz + 30 * (1 / (30 * 86400.0)) }, scale)));
    }

    private static double[] Components(double[] p)
    {
        var a = FStatisticAmplitudes.FromExtrinsics(new GalacticBinaryExtrinsics(p[0], p[1], p[2], p[3]));
        return [a.P.Real, a.P.Imaginary, a.Q.Real, a.Q.Imaginary];
    }

    private static double Determinant(double[] m)
    {
        // Laplace expansion along the first row of a 4 × 4 matrix.
        double det = 0;
        for (int c = 0; c < 4; c++)
        {
            var minor = new double[9];
            int k = 0;
            for (int r = 1; r < 4; r++)
                for (int cc = 0; cc < 4; cc++)
                    if (cc != c) minor[k++] = m[r * 4 + cc];
            double d3 = minor[0] * (minor[4] * minor[8] - minor[5] * minor[7]) - minor[1] * (minor[3] * minor[8] - minor[5] * minor[6])
                + minor[2] * (minor[3] * minor[7] - minor[4] * minor[6]);
            det += (c % 2 == 0 ? 1 : -1) * m[c] * d3;
        }
        return det;
    }
}
