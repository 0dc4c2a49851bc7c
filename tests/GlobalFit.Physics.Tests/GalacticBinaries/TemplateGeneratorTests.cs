using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class TemplateGeneratorTests(ITestOutputHelper output)
{
    private static readonly GalacticBinaryParameters Source = new(3e-3, 2e-17, 1e-21, 0.4, 1.9, 0.8, 0.6, 0.25);

    [Fact]
    public void Fast_template_reproduces_the_end_to_end_reference_band_power_and_peak()
    {
        // Source: derived: the independent brute-force values of EndToEndGalacticBinaryTests, sum of |X~_k|^2 over
        // bins q-32..q+31 = 3.126994e11 s^2 and peak |X~_k| (at bin q+2) = 2.233624e5 s; the same independent
        // computation put its own fast method within 1.5e-5 (band power) and 8.4e-5 of the peak. X = T/sqrt3 - A/sqrt2 +
        // E/sqrt6 inverts TdiCombination. Tolerances: 1e-4 relative on the band power and 2e-4 of the peak on the peak bin, a few times those
        // fast-method figures (the rigid-adiabatic model differs from the brute force at ~1e-4). Measured: printed.
        const double year = PhysicalConstants.JulianYearS;
        const int q = 63115;
        var orbits = new RigidOrbits(2.5e9, PhysicalConstants.AstronomicalUnitM, year, initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);
        var generator = new GalacticBinaryTemplateGenerator(year, 15.0, orbits);
        var source = new GalacticBinaryParameters(q / year, 0.0, 1.0, 0.4, 1.9, 0.8, 0.6, 0.25);
        var window = new BinWindow(q - 32, 64);
        var (a, e, t) = (new Complex[64], new Complex[64], new Complex[64]);
        generator.AddResponse(source, window, a, e, t);
        double bandPower = 0, peak = 0;
        int peakBin = -1;
        for (int k = 0; k < 64; k++)
        {
            Complex x = t[k] / Math.Sqrt(3.0) - a[k] / Math.Sqrt(2.0) + e[k] / Math.Sqrt(6.0);
            bandPower += x.Magnitude * x.Magnitude;
            if (x.Magnitude > peak) (peak, peakBin) = (x.Magnitude, window.First + k);
        }
        output.WriteLine($"band power {bandPower:E7} (rel {bandPower / 3.126994e11 - 1:E2}), peak {peak:E7} at q{peakBin - q:+0;-0} (rel {peak / 2.233624e5 - 1:E2})");
        Assert.Equal(q + 2, peakBin);
        Assert.Equal(3.126994e11, bandPower, 1e-4 * 3.126994e11);
        Assert.Equal(2.233624e5, peak, 2e-4 * 2.233624e5);
    }

    [Fact]
    public void Response_is_added_into_the_window_and_bins_outside_the_template_are_untouched()
    {
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 15.0);
        var bins = generator.TemplateBins(Source.FrequencyHz, Source.FrequencyDerivativeHzS);
        // A window that starts 5 bins before the template and stops 7 bins before its end.
        var window = new BinWindow(bins.First - 5, bins.Count - 2);
        var once = new[] { new Complex[window.Count], new Complex[window.Count], new Complex[window.Count] };
        generator.AddResponse(Source, window, once[0], once[1], once[2]);
        // Start from one copy, with a sentinel in the five bins below the template, and add once more: x + x = 2x is
        // exact in floating point, and the sentinel bins must come back unchanged.
        var twice = once.Select(channel => channel.ToArray()).ToArray();
        foreach (var channel in twice)
            for (int k = 0; k < 5; k++) channel[k] = new Complex(1, 1);
        generator.AddResponse(Source, window, twice[0], twice[1], twice[2]);
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < window.Count; k++)
            {
                Assert.Equal(k < 5 ? new Complex(1, 1) : 2.0 * once[c][k], twice[c][k]);
                if (k < 5) Assert.Equal(Complex.Zero, once[c][k]);
            }
        var view = generator.Render(Source);
        Assert.Equal(view.A[0], once[0][5]);
        Assert.Equal(view.T[window.End - 1 - view.FirstBin], once[2][window.Count - 1]);
    }

    [Fact]
    public void Full_template_is_the_basis_combination_with_the_amplitudes_P_and_Q()
    {
        // Derived (FStatisticAmplitudes, GalacticBinaryBasis): h = P u + Q v with P = a1 - i a3, Q = a2 - i a4; the
        // fast response is linear in H, so this holds to rounding (4e-16 relative in an independent check). Tolerance 1e-12 of the peak.
        var generator = new GalacticBinaryTemplateGenerator(PhysicalConstants.JulianYearS, 15.0);
        var basis = generator.CreateBasis();
        generator.FillBasis(Source.FrequencyHz, Source.FrequencyDerivativeHzS, Source.EclipticLatitudeRad, Source.EclipticLongitudeRad, basis);
        var amplitudes = FStatisticAmplitudes.FromExtrinsics(new GalacticBinaryExtrinsics(Source.Amplitude, Math.Cos(Source.InclinationRad), Source.PolarisationRad, Source.InitialPhaseRad));
        var view = generator.Render(Source);
        Assert.Equal(view.FirstBin, basis.FirstBin);
        double peak = 0, worst = 0;
        for (int k = 0; k < view.Count; k++)
        {
            peak = Math.Max(peak, view.A[k].Magnitude);
            worst = Math.Max(worst, (view.A[k] - (amplitudes.P * basis.PlusA[k] + amplitudes.Q * basis.CrossA[k])).Magnitude);
            worst = Math.Max(worst, (view.T[k] - (amplitudes.P * basis.PlusT[k] + amplitudes.Q * basis.CrossT[k])).Magnitude);
        }
        Assert.True(worst <= 1e-12 * peak, $"{worst / peak:E2}");
    }

    [Fact]
    public void Template_calls_allocate_nothing_after_construction()
    {
        var generator = new GalacticBinaryTemplateGenerator(PhysicalConstants.JulianYearS, 15.0);
        var window = generator.TemplateBins(Source.FrequencyHz, Source.FrequencyDerivativeHzS);
        var (a, e, t) = (new Complex[window.Count], new Complex[window.Count], new Complex[window.Count]);
        var inverse = Enumerable.Repeat(1e40, window.Count).ToArray();
        var band = new GalacticBinaryBand(window, generator.FrequencyResolutionHz, a, e, inverse, inverse, t, inverse);
        var statistic = new FStatistic(generator);
        var likelihood = new GalacticBinaryBandLikelihood(generator, band);
        var point = GalacticBinaryIntrinsics.Of(Source);
        generator.AddResponse(Source, window, a, e, t);
        statistic.Evaluate(point, band);
        likelihood.LogLikelihoodRatio(Source);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 50; i++)
        {
            generator.AddResponse(Source with { InitialPhaseRad = i }, window, a, e, t);
            statistic.Evaluate(point with { EclipticLongitudeRad = i }, band);
            likelihood.LogLikelihoodRatio(Source with { PolarisationRad = i });
        }
        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }

    [Fact]
    public void Envelope_length_follows_the_documented_rule()
    {
        // Rule: N = pow2ceil(2 (beta_D T/yr + |fdot| T^2 + 4 T/yr + 8)), beta_D = 2 pi f (1 au)/c, within [32, 4096].
        var rule = EnvelopeLengthRule.Default;
        double year = PhysicalConstants.SiderealYearS;
        Assert.Equal(32, rule.Length(1e-3, 0, year));   // 2 (3.14 + 4 + 8) = 30.3
        Assert.Equal(64, rule.Length(5e-3, 0, year));   // 2 (15.7 + 4 + 8) = 55.4
        Assert.Equal(128, rule.Length(1e-2, 0, year));  // 2 (31.4 + 4 + 8) = 86.7
        Assert.Equal(512, rule.Length(1e-2, 0, 4 * year)); // 2 (125.4 + 16 + 8) = 298.8
        Assert.Equal(4096, rule.Length(1e-2, 1e-11, year)); // drift of 1e4 bins: capped at the maximum
    }

    [Fact]
    public void Bad_arguments_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticBinaryTemplateGenerator(10.0, 15.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticBinaryTemplateGenerator(1e6, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new EnvelopeLengthRule(minimumLength: 48));
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 15.0);
        var window = new BinWindow(0, 8);
        Assert.Throws<ArgumentException>(() => generator.AddResponse(Source, window, new Complex[8], new Complex[7], Span<Complex>.Empty));
        Assert.Throws<ArgumentOutOfRangeException>(() => generator.Render(Source with { FrequencyHz = 0.05 }));
        Assert.Throws<ArgumentOutOfRangeException>(() => generator.Render(Source with { FrequencyHz = double.NaN }));
        Assert.Throws<ArgumentException>(() => generator.FillBasis(1e-3, 0, 0, 0, new GalacticBinaryBasis(16)));
    }
}
