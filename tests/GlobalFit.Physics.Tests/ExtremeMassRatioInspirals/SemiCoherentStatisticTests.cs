using System.Numerics;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public sealed class SemiCoherentStatisticTests(ITestOutputHelper output)
{
    [Fact]
    public void Semi_coherent_statistic_ranks_the_injected_source_above_random_templates()
    {
        // 60 days at 20 s, M = 10 segments of 6 days; an e0 = 0.2 source scaled to SNR 30 in seeded Gaussian noise.
        // Noise alone gives χ² with 20 degrees of freedom (mean 20, sd 6.3); the truth adds ~ SNR² = 900. Random
        // templates share the masses and lie within ±5 % in ν0, so they overlap the data's band and may catch part of
        // the signal: with this seed the best of twelve reached 64 against 961 for the truth, so the bar (half the
        // truth's value) leaves a margin of 7; pure χ²₂₀ noise would pass it with probability below 1e-9.
        double duration = 60 * 86400.0, cadence = 20;
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        var truth = InspiralComparison.Source(0.2);
        double snr = ExtremeMassRatioInspiralSnr.Optimal(generator, truth, noise);
        truth = truth with { DistanceMpc = truth.DistanceMpc * snr / 30 };
        var bins = generator.TemplateBins(truth);
        var window = new BinWindow(Math.Max(1, bins.First - 200), bins.Count + 400);
        double df = generator.FrequencyResolutionHz;
        var dataA = new Complex[window.Count];
        var dataE = new Complex[window.Count];
        generator.AddResponse(truth, window, dataA, dataE, Span<Complex>.Empty);
        var psd = new double[window.Count];
        var inverseA = new double[window.Count];
        var inverseE = new double[window.Count];
        var random = new Random(2024);
        var noiseA = new Complex[window.Count];
        var noiseE = new Complex[window.Count];
        double Gaussian() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        foreach (var (channel, data, inverse) in new[] { (AetChannel.A, dataA, inverseA), (AetChannel.E, dataE, inverseE) })
        {
            noise.FillPsd(channel, window.First * df, df, psd);
            InnerProduct.InvertPsd(psd, inverse);
            // E|n_k|² = (T/2) S_k in the project's convention: each quadrature has variance T S_k / 4.
            for (int k = 0; k < window.Count; k++)
            {
                var n = Math.Sqrt(duration * psd[k] / 4) * new Complex(Gaussian(), Gaussian());
                data[k] += n;
                (channel == AetChannel.A ? noiseA : noiseE)[k] = n;
            }
        }
        // Noise alone at the true template: one draw of χ² with 20 degrees of freedom; [2, 55] holds it with
        // probability 1 − 4e-5 (derived: χ²₂₀ tail beyond 55 is 4.1e-5, below 2 is 1.1e-7).
        double noiseOnly = new SemiCoherentStatistic(generator, window, 10, noiseA, noiseE, inverseA, inverseE).Evaluate(truth);
        output.WriteLine($"noise only {noiseOnly:F1}");
        Assert.InRange(noiseOnly, 2, 55);
        var statistic = new SemiCoherentStatistic(generator, window, 10, dataA, dataE, inverseA, inverseE);
        double atTruth = statistic.Evaluate(truth);
        var prior = new ExtremeMassRatioInspiralPrior();
        var u = new double[ExtremeMassRatioInspiralPrior.UniformsPerDraw];
        double best = 0;
        for (int i = 0; i < 12; i++)
        {
            for (int j = 0; j < u.Length; j++) u[j] = random.NextDouble();
            var draw = prior.Draw(u) with
            {
                CentralMassMsun = truth.CentralMassMsun,
                CompactMassMsun = truth.CompactMassMsun,
                OrbitalFrequency0Hz = truth.OrbitalFrequency0Hz * (0.95 + 0.1 * random.NextDouble()),
                Eccentricity0 = 0.4 * random.NextDouble(),
            };
            double value = statistic.Evaluate(draw);
            best = Math.Max(best, value);
        }
        output.WriteLine($"truth {atTruth:F1}, best random {best:F1}");
        Assert.InRange(atTruth, 900 - 200, 900 + 200);
        Assert.True(best < 0.5 * atTruth, $"random template reached {best} against {atTruth}");
    }

    [Fact]
    public void Segment_responses_add_up_to_the_whole_record()
    {
        // The windowed spectra of adjacent segments sum to the spectrum of the whole record (linearity of the
        // transform); the stationary-phase pieces reproduce this to the accuracy of their edge treatment.
        double duration = 30 * 86400.0, cadence = 20;
        var generator = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var p = InspiralComparison.Source(0.2);
        var window = generator.TemplateBins(p);
        var wholeA = new Complex[window.Count];
        var wholeE = new Complex[window.Count];
        generator.AddResponse(p, window, wholeA, wholeE, Span<Complex>.Empty);
        var partsA = new Complex[window.Count];
        var partsE = new Complex[window.Count];
        generator.AddSegmentResponse(p, 0, duration / 3, window, partsA, partsE);
        generator.AddSegmentResponse(p, duration / 3, duration, window, partsA, partsE);
        var weight = Enumerable.Repeat(1.0, window.Count).ToArray();
        double overlap = Match.Overlap([wholeA, wholeE], [partsA, partsE], [weight, weight], generator.FrequencyResolutionHz);
        output.WriteLine($"overlap {overlap:F6}");
        Assert.True(overlap > 0.995, $"overlap {overlap}");
        Assert.Throws<ArgumentOutOfRangeException>(() => generator.AddSegmentResponse(p, 10, 5, window, partsA, partsE));
    }
}
