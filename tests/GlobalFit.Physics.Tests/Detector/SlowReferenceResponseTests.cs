using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using Xunit;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class SlowReferenceResponseTests(ITestOutputHelper output)
{
    private const double ArmM = 2.5e9;
    private const double C = PhysicalConstants.SpeedOfLightMS;
    private static readonly double TransferFrequencyHz = TransferFrequency.Hz(ArmM);
    private static readonly RigidOrbits Rigid = new(armLengthM: ArmM, initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);

    private static MonochromaticBinaryStrain Binary(double frequencyHz) =>
        new(frequencyHz, frequencyDerivativeHzS: 0.0, amplitude: 1e-21, inclinationRad: 0.8, polarisationRad: 0.6,
            initialPhaseRad: 0.25, sky: new SkyPosition(0.4, 1.9));

    [Theory]
    [InlineData(1e-4)]
    [InlineData(5e-5)]
    public void Michelson_X_approaches_the_long_wavelength_form_at_low_frequency(double frequencyHz)
    {
        // Source: long-wavelength limit (Cutler 1998, arXiv:gr-qc/9703068; derived: expand the two-point formula to
        // second order in L/c): X(t) ~ -2 (L/c)^2 d^2/dt^2 [(n12 n12 - n13 n13) : h(t - 2L/c, x_1)], which for a
        // monochromatic wave is 2 x^2 [(n12 n12 - n13 n13) : h]; the full response differs at relative order x
        // (derived: amplitude ratio - 1 = 1.7e-3 at 0.1 mHz for one geometry). Tolerance 3x on the largest sample difference relative to
        // the largest |X_LW| (x = 5.2e-3 at 0.1 mHz). Measured: 0.12x at 0.1 mHz, 0.41x at 0.05 mHz. The second grows
        // because the moving arms add a relative term ~ (Omega 2L/c)/x ~ 3e-6/x that the static form leaves out: the
        // arms turn by Omega 2L/c = 3e-6 rad during a round trip (Omega = 2 pi/yr), which (1 - D^2) does not cancel.
        var source = Binary(frequencyHz);
        double x = frequencyHz / TransferFrequencyHz;
        double period = 1.0 / frequencyHz, dt = period / 100.0, t0 = 2.0e6;
        var response = SlowReferenceResponse.Compute(source, Rigid, t0, dt, 200);
        var basis = source.Basis;
        double worst = 0, peak = 0;
        for (int n = 0; n < response.X.Count; n++)
        {
            double t = response.X.TimeOf(n);
            var n12 = LinkGeometry.UnitVector(Rigid, 1, 2, t);
            var n13 = LinkGeometry.UnitVector(Rigid, 1, 3, t);
            var (plus12, cross12) = basis.LinkPattern(n12);
            var (plus13, cross13) = basis.LinkPattern(n13);
            double retarded = t - 2.0 * ArmM / C - basis.K.Dot(Rigid.Position(1, t)) / C;
            var (hPlus, hCross) = source.At(retarded);
            double longWavelength = 2.0 * x * x * ((plus12 - plus13) * hPlus + (cross12 - cross13) * hCross);
            worst = Math.Max(worst, Math.Abs(response.X.Samples[n] - longWavelength));
            peak = Math.Max(peak, Math.Abs(longWavelength));
        }
        output.WriteLine($"f={frequencyHz}: x={x:E3}, max|X - X_LW|/max|X_LW| = {worst / peak:E3} = {worst / peak / x:F3} x");
        Assert.True(worst <= 3.0 * x * peak, $"difference {worst / peak:E3} of the peak, x = {x:E3}");
    }

    [Fact]
    public void Wave_along_the_constellation_normal_sees_a_sixty_degree_Michelson()
    {
        // Source: Cutler 1998, PRD 57, 7089 (arXiv:gr-qc/9703068; the exact form from memory): the long-wavelength
        // response of a 60-degree Michelson carries sin 60 deg = sqrt(3)/2 relative to a 90-degree one; derived
        // (previous test's limit): |X| = 4 x^2 |h_M|. A circularly polarised unit wave (h+ = cos, hx = sin) along the plane normal gives
        // |h_M| = sqrt(3)/2 for every psi, so |X| = 2 sqrt(3) x^2. Tolerance 3x relative (order-x corrections, as above).
        // Measured -4.8e-4 and -2.3e-4 (x = 5.2e-3).
        double frequencyHz = 1e-4, x = frequencyHz / TransferFrequencyHz, t0 = 5.0e6;
        var (p1, p2, p3) = (Rigid.Position(1, t0), Rigid.Position(2, t0), Rigid.Position(3, t0));
        var towardsSource = (p2 - p1).Cross(p3 - p1).Normalized();
        var sky = new SkyPosition(Math.Asin(towardsSource.Z), Math.Atan2(towardsSource.Y, towardsSource.X));
        var strain = new FunctionStrain(t => Math.Cos(2.0 * Math.PI * frequencyHz * t), t => Math.Sin(2.0 * Math.PI * frequencyHz * t));
        foreach (double psi in new[] { 0.0, 1.0 })
        {
            var response = SlowReferenceResponse.Compute(strain, sky, psi, Rigid, t0, 1.0 / (64 * frequencyHz), 64);
            double amplitude = Math.Sqrt(SinusoidPower.SquaredAmplitude(response.X, frequencyHz));
            output.WriteLine($"psi={psi}: |X|/(2 sqrt3 x^2) - 1 = {amplitude / (2 * Math.Sqrt(3) * x * x) - 1:E3} (x = {x:E3})");
            Assert.Equal(2.0 * Math.Sqrt(3.0) * x * x, amplitude, 3.0 * x * 2.0 * Math.Sqrt(3.0) * x * x);
        }
    }

    [Theory]
    [InlineData(1e-3)]
    [InlineData(1e-2)]
    [InlineData(5e-2)]
    public void Each_link_matches_the_static_midpoint_sinc_form(double frequencyHz)
    {
        // Source: monochromatic "midpoint/sinc" form of the Estabrook & Wahlquist 1975 two-point formula (derived:
        // referred to the arm midpoint, checked to 1e-13 for static spacecraft):
        // y_ij = Re{-i a (n.H.n) sinc[a(1 - k.n)] exp(i[Phi(t) - 2 pi f k.x_mid/c - a])}, a = pi f L/c,
        // H = A+ eps+ - i Ax epsx. The two differ only by the spacecraft motion during one light time (v/c ~ 1e-4 of
        // the link, phase 2 pi f v L/c^2 <= 1.3e-4 rad at 50 mHz), so tolerance 5e-4 of the peak link amplitude
        // (v/c = 9.9e-5 times a geometric factor of a few). Measured 1.5e-4 (1 and 10 mHz), 1.9e-4 (50 mHz).
        var source = Binary(frequencyHz);
        var links = new PlaneWaveLinks(source, source.Basis, Rigid);
        var basis = source.Basis;
        double a = Math.PI * frequencyHz * ArmM / C;
        double aPlus = 1e-21 * (1 + Math.Cos(0.8) * Math.Cos(0.8)), aCross = 2e-21 * Math.Cos(0.8);
        double worst = 0, peak = 0;
        for (int n = 0; n < 40; n++)
        {
            double t = 3.0e6 + n * 0.37 / frequencyHz;
            foreach (var (i, j) in new[] { (1, 2), (2, 1), (2, 3), (3, 2), (3, 1), (1, 3) })
            {
                var unit = LinkGeometry.UnitVector(Rigid, i, j, t);
                var mid = LinkGeometry.Midpoint(Rigid, i, j, t);
                var (ePlus, eCross) = basis.LinkPattern(unit);
                double z = a * (1.0 - basis.K.Dot(unit));
                double sinc = Math.Sin(z) / z;
                double phase = source.PhaseRad(t) - 2.0 * Math.PI * frequencyHz * basis.K.Dot(mid) / C - a;
                // Re{-i a (P - iQ) sinc e^{i phase}} with P = A+ e+, Q = Ax ex: = a sinc (P sin phase - Q cos phase).
                double expected = a * sinc * (aPlus * ePlus * Math.Sin(phase) - aCross * eCross * Math.Cos(phase));
                worst = Math.Max(worst, Math.Abs(links.Measurement(i, j, t) - expected));
                peak = Math.Max(peak, Math.Abs(expected));
            }
        }
        output.WriteLine($"f={frequencyHz}: max link difference / peak = {worst / peak:E3}");
        Assert.True(worst <= 5e-4 * peak, $"difference {worst / peak:E3} of the peak");
    }

    [Fact]
    public void Flexing_orbits_give_the_same_low_frequency_response_to_within_the_flexing()
    {
        // Source: Dhurandhar et al. 2005 (arXiv:gr-qc/0410093): eccentric orbits flex by ~0.24 % of L each way
        // (EccentricOrbitsTests) and keep the same 60-degree geometry to first order in e; at low frequency X scales
        // as L^2 (the long-wavelength limit above), so X from eccentric orbits must agree with the
        // long-wavelength amplitude 2 sqrt(3) x^2 of a normal-incidence circular wave to 1 % (flexing 0.5 % + 3x).
        // Measured -6.2e-4.
        var eccentric = new EccentricOrbits(armLengthM: ArmM, initialOrbitalPhaseRad: 0.3);
        double frequencyHz = 1e-4, x = frequencyHz / TransferFrequencyHz, t0 = 5.0e6;
        var (p1, p2, p3) = (eccentric.Position(1, t0), eccentric.Position(2, t0), eccentric.Position(3, t0));
        var towardsSource = (p2 - p1).Cross(p3 - p1).Normalized();
        var sky = new SkyPosition(Math.Asin(towardsSource.Z), Math.Atan2(towardsSource.Y, towardsSource.X));
        var strain = new FunctionStrain(t => Math.Cos(2.0 * Math.PI * frequencyHz * t), t => Math.Sin(2.0 * Math.PI * frequencyHz * t));
        var response = SlowReferenceResponse.Compute(strain, sky, 0.3, eccentric, t0, 1.0 / (64 * frequencyHz), 64);
        double amplitude = Math.Sqrt(SinusoidPower.SquaredAmplitude(response.X, frequencyHz));
        output.WriteLine($"eccentric: |X|/(2 sqrt3 x^2) - 1 = {amplitude / (2 * Math.Sqrt(3) * x * x) - 1:E3}");
        Assert.Equal(2.0 * Math.Sqrt(3.0) * x * x, amplitude, 0.01 * 2.0 * Math.Sqrt(3.0) * x * x);
    }

    [Fact]
    public void Result_carries_the_requested_time_axis_and_consistent_A_E_T()
    {
        // Source: A/E/T coefficients of TdiCombination (Prince et al. 2002 pattern); identity check at rounding
        // level (1e-14 of the largest |X|).
        var response = SlowReferenceResponse.Compute(Binary(3e-3), Rigid, 100.0, 5.0, 50);
        double scale = response.X.Samples.Max(Math.Abs);
        Assert.True(scale > 0);
        foreach (var series in new[] { response.X, response.Y, response.Z, response.Aet.A, response.Aet.E, response.Aet.T })
        {
            Assert.Equal(100.0, series.T0Seconds);
            Assert.Equal(5.0, series.DtSeconds);
            Assert.Equal(50, series.Count);
            Assert.Equal(-1, series.IndexOfFirstNonFinite());
        }
        for (int n = 0; n < 50; n++)
        {
            double x = response.X.Samples[n], y = response.Y.Samples[n], z = response.Z.Samples[n];
            Assert.Equal((z - x) / Math.Sqrt(2.0), response.Aet.A.Samples[n], 1e-14 * scale);
            Assert.Equal((x + y + z) / Math.Sqrt(3.0), response.Aet.T.Samples[n], 1e-14 * scale);
        }
    }

    [Fact]
    public void Bad_sampling_arguments_are_rejected()
    {
        var source = Binary(1e-3);
        Assert.Throws<ArgumentOutOfRangeException>(() => SlowReferenceResponse.Compute(source, Rigid, 0.0, 0.0, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlowReferenceResponse.Compute(source, Rigid, 0.0, double.NaN, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlowReferenceResponse.Compute(source, Rigid, double.PositiveInfinity, 5.0, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlowReferenceResponse.Compute(source, Rigid, 0.0, 5.0, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlowReferenceResponse.Compute(source, source.Sky, double.NaN, Rigid, 0.0, 5.0, 10));
        Assert.Throws<ArgumentNullException>(() => SlowReferenceResponse.Compute(source, null!, 0.0, 5.0, 10));
    }
}
