using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Sensitivity of the blind search on simulated inspirals (the fixture's source at several distances, over a
/// month, in a box around it): how often it detects them, how often the blind worker's first update recovers them
/// (matcher overlap ≥ 0.5, as <c>compare</c> counts), and what noise alone gives.</summary>
public class InspiralBlindSensitivityTests(ITestOutputHelper output)
{


    // SNR 8.65 at 1000 Mpc over the month (measured, InspiralFitFixture), scaled as 1/D; a distance of 1e9 Mpc leaves
    // noise alone (SNR 1e-5).
    private static ExtremeMassRatioInspiralParameters AtSnr(double snr) =>
        InspiralFitFixture.Source with { DistanceMpc = snr > 0 ? 1000 * 8.65 / snr : 1e9 };

    private static double Significance(double snr, ulong seed, InspiralBlindSearchSettings settings)
    {
        var generator = InspiralFitPlan.Generator(InspiralFitFixture.Month);
        var window = InspiralFitFixture.SearchBox.Reach(generator);
        var residual = InspiralFitFixture.Residual(window, AtSnr(snr), seed);
        var random = RandomStream.ForPath(seed, 3, 3);
        return InspiralBlindSearch.Run(generator, window, residual.Spectra.A, residual.Spectra.E, residual.InverseA, residual.InverseE,
            InspiralFitFixture.SearchBox, settings, 8, ref random).Significance;
    }

    [Fact]
    public void A_loud_inspiral_is_detected_and_noise_alone_is_not()
    {
        // A reduced budget (200 draws, 3 chains × 100 steps at 16 and 8 segments) keeps this to about half a minute.
        var settings = new InspiralBlindSearchSettings(Draws: 200, Chains: 3, ChainSteps: 100, Segments: 16);
        double loud = Significance(43, 1, settings);
        double quiet = Significance(0, 2, settings);
        output.WriteLine($"significance: SNR 43 {loud:F1}, noise alone {quiet:F1}");
        // Measured here: 53.9 for SNR 43 and 4.4 for noise alone. The threshold 12 against noise alone: the maximised
        // significance of pure noise was 4.4 (this budget), 5.8 (2000 draws, 32 → 8 segments, a box five times wider) and
        // 4.8–5.6 (four seeds, the Long test's worker budget); the statistic at a fixed template is χ²₁₆ in noise, whose
        // significance 12 (ρ²_sc ≥ 83.9) has probability 3.3e-11 (derived: the χ²₁₆ survival function, a finite Poisson sum), and the search's maximisation over the box added about 5 in the
        // trials, so a noise-only detection needs a fluctuation far beyond those seen (false-failure rate not measurable
        // from these few trials; none in 6). A matched SNR-43 source gives about SNR²/(2√8) ≈ 160; the partial matches
        // the search reaches gave 54–162, far above 12.
        Assert.True(loud >= InspiralFitSettings.DefaultDetectionSignificance, $"SNR 43 gave significance {loud}");
        Assert.True(quiet < InspiralFitSettings.DefaultDetectionSignificance, $"noise alone gave significance {quiet}");
    }

    [Fact]
    [Trait("Category", "Long")]
    public void Fraction_detected_and_recovered_is_measured_against_snr()
    {
        const int Trials = 2;
        var generator = InspiralFitPlan.Generator(InspiralFitFixture.Month);
        var lines = new List<string>();
        int noiseDetections = 0;
        var detected = new Dictionary<double, int>();
        var recovered = new Dictionary<double, int>();
        foreach (double snr in new[] { 0.0, 10, 15, 20, 30, 50 })
        {
            (detected[snr], recovered[snr]) = (0, 0);
            int trials = snr == 0 ? 2 * Trials : Trials;
            for (int t = 0; t < trials; t++)
            {
                var truth = AtSnr(snr);
                var plan = InspiralFitPlan.FromConfig(InspiralFitFixture.Section(
                    "count = 1\ntemperatures = 2\nsearch_evaluations = 150\nsearch_draws = 300\nsearch_chains = 4\nsearch_chain_steps = 150\n" + InspiralFitFixture.SearchBoxKeys),
                    InspiralFitFixture.Month);
                var descriptor = plan.Groups[0].Workers[0];
                var residual = InspiralFitFixture.Residual(descriptor.Bins, truth, (ulong)(500 + 10 * snr + t));
                var worker = (InspiralWorker)plan.CreateWorker(descriptor.Id, (ulong)(7 + t));
                var update = worker.Update(residual, 20);
                bool hit = update.Samples.SampleCount > 0;
                double overlap = 0;
                if (hit)
                {
                    var matcher = new InspiralMatcher(generator, new DefaultNoise(InspiralFitFixture.Month.DfHz), [descriptor.Bins]);
                    overlap = matcher.Overlap(worker.State.Current, truth.ToArray());
                }
                if (hit) detected[snr]++;
                if (hit && overlap >= 0.5) recovered[snr]++;
                if (snr == 0 && hit) noiseDetections++;
                lines.Add($"SNR {snr,3:F0} trial {t}: significance {worker.State.BlindSignificance,6:F1}, {(hit ? "detected" : "nothing")}, overlap {overlap:F2}");
            }
        }
        foreach (string line in lines) output.WriteLine(line);
        foreach (var snr in detected.Keys)
            output.WriteLine($"SNR {snr,3:F0}: detected {detected[snr]}, recovered {recovered[snr]} of {(snr == 0 ? 2 * Trials : Trials)}");
        // Measured (this budget; 15 min on the shared machine under a load average of 13): noise alone 4.8, 4.8, 5.1, 5.6,
        // nothing reported; detected 0/2 at SNR 10 (significance 3.6, 2.7), 2/2 at 15 (12.2, 13.3), 20 (20.1, 27.6),
        // 30 (31.6, 39.9) and 50 (77.8, 171.9); recovered (overlap ≥ 0.5 after the first update) 0 at every SNR, the
        // overlaps 0.17–0.48: the search detects but lands on partial-match modes. A measurement: the only floor is that
        // noise alone is not reported as a source.
        Assert.Equal(0, noiseDetections);
    }

    private sealed class DefaultNoise(double dfHz) : IPsdSource
    {
        public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
        {
            for (int k = 0; k < psd.Length; k++) psd[k] = InspiralFitFixture.Noise.Psd(channel, (bins.First + k) * dfHz);
        }
    }
}
