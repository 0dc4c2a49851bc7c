using System.Numerics;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public class PriorSnrLikelihoodTests
{
    private static readonly ExtremeMassRatioInspiralPrior Prior = new();

    [Fact]
    public void Prior_draws_lie_in_the_support_and_follow_their_shapes()
    {
        var random = new Random(5);
        var u = new double[ExtremeMassRatioInspiralPrior.UniformsPerDraw];
        int retrograde = 0, draws = 4000;
        double sumLogM = 0;
        for (int i = 0; i < draws; i++)
        {
            for (int j = 0; j < u.Length; j++) u[j] = random.NextDouble();
            var p = Prior.Draw(u);
            p.Validate();
            Assert.True(double.IsFinite(Prior.LogDensity(p)), $"draw {i} outside the support: {p}");
            if (p.OrbitInclinationRad > Math.PI / 2) retrograde++;
            sumLogM += Math.Log10(p.CentralMassMsun);
        }
        // Isotropic λ: half retrograde; binomial sd √(N/4) = 32, a 5-sd band (false-failure rate ~6e-7).
        Assert.InRange(retrograde, draws / 2 - 160, draws / 2 + 160);
        // log10 M uniform on [5, 7]: mean 6, sd of the mean 0.577/√4000 = 0.0091; 5 sd.
        Assert.Equal(6.0, sumLogM / draws, 0.046);
    }

    [Fact]
    public void Frequency_factor_of_the_prior_is_normalised_below_the_plunge()
    {
        // For fixed M and e0 the conditional density of ν0 is 1/(ν ln(ν_hi/ν_min)) with ν_hi = (1 − 1e-3) ν_p(e0):
        // then ∫ exp(LogDensity(ν) − LogDensity(ν_ref)) dν = ν_ref ln(ν_hi/ν_min), whatever the other factors are.
        var p = new ExtremeMassRatioInspiralParameters(3e6, 10, 0.5, 3e-4, 0.3, 1.0, 0.2, 1.0, 1.0, 1.0, 1000, 1, 1, 1);
        double nuHigh = (1 - 1e-3) * PlungeFrequency(3e6, 0.3);
        Assert.True(nuHigh < Prior.MaxFrequencyHz, "the plunge must truncate the range in this test");
        double low = Prior.MinFrequencyHz, high = 1e-2;
        int steps = 400_000;
        double du = Math.Log(high / low) / steps, integral = 0;
        double reference = Prior.LogDensity(p);
        for (int i = 0; i < steps; i++)
        {
            double nu = low * Math.Exp((i + 0.5) * du);
            double logDensity = Prior.LogDensity(p with { OrbitalFrequency0Hz = nu });
            if (double.IsFinite(logDensity)) integral += Math.Exp(logDensity - reference) * nu * du;
        }
        double expected = p.OrbitalFrequency0Hz * Math.Log(nuHigh / low);
        // Midpoint rule in log ν with a hard edge at ν_hi: relative error ≤ one step over the range, ~2e-5.
        Assert.Equal(expected, integral, 1e-4 * expected);
    }

    private static double PlungeFrequency(double massMsun, double e) =>
        new KludgeOrbitEquations(massMsun * GlobalFit.Physics.Constants.PhysicalConstants.SolarMassSeconds, 1e-5, 0, 1).PlungeFrequency(e);

    [Fact]
    public void Prior_rejects_values_outside_its_bounds()
    {
        var p = new ExtremeMassRatioInspiralParameters(1e6, 10, 0.5, 1e-3, 0.3, 1.0, 0.2, 1.0, 1.0, 1.0, 1000, 1, 1, 1);
        Assert.True(double.IsFinite(Prior.LogDensity(p)));
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { CentralMassMsun = 5e7 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { Eccentricity0 = 0.7 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { OrbitalFrequency0Hz = 3e-3 }));  // past the plunge at M = 1e6
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { DistanceMpc = 50 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { SpinThetaRad = -0.1 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogDensity(p with { Phi0Rad = double.NaN }));
        Assert.Throws<ArgumentException>(() => Prior.Draw(new double[3]));
        Assert.Throws<ArgumentOutOfRangeException>(() => new ExtremeMassRatioInspiralPrior(maxSpin: 1.0));
    }

    [Fact]
    public void Parameter_validation_names_the_offending_column()
    {
        var p = InspiralComparison.Source(0.2);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => (p with { Eccentricity0 = 1.2 }).Validate());
        Assert.Equal(ExtremeMassRatioInspiralParameters.EccentricityColumn, ex.ParamName);
        ex = Assert.Throws<ArgumentOutOfRangeException>(() => (p with { CompactMassMsun = 2e6 }).Validate());
        Assert.Equal(ExtremeMassRatioInspiralParameters.CompactMassColumn, ex.ParamName);
        Assert.Equal(14, ExtremeMassRatioInspiralParameters.ColumnNames.Length);
        Assert.Equal(p, ExtremeMassRatioInspiralParameters.FromSpan(p.ToArray()));
    }

    [Fact]
    public void Optimal_snr_scales_inversely_with_distance_and_agrees_with_the_direct_path()
    {
        double duration = 30 * 86400.0, cadence = 10;
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var p = InspiralComparison.Source(0.3);
        double snr = ExtremeMassRatioInspiralSnr.Optimal(generator, p, noise);
        double far = ExtremeMassRatioInspiralSnr.Optimal(generator, p with { DistanceMpc = 2 * p.DistanceMpc }, noise);
        Assert.Equal(snr / 2, far, snr * 1e-12);
        var direct = new ExtremeMassRatioInspiralDirectWaveform(generator.SampleCount, cadence);
        var (_, _, _, snrDirect) = InspiralComparison.Compare(generator, direct, p);
        // The month-long match is 0.998 and the SNRs agreed to 0.2 % in the accuracy tests: 1 %.
        Assert.Equal(snrDirect, snr, 0.01 * snrDirect);
    }

    [Fact]
    public void Log_likelihood_ratio_of_noiseless_data_peaks_at_half_the_squared_snr()
    {
        double duration = 30 * 86400.0, cadence = 10;
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var p = InspiralComparison.Source(0.2);
        var window = generator.TemplateBins(p);
        var dataA = new Complex[window.Count];
        var dataE = new Complex[window.Count];
        generator.AddResponse(p, window, dataA, dataE, Span<Complex>.Empty);
        double df = generator.FrequencyResolutionHz;
        var psd = new double[window.Count];
        var inverseA = new double[window.Count];
        var inverseE = new double[window.Count];
        noise.FillPsd(AetChannel.A, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseA);
        noise.FillPsd(AetChannel.E, window.First * df, df, psd);
        InnerProduct.InvertPsd(psd, inverseE);
        var likelihood = new ExtremeMassRatioInspiralLikelihood(generator, window, dataA, dataE, inverseA, inverseE);
        double snr = ExtremeMassRatioInspiralSnr.Optimal(generator, p, noise);
        double atTruth = likelihood.LogLikelihoodRatio(p);
        Assert.Equal(0.5 * snr * snr, atTruth, 1e-9 * snr * snr);
        double off = likelihood.LogLikelihoodRatio(p with { OrbitalFrequency0Hz = p.OrbitalFrequency0Hz * (1 + 1e-6) });
        Assert.True(off < atTruth);
        // The buffers are cleared between calls: the truth gives the same value again.
        Assert.Equal(atTruth, likelihood.LogLikelihoodRatio(p), 1e-12 * snr * snr);
    }
}

public class TemplateAllocationTests
{
    [Fact]
    public void Template_and_likelihood_allocate_nothing_after_the_first_call()
    {
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(10 * 86400.0, 10);
        var p = InspiralComparison.Source(0.3);
        var window = generator.TemplateBins(p);
        var a = new Complex[window.Count];
        var e = new Complex[window.Count];
        var data = new Complex[window.Count];
        var weights = Enumerable.Repeat(1e40, window.Count).ToArray();
        var likelihood = new ExtremeMassRatioInspiralLikelihood(generator, window, data, data, weights, weights);
        generator.AddResponse(p, window, a, e, Span<Complex>.Empty);
        likelihood.LogLikelihoodRatio(p);
        long before = GC.GetAllocatedBytesForCurrentThread();
        generator.AddResponse(p with { Eccentricity0 = 0.25 }, window, a, e, Span<Complex>.Empty);
        likelihood.LogLikelihoodRatio(p with { Phi0Rad = 1.0 });
        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }
}

public class TemplateArgumentTests
{
    [Fact]
    public void Generator_rejects_bad_records_windows_and_outputs()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new ExtremeMassRatioInspiralTemplateGenerator(-1, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => new ExtremeMassRatioInspiralTemplateGenerator(86400, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new ExtremeMassRatioInspiralTemplateGenerator(20, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => new ExtremeMassRatioInspiralTemplateGenerator(86400, 10,
            settings: new ExtremeMassRatioInspiralTemplateSettings(CoarseStepSeconds: 10)));
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(86400, 10);
        var p = InspiralComparison.Source(0.2);
        var outside = Assert.Throws<ArgumentOutOfRangeException>(() =>
            generator.AddResponse(p, new BinWindow(generator.BinCount - 2, 10), new Complex[10], new Complex[10], Span<Complex>.Empty));
        Assert.Contains("window", outside.Message);
        Assert.Throws<ArgumentException>(() => generator.AddResponse(p, new BinWindow(0, 10), new Complex[9], new Complex[10], Span<Complex>.Empty));
        var bad = Assert.Throws<ArgumentOutOfRangeException>(() =>
            generator.AddResponse(p with { Eccentricity0 = -0.1 }, new BinWindow(0, 10), new Complex[10], new Complex[10], Span<Complex>.Empty));
        Assert.Equal(ExtremeMassRatioInspiralParameters.EccentricityColumn, bad.ParamName);
    }

    [Fact]
    public void Source_past_the_plunge_at_the_start_is_refused()
    {
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(86400, 10);
        var p = InspiralComparison.Source(0.2, nu0: 5e-3);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => generator.TemplateBins(p));
        Assert.Contains("plunge", ex.Message);
    }
}
