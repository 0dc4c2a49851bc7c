using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class ResponseAccuracyTests(ITestOutputHelper output)
{
    private const double Cadence = 5.0;       // Nyquist 0.1 Hz, above the 0.2/M ≈ 40 mHz cut-off of a 1e6 M_sun binary
    private const int Count = 1 << 19;        // 30.3 days
    private const int Oversampling = 2;       // strain for the slow response sampled at 2.5 s, then interpolated

    private static readonly MassiveBlackHoleBinaryParameters Source = new(
        ChirpMassMsun: BinaryMasses.FromComponents(6.5e5, 3.5e5).ChirpMass, MassRatio: 6.5 / 3.5, Spin1: 0.6, Spin2: -0.2,
        CoalescenceTimeS: 27.0 * 86400.0, DistanceMpc: 3.0e4, EclipticLatitudeRad: 0.4, EclipticLongitudeRad: 2.1,
        InclinationRad: 0.9, PolarisationRad: 0.7, ReferencePhaseRad: 1.2);

    [Fact]
    public void Fast_response_matches_the_slow_time_domain_reference_over_the_last_month()
    {
        // A 1e6 M_sun binary merging 27 days into a 30.3-day record (rigid orbits): the last month of inspiral, merger and
        // ringdown. Slow path: polarisations by inverse FFT of the IMRPhenomD (2,2) mode, exact link response with explicit
        // delays (SlowReferenceResponse), FFT. Fast path: MassiveBlackHoleBinaryTemplateGenerator on the same bins. Both use
        // the same frequency-domain taper that switches the signal on between t(f) = 1 and 3 days, so the record holds the
        // whole signal. Target: match (and plain overlap) ≥ 0.99 with the instrument's A, E, T noise weights.
        var orbits = new RigidOrbits(initialOrbitalPhaseRad: 0.3, initialOrientationRad: 1.1);
        double duration = Count * Cadence;
        double df = 1.0 / duration;
        int bins = Count / 2 + 1;

        // Tapered (2,2) mode on the fine grid used for the polarisations.
        int fineCount = Count * Oversampling;
        int fineBins = fineCount / 2 + 1;
        var waveform = MassiveBlackHoleBinaryTemplateGenerator.Waveform(Source);
        var frequencies = new double[fineBins - 1];
        for (int k = 1; k < fineBins; k++) frequencies[k - 1] = k * df;
        var amplitude = new double[frequencies.Length];
        var phase = new double[frequencies.Length];
        var time = new double[frequencies.Length];
        waveform.Evaluate(frequencies, amplitude, phase, time);
        var (kPlus, kCross) = MassiveBlackHoleBinaryResponse.PolarisationFactors(Source.InclinationRad, Source.ReferencePhaseRad);
        var plusSpectrum = new Complex[fineBins];
        var crossSpectrum = new Complex[fineBins];
        var taper = new double[fineBins];
        for (int k = 1; k < fineBins; k++)
        {
            taper[k] = Taper(time[k - 1], 86400.0, 3 * 86400.0);
            var h22 = Complex.FromPolarCoordinates(amplitude[k - 1] * taper[k], -phase[k - 1]);
            plusSpectrum[k] = kPlus * h22;
            crossSpectrum[k] = kCross * h22;
        }
        double fineDt = Cadence / Oversampling;
        var plus = new double[fineCount];
        var cross = new double[fineCount];
        FourierTransform.Inverse(plusSpectrum, fineDt, plus);
        FourierTransform.Inverse(crossSpectrum, fineDt, cross);

        var started = DateTime.UtcNow;
        var slow = SlowReferenceResponse.Compute(new SampledStrain(plus, cross, fineDt),
            new SkyPosition(Source.EclipticLatitudeRad, Source.EclipticLongitudeRad), Source.PolarisationRad, orbits, 0.0, Cadence, Count);
        double slowSeconds = (DateTime.UtcNow - started).TotalSeconds;
        var reference = slow.Aet.Channels.Select(channel => FourierTransform.Forward(channel).Values).ToArray();

        var generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, bins);
        var fast = new[] { new Complex[bins], new Complex[bins], new Complex[bins] };
        started = DateTime.UtcNow;
        generator.RenderBins(Source, new BinWindow(0, bins), df, fast[0], fast[1], fast[2]);
        double fastSeconds = (DateTime.UtcNow - started).TotalSeconds;
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < bins; k++) fast[c][k] *= taper[k];

        var inverse = InversePsd(bins, df);
        double overlap = Match.Overlap(fast, reference, inverse, df);
        double match = Match.MaximisedOverTimeAndPhase(fast, reference, inverse, df);
        double snr = Math.Sqrt(Enumerable.Range(0, 3).Sum(c => InnerProduct.SquaredNorm(reference[c], inverse[c], df)));
        output.WriteLine($"1 - overlap {1 - overlap:E2}, 1 - match {1 - match:E2}, reference SNR {snr:F1}; slow {slowSeconds:F1} s, fast {fastSeconds:F2} s");

        // Teeth: the same template with the constellation frozen at its position at t_c (no orbital motion) is measurably
        // worse, so the agreement above depends on evaluating the orbit at t(f).
        var frozen = new MassiveBlackHoleBinaryTemplateGenerator(new FrozenOrbits(orbits, Source.CoalescenceTimeS), bins);
        var still = new[] { new Complex[bins], new Complex[bins], new Complex[bins] };
        frozen.RenderBins(Source, new BinWindow(0, bins), df, still[0], still[1], still[2]);
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < bins; k++) still[c][k] *= taper[k];
        double frozenOverlap = Match.Overlap(still, reference, inverse, df);
        output.WriteLine($"frozen-orbit template: 1 - overlap {1 - frozenOverlap:E2}");
        Assert.True(1 - frozenOverlap > 10 * (1 - overlap), $"frozen {frozenOverlap} vs moving {overlap}");
        Assert.True(overlap >= 0.99, $"overlap {overlap}");
        Assert.True(match >= 0.99, $"match {match}");
    }

    /// <summary>The orbits held at one instant.</summary>
    private sealed class FrozenOrbits(IConstellationOrbits inner, double atSeconds) : IConstellationOrbits
    {
        public double ArmLengthM => inner.ArmLengthM;

        public double PeriodSeconds => inner.PeriodSeconds;

        public Vector3D Position(int spacecraft, double timeSeconds) => inner.Position(spacecraft, atSeconds);

        public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds) =>
            inner.LightTimeSeconds(receiver, sender, atSeconds);
    }

    /// <summary>Smooth switch-on in time: 0 before <paramref name="start"/>, 1 after <paramref name="end"/>, cos² between.</summary>
    private static double Taper(double t, double start, double end)
    {
        if (t <= start) return 0;
        if (t >= end) return 1;
        double s = Math.Sin(0.5 * Math.PI * (t - start) / (end - start));
        return s * s;
    }

    private static double[][] InversePsd(int bins, double df)
    {
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var result = new double[3][];
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            var psd = new double[bins - 1];
            noise.FillPsd(channels[c], df, df, psd);
            result[c] = new double[bins];
            InnerProduct.InvertPsd(psd, result[c].AsSpan(1));
        }
        return result;
    }
}
