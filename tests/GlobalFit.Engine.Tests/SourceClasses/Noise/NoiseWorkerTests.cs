using GlobalFit.Engine.SourceClasses.Noise;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.Noise;

public class NoiseWorkerTests
{
    private static readonly NoiseLevels Start = new(InstrumentNoiseSettings.DefaultAccelerationAsd, InstrumentNoiseSettings.DefaultOmsAsd,
        InstrumentNoiseSettings.DefaultAccelerationAsd, InstrumentNoiseSettings.DefaultOmsAsd, 1.0);

    // 20 % off the starting values in both directions, in every channel group.
    private static readonly NoiseLevels Truth = new(1.2 * Start.AccelerationAsdAe, 0.8 * Start.OmsAsdAe,
        0.8 * Start.AccelerationAsdT, 1.2 * Start.OmsAsdT, 1.2);

    private static readonly Lazy<NoiseTestData> Data = new(() => new NoiseTestData(Truth, 0.5, 20261202));

    private static NoiseFitSettings Settings(bool fitLevels = true) => new()
    {
        FitLevels = fitLevels,
        ForegroundFitYears = 0.5,
        SampleInterval = 1,
        MaxFrequencyHz = 0.03,
    };

    // A noise-only fit must recover the injected levels. Posterior mean and width come from 300 cold-chain
    // steps after a 100-step burn-in. For a Gaussian posterior |mean − truth| > 3σ happens with probability
    // 0.27 % per level, ≈ 1.3 % for the five levels together were the seed redrawn.
    [Fact]
    public void Noise_only_fit_recovers_the_injected_levels_within_their_posterior_widths()
    {
        var worker = new NoiseWorker(Settings(), NoiseTestData.Shape, 11);
        var residual = Data.Value.Residual(worker.Bins, includeT: true);
        worker.Fit(residual, 100);
        var columns = worker.ParameterNames.ToList();
        var values = new List<double[]>();
        for (int update = 0; update < 3; update++)
        {
            var block = worker.Fit(residual, 100).Samples;
            for (int s = 0; s < block.SampleCount; s++) values.Add(block.Values.AsSpan(s * columns.Count, columns.Count).ToArray());
        }
        double[] truth = [Truth.AccelerationAsdAe, Truth.OmsAsdAe, Truth.AccelerationAsdT, Truth.OmsAsdT, Truth.ForegroundAmplitude];
        Assert.Equal(["acceleration_asd_ae_m_s2_rthz", "oms_asd_ae_m_rthz", "acceleration_asd_t_m_s2_rthz", "oms_asd_t_m_rthz", "foreground_amplitude_relative"], columns);
        for (int i = 0; i < columns.Count; i++)
        {
            double mean = values.Average(v => v[i]);
            double sigma = Math.Sqrt(values.Sum(v => (v[i] - mean) * (v[i] - mean)) / (values.Count - 1));
            Assert.True(sigma > 0, $"{columns[i]} never moved");
            Assert.True(Math.Abs(mean - truth[i]) < 3 * sigma,
                $"{columns[i]}: mean {mean:G6}, truth {truth[i]:G6}, σ {sigma:G3} ({Math.Abs(mean - truth[i]) / sigma:F1}σ off)");
        }
    }

    // Exact equality: resuming must continue the same arithmetic on the same random streams (no tolerance).
    [Fact]
    public void A_restored_worker_continues_bit_for_bit()
    {
        var settings = Settings() with { TemperatureCount = 2 };
        var original = new NoiseWorker(settings, NoiseTestData.Shape, 5);
        var residual = Data.Value.Residual(original.Bins, includeT: true);
        original.Fit(residual, 30);
        byte[] saved = original.SaveState();
        var expected = original.Fit(residual, 30);
        var restored = NoiseWorker.Restore(settings, NoiseTestData.Shape, saved);
        var actual = restored.Fit(residual, 30);
        Assert.Equal(expected.Samples.Values, actual.Samples.Values);
        Assert.Equal(expected.Samples.LogLikelihoods, actual.Samples.LogLikelihoods);
        Assert.Equal(expected.Levels, actual.Levels);
        Assert.Equal(expected.Statistics with { WallTime = TimeSpan.Zero }, actual.Statistics with { WallTime = TimeSpan.Zero });
        Assert.Equal(original.SaveState(), restored.SaveState());
    }

    [Fact]
    public void A_state_saved_with_other_levels_is_refused()
    {
        var worker = new NoiseWorker(Settings(), NoiseTestData.Shape, 5);
        Assert.Throws<ArgumentException>(() => NoiseWorker.Restore(Settings() with { IncludeT = false }, NoiseTestData.Shape, worker.SaveState()));
    }

    [Fact]
    public void Fixed_levels_leave_the_psd_unchanged_and_report_one_sample()
    {
        var worker = new NoiseWorker(Settings(fitLevels: false), NoiseTestData.Shape, 5);
        var bins = new BinWindow(1, 5000);
        var before = new double[bins.Count];
        worker.FillPsd(AetChannel.A, bins, before);
        var update = worker.Fit(Data.Value.Residual(worker.Bins, includeT: true), 50);
        var after = new double[bins.Count];
        worker.FillPsd(AetChannel.A, bins, after);
        Assert.Equal(before, after);
        Assert.Equal(1, update.Samples.SampleCount);
        Assert.Equal(Start, update.Levels);
        Assert.True(double.IsFinite(update.Statistics.LogLikelihood));
        Assert.Equal("noise", update.Samples.ClassId);
    }

    // The PSD a new worker serves is the project's noise model at the starting levels, bit for bit.
    [Fact]
    public void A_new_worker_serves_the_noise_model_at_the_starting_levels()
    {
        var worker = new NoiseWorker(Settings(), NoiseTestData.Shape, 5);
        var model = new AetNoiseModel(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(0.5));
        var bins = new BinWindow(0, 300);
        var psd = new double[bins.Count];
        worker.FillPsd(AetChannel.E, bins, psd);
        for (int k = 0; k < bins.Count; k++) Assert.Equal(model.PsdE(k * NoiseTestData.Shape.DfHz), psd[k]);
    }

    // The likelihood's linear decomposition into shapes must give the same PSD as the physics model at other
    // levels: ln L from the model equals a direct Whittle sum over FillPsd's PSDs. 1e-9 relative of |ln L| ≈ 1e7
    // allows the ~1e-13 decomposition rounding per bin summed over 10⁵ bins.
    [Fact]
    public void Likelihood_uses_the_same_psd_the_worker_serves()
    {
        var worker = new NoiseWorker(Settings(), NoiseTestData.Shape, 5);
        var residual = Data.Value.Residual(worker.Bins, includeT: true);
        var update = worker.Fit(residual, 20);
        var bins = worker.Bins;
        double df = NoiseTestData.Shape.DfHz;
        var psdA = new double[bins.Count];
        var psdT = new double[bins.Count];
        worker.FillPsd(AetChannel.A, bins, psdA);
        worker.FillPsd(AetChannel.T, bins, psdT);
        double direct = 0;
        for (int k = 0; k < bins.Count; k++)
        {
            double ae = residual.A[k].Magnitude * residual.A[k].Magnitude + residual.E[k].Magnitude * residual.E[k].Magnitude;
            double t = residual.T![k].Magnitude * residual.T[k].Magnitude;
            direct -= 2 * df * ae / psdA[k] + 2 * Math.Log(psdA[k]) + 2 * df * t / psdT[k] + Math.Log(psdT[k]);
        }
        Assert.Equal(direct, update.Statistics.LogLikelihood, Math.Abs(direct) * 1e-9);
    }

    [Fact]
    public void A_residual_over_other_bins_is_refused()
    {
        var worker = new NoiseWorker(Settings(), NoiseTestData.Shape, 5);
        var wrong = Data.Value.Residual(new BinWindow(worker.Bins.First + 1, worker.Bins.Count), includeT: true);
        Assert.Throws<ArgumentException>(() => worker.Fit(wrong, 5));
        Assert.Throws<ArgumentException>(() => worker.Fit(Data.Value.Residual(worker.Bins, includeT: false), 5));
    }

    [Fact]
    public void Without_t_and_foreground_only_the_ae_instrument_levels_are_sampled()
    {
        var worker = new NoiseWorker(Settings() with { IncludeT = false, Foreground = false }, NoiseTestData.Shape, 5);
        var update = worker.Fit(Data.Value.Residual(worker.Bins, includeT: false), 20);
        Assert.Equal(["acceleration_asd_ae_m_s2_rthz", "oms_asd_ae_m_rthz"], update.Samples.ParameterNames);
        Assert.Equal(20, update.Samples.SampleCount);
        Assert.Equal(0.0, update.Levels.ForegroundAmplitude);
        Assert.Equal(Start.AccelerationAsdT, update.Levels.AccelerationAsdT); // unfitted T stays at its starting level
        Assert.Equal("noise", update.Samples.WorkerId);
        Assert.Equal(0, update.Samples.Iteration);
    }
}
