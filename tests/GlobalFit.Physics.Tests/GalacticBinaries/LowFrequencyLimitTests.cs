using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class LowFrequencyLimitTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(0.4, 1.9, 0.8, 0.6, 0.25)]
    [InlineData(-1.0, 4.2, 2.0, 1.4, 3.0)]
    public void Fast_response_approaches_the_long_wavelength_form_at_a_tenth_of_a_millihertz(double beta, double lambda, double iota, double psi, double phi0)
    {
        // Source: long-wavelength limit (Cutler 1998, arXiv:gr-qc/9703068; derived: expand the link response to second
        // order in L/c): X_env,LW = 2 x^2 e^{-2ix} [(n12 n12 - n13 n13):H]
        // e^{i[Phi - 2 pi f_q t - 2 pi f k.x_1/c]}, Y and Z cyclic. An independent computation measured the A/E envelope difference at
        // 0.08 x rms (largest 0.09 x) and 1 - match ~1e-7 at 0.1 mHz, which suggests a tolerance of a few x on bin values
        // relative to the peak bin and of order x^2 on the mismatch. Asserted: largest bin difference <= 1 x of the
        // peak, 1 - overlap <= x^2. One Julian year with the orbit period equal to it and f0 on a bin, so both envelopes
        // are periodic and the plain N-point DFT is exact for the reference. Measured: printed.
        const double year = PhysicalConstants.JulianYearS;
        var orbits = new RigidOrbits(2.5e9, PhysicalConstants.AstronomicalUnitM, year, initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);
        var generator = new GalacticBinaryTemplateGenerator(year, 15.0, orbits);
        int q = 3156;
        var source = new GalacticBinaryParameters(q / year, 0.0, 1e-21, beta, lambda, iota, psi, phi0);
        double fStar = TransferFrequency.Hz(orbits.ArmLengthM), f = source.FrequencyHz, x = f / fStar;
        var view = generator.Render(source, includeT: false);
        int n = view.Count;
        var frame = new PolarisationBasis(new SkyPosition(beta, lambda), 0.0);
        var amplitudes = FStatisticAmplitudes.FromExtrinsics(new GalacticBinaryExtrinsics(source.Amplitude, Math.Cos(iota), psi, phi0));
        var (lwA, lwE) = (new Complex[n], new Complex[n]);
        for (int i = 0; i < n; i++)
        {
            double t = i * year / n;
            double phase = 2 * Math.PI * (f - q / year) * t;
            Complex Michelson(int corner)
            {
                int j = SpacecraftLabel.Next(corner), k = SpacecraftLabel.Next(j);
                var (pj, cj) = frame.LinkPattern(LinkGeometry.UnitVector(orbits, corner, j, t));
                var (pk, ck) = frame.LinkPattern(LinkGeometry.UnitVector(orbits, corner, k, t));
                Complex contraction = amplitudes.P * (pj - pk) + amplitudes.Q * (cj - ck);
                double delay = frame.K.Dot(orbits.Position(corner, t)) / PhysicalConstants.SpeedOfLightMS;
                return 2 * x * x * Complex.FromPolarCoordinates(1, -2 * x) * contraction * Complex.FromPolarCoordinates(1, phase - 2 * Math.PI * f * delay);
            }
            Complex xx = Michelson(1), yy = Michelson(2), zz = Michelson(3);
            lwA[i] = (zz - xx) / Math.Sqrt(2);
            lwE[i] = (xx - 2 * yy + zz) / Math.Sqrt(6);
        }
        double worst = 0, peak = 0;
        var bins = new[] { new Complex[n], new Complex[n] };
        int c = 0;
        foreach (var envelope in new[] { lwA, lwE })
        {
            FftPlan.ForLength(n).Forward(envelope);
            for (int j = 0; j < n; j++) bins[c][j] = year / (2.0 * n) * envelope[(j + n / 2) % n];
            c++;
        }
        for (int j = 0; j < n; j++)
        {
            peak = Math.Max(peak, Math.Max(view.A[j].Magnitude, view.E[j].Magnitude));
            worst = Math.Max(worst, Math.Max((view.A[j] - bins[0][j]).Magnitude, (view.E[j] - bins[1][j]).Magnitude));
        }
        var weights = new[] { Enumerable.Repeat(1.0, n).ToArray(), Enumerable.Repeat(1.0, n).ToArray() };
        double overlap = Match.Overlap([view.A.ToArray(), view.E.ToArray()], bins, weights, 1.0 / year);
        output.WriteLine($"x = {x:E3}: largest bin difference {worst / peak / x:F3} x of the peak; 1 - overlap = {1 - overlap:E2} ({(1 - overlap) / (x * x):F4} x^2)");
        Assert.True(worst <= x * peak, $"{worst / peak / x:F3} x");
        Assert.True(1 - overlap <= x * x, $"1 - overlap = {1 - overlap:E2}");
    }
}
