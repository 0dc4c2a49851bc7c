using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public sealed class ResponseAndVoiceTests(ITestOutputHelper output)
{
    // The inspiral's strain at the Sun, in the frame of PolarisationBasis (ψ = 0), for the brute-force response.
    private sealed class KludgeStrain : IPlaneWaveStrain
    {
        private readonly KludgeSource _source;
        private readonly InspiralTrajectory _trajectory = new();
        private readonly PolarisationBasis _basis;
        private readonly double _start;

        public KludgeStrain(ExtremeMassRatioInspiralParameters p, double start, double duration)
        {
            _source = new KludgeSource(p);
            var state = new double[5];
            _source.InitialState(state);
            _trajectory.Evolve(_source.Equations, state, duration + 2000, 500);
            _basis = new PolarisationBasis(new SkyPosition(p.EclipticLatitudeRad, p.EclipticLongitudeRad), 0);
            _start = start;
        }

        public (double Plus, double Cross) At(double retardedTimeSeconds)
        {
            Span<double> state = stackalloc double[5];
            _trajectory.Evaluate(retardedTimeSeconds - _start, state, Span<double>.Empty);
            double y = 2 * Math.PI * _source.Equations.CentralMassSeconds * state[1];
            var h = (2 * _source.MassOverDistance * Math.Cbrt(y * y)) * ExtremeMassRatioInspiralDirectWaveform.Strain(_source, state).TransverseTraceless(_source.TowardsSource);
            double uhu = h.Quadratic(_basis.U), vhv = h.Quadratic(_basis.V);
            double uhv = 0.5 * (h.Quadratic(_basis.U + _basis.V) - uhu - vhv);
            return (0.5 * (uhu - vhv), uhv);
        }
    }

    [Fact]
    public void Direct_path_agrees_with_the_exact_link_response_at_millihertz_frequencies()
    {
        // Yardstick: SlowReferenceResponse (exact one-way links, explicit delays, first-generation Michelson TDI) on
        // the same strain. The long-wavelength pattern drops terms of order x = 2πfL/c ≈ 0.05–0.2 here, which change
        // the amplitude and phase per harmonic by a few per cent: the noise-weighted overlap must stay ≥ 0.99.
        var p = InspiralComparison.Source(0.3, nu0: 6e-4);
        double start = 1e6, cadence = 10, duration = 3 * 86400.0;
        int count = (int)(duration / cadence);
        var orbits = new RigidOrbits();
        var exact = SlowReferenceResponse.Compute(new KludgeStrain(p, start, duration), new SkyPosition(p.EclipticLatitudeRad, p.EclipticLongitudeRad), 0, orbits, start, cadence, count);
        var direct = new ExtremeMassRatioInspiralDirectWaveform(count, cadence, orbits, start);
        var (a, e) = direct.Spectra(p);
        var exactA = FourierTransform.Forward(exact.Aet.A).Values;
        var exactE = FourierTransform.Forward(exact.Aet.E).Values;
        double df = direct.FrequencyResolutionHz;
        int first = (int)(2e-4 / df), last = Math.Min(a.Length - 1, (int)(2e-2 / df));
        var window = new BinWindow(first, last - first + 1);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var psd = new double[window.Count];
        var wA = new double[window.Count];
        var wE = new double[window.Count];
        noise.FillPsd(AetChannel.A, first * df, df, psd);
        InnerProduct.InvertPsd(psd, wA);
        noise.FillPsd(AetChannel.E, first * df, df, psd);
        InnerProduct.InvertPsd(psd, wE);
        Complex[] Cut(Complex[] x) => x.AsSpan(first, window.Count).ToArray();
        Complex[][] mine = [Cut(a), Cut(e)], theirs = [Cut(exactA), Cut(exactE)];
        double[][] weights = [wA, wE];
        double overlap = Match.Overlap(mine, theirs, weights, df);
        double ratio = Math.Sqrt((InnerProduct.SquaredNorm(mine[0], wA, df) + InnerProduct.SquaredNorm(mine[1], wE, df))
                               / (InnerProduct.SquaredNorm(theirs[0], wA, df) + InnerProduct.SquaredNorm(theirs[1], wE, df)));
        output.WriteLine($"overlap {overlap:F5}, SNR ratio {ratio:F4}");
        Assert.True(overlap >= 0.99, $"overlap {overlap}");
        Assert.Equal(1.0, ratio, 0.03);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Voices_and_precession_sidebands_add_up_to_the_kepler_quadrupole(int seed)
    {
        // h/A = Re Σ_{n,s,k} c_{n,s} V_{s,k} e^{i(nΦ + 2sγ̃ + kα)} must equal the closed form 2 S^TT (S from
        // KeplerQuadrupole) for any elements: this checks the voice coefficients and the five-point split in α.
        var random = new Random(seed);
        var p = new ExtremeMassRatioInspiralParameters(1e6, 10, 0.6, 1e-3, 0.6 * random.NextDouble(), 3 * random.NextDouble(),
            random.NextDouble() - 0.5, 6 * random.NextDouble(), 3 * random.NextDouble(), 6 * random.NextDouble(), 1000, 0, 0, 0);
        var source = new KludgeSource(p);
        double phi = 7 * random.NextDouble(), gamma = 7 * random.NextDouble(), alpha = 7 * random.NextDouble();
        double[] state = [phi, 1e-3, gamma, p.Eccentricity0, alpha];
        var closed = 2.0 * ExtremeMassRatioInspiralDirectWaveform.Strain(source, state).TransverseTraceless(source.TowardsSource);
        var probe = new Vector3D(0.3, -0.7, 0.2);
        var probe2 = new Vector3D(-0.5, 0.1, 0.9);
        double sum1 = 0, sum2 = 0;
        var tensor1 = SymmetricTensor.Outer(probe, probe);
        var tensor2 = SymmetricTensor.Outer(probe, probe2);
        for (int n = 1; n <= 80; n++)
        {
            KludgeSource.VoiceCoefficients(n, p.Eccentricity0, out double plus, out double minus, out double radial);
            foreach (int s in new[] { 1, -1, 0 })
            {
                double c = s == 1 ? plus : s == -1 ? minus : radial;
                for (int k = -2; k <= 2; k++)
                {
                    var v = source.Sidebands[KludgeSource.VoiceIndex(s) * 5 + k + 2];
                    double psi = n * phi + 2 * s * gamma + k * alpha;
                    var rotation = new Complex(Math.Cos(psi), Math.Sin(psi));
                    sum1 += c * (tensor1.Contract(v) * rotation).Real;
                    sum2 += c * (tensor2.Contract(v) * rotation).Real;
                }
            }
        }
        // The harmonic tail beyond n = 80 is < 1e-7 at e ≤ 0.6.
        Assert.Equal(tensor1.Contract(closed), sum1, 1e-6);
        Assert.Equal(tensor2.Contract(closed), sum2, 1e-6);
    }
}
