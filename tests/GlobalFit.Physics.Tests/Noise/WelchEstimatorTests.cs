using GlobalFit.Physics.Noise;
using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

public class WelchEstimatorTests
{
    // Statistics used below (Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70): each Welch bin is close to
    // S χ²_{2K'}/(2K') with K' = K/(1 + 2ρ²), ρ = 1/6, for the Hann window at 50 % overlap. Neighbouring frequency bins of a
    // Hann periodogram are correlated (power correlation 4/9), bins three apart only at 1/1296, so the tests use
    // every third bin and treat those as independent. Each statistical bound is 4σ: two-sided false-failure
    // probability 6e-5 per check for a random seed; seeds are fixed, so every run gives the same result.

    // Source: Welch 1967 defines ρ = Σ w_n w_{n+D} / Σ w_n² for segments D apart; Harris 1978 (Proc. IEEE 66, 51),
    // Table 1, lists 16.7 % "overlap correlation" for the Hann window at 50 % overlap (table value from memory).
    // Computed here directly from the window weights, independently of the estimator.
    [Fact]
    public void Effective_segment_count_uses_the_hann_overlap_correlation_of_one_sixth()
    {
        const int length = 4096;
        double overlap = 0, power = 0;
        for (int n = 0; n < length; n++)
        {
            double w = GlobalFit.Physics.Series.TukeyWindow.Weight(n, length, 1.0);
            power += w * w;
            if (n + length / 2 < length) overlap += w * GlobalFit.Physics.Series.TukeyWindow.Weight(n + length / 2, length, 1.0);
        }
        double rho = overlap / power;
        Assert.Equal(1.0 / 6.0, rho, 1e-3); // finite-L deviation from the continuum value is O(1/L)
        Assert.Equal(100 / (1 + 2 * rho * rho), WelchEstimator.EffectiveSegmentCount(100), 1e-2);
    }

    [Fact]
    public void White_noise_of_variance_sigma_squared_gives_two_sigma_squared_dt()
    {
        const int n = 1 << 16, segment = 256;
        const double dt = 0.5, sigma = 2.0;
        var samples = StandardNormals.Draw(42, n).Select(g => sigma * g).ToArray();
        var welch = WelchEstimator.Psd(samples, dt, segment);
        Assert.Equal(511, welch.SegmentCount);
        Assert.Equal(129, welch.Count);
        Assert.Equal(1.0 / (segment * dt), welch.DfHz);
        var ratios = EveryThirdBin(1, segment / 2 - 1).Select(k => welch.Psd[k] / (2 * sigma * sigma * dt)).ToArray();
        double sd = 1 / Math.Sqrt(WelchEstimator.EffectiveSegmentCount(welch.SegmentCount) * ratios.Length);
        Assert.InRange(ratios.Average(), 1 - 4 * sd, 1 + 4 * sd);
    }

    // Chi-square test of simulated A/E/T noise against the model: Q = Σ 2K' r_i over M bins (r = estimate/model)
    // is ≈ χ²_{2K'M}, so Q/(2K'M) = mean r has standard deviation 1/√(K'M). Bins from 2 to 20 mHz: below 2 mHz the
    // steep PSD (∝ f^-3 with the foreground) makes the Hann-kernel bias (½ S''/S × 1/3 bin²) exceed 0.5 %.
    // The spread of the r_i must also match 1/K' (sample variance of M = 61 values: relative sd 18 %; bounds
    // [0.4, 1.8] are beyond 3σ).
    [Theory]
    [InlineData(AetChannel.A, 101)]
    [InlineData(AetChannel.E, 202)]
    [InlineData(AetChannel.T, 303)]
    public void Welch_estimate_of_simulated_noise_is_consistent_with_the_model(AetChannel channel, int seed)
    {
        const int n = 1 << 17, segment = 2048;
        const double dt = 5.0;
        var model = new AetNoiseModel(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));
        var normals = StandardNormals.Draw(seed, n - 1);
        var data = NoiseSynthesis.SynthesiseAet(model, n, dt, 0.0, normals, normals, normals);
        var series = channel switch { AetChannel.A => data.A, AetChannel.E => data.E, _ => data.T };
        var welch = WelchEstimator.Psd(series.Samples, dt, segment);
        double kEff = WelchEstimator.EffectiveSegmentCount(welch.SegmentCount);

        var ratios = EveryThirdBin(20, 200).Select(k => welch.Psd[k] / model.Psd(channel, welch.FrequencyOf(k))).ToArray();
        double mean = ratios.Average();
        double sd = 1 / Math.Sqrt(kEff * ratios.Length);
        Assert.InRange(mean, 1 - 4 * sd, 1 + 4 * sd);
        double variance = ratios.Sum(r => (r - mean) * (r - mean)) / (ratios.Length - 1);
        Assert.InRange(variance * kEff, 0.4, 1.8);
    }

    // A, E, T noises are independent (derived for equal arms: S_AE = S_AT = S_ET = 0). For independent channels the
    // normalised Welch CSD c = S_ab/√(S_a S_b) has E c = 0, Var(Re c) = Var(Im c) = 1/(2K') and E|c|² = 1/K'.
    [Fact]
    public void Cross_spectra_between_A_E_and_T_are_consistent_with_zero()
    {
        const int n = 1 << 17, segment = 2048;
        const double dt = 5.0;
        var model = new AetNoiseModel(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));
        var data = NoiseSynthesis.SynthesiseAet(model, n, dt, 0.0,
            StandardNormals.Draw(7, n - 1), StandardNormals.Draw(8, n - 1), StandardNormals.Draw(9, n - 1));
        foreach (var (a, b, ca, cb) in new[]
        {
            (data.A, data.E, AetChannel.A, AetChannel.E),
            (data.A, data.T, AetChannel.A, AetChannel.T),
            (data.E, data.T, AetChannel.E, AetChannel.T),
        })
        {
            var csd = WelchEstimator.Csd(a.Samples, b.Samples, dt, segment);
            double kEff = WelchEstimator.EffectiveSegmentCount(csd.SegmentCount);
            var normalised = EveryThirdBin(20, 200)
                .Select(k => csd.Csd[k] / Math.Sqrt(model.Psd(ca, csd.FrequencyOf(k)) * model.Psd(cb, csd.FrequencyOf(k))))
                .ToArray();
            double sd = 1 / Math.Sqrt(2 * kEff * normalised.Length);
            Assert.InRange(normalised.Average(c => c.Real), -4 * sd, 4 * sd);
            Assert.InRange(normalised.Average(c => c.Imaginary), -4 * sd, 4 * sd);
            Assert.InRange(normalised.Average(c => c.Magnitude * c.Magnitude) * kEff, 0.6, 1.4);
        }
    }

    // The CSD of a series with itself is its PSD (same normalisation), to round-off.
    [Fact]
    public void Cross_spectrum_of_a_series_with_itself_is_its_PSD()
    {
        var samples = StandardNormals.Draw(5, 4096);
        var psd = WelchEstimator.Psd(samples, 0.25, 512);
        var csd = WelchEstimator.Csd(samples, samples, 0.25, 512);
        for (int k = 0; k < psd.Count; k++)
        {
            Assert.Equal(psd.Psd[k], csd.Csd[k].Real, 1e-12 * psd.Psd[k]);
            Assert.Equal(0.0, csd.Csd[k].Imaginary, 1e-12 * psd.Psd[k]);
        }
    }

    // Parseval: with c_k = 2 inside and 1 at DC/Nyquist, Σ P_k Δf is the mean windowed power Σ w²x²/(L⟨w²⟩),
    // averaged over segments; for one segment this is exact (1e-12).
    [Fact]
    public void Summed_PSD_of_one_segment_is_its_windowed_power()
    {
        var samples = StandardNormals.Draw(6, 64);
        var welch = WelchEstimator.Psd(samples, 0.1, 64);
        Assert.Equal(1, welch.SegmentCount);
        double window = 0, power = 0;
        for (int i = 0; i < 64; i++)
        {
            double w = GlobalFit.Physics.Series.TukeyWindow.Weight(i, 64, 1.0);
            window += w * w;
            power += w * w * samples[i] * samples[i];
        }
        Assert.Equal(power / window, welch.Psd.Sum() * welch.DfHz, 1e-12);
    }

    [Fact]
    public void Frequencies_are_multiples_of_the_segment_resolution()
    {
        var welch = WelchEstimator.Psd(new double[100], 2.0, 20);
        Assert.Equal(9, welch.SegmentCount);
        Assert.Equal(new[] { 0.0, 0.025, 0.05 }, welch.FrequenciesHz().Take(3));
        Assert.Equal(0.25, welch.FrequencyOf(10));
    }

    [Fact]
    public void Invalid_segments_and_mismatched_series_are_rejected()
    {
        Assert.Throws<ArgumentException>(() => WelchEstimator.Psd(new double[100], 1.0, 101));
        Assert.Throws<ArgumentException>(() => WelchEstimator.Psd(new double[100], 1.0, 15));
        Assert.Throws<ArgumentException>(() => WelchEstimator.Psd(new double[100], 1.0, 2));
        Assert.Throws<ArgumentException>(() => WelchEstimator.Psd(new double[100], -1.0, 16));
        Assert.Throws<ArgumentException>(() => WelchEstimator.Csd(new double[100], new double[99], 1.0, 16));
    }

    private static IEnumerable<int> EveryThirdBin(int first, int last)
    {
        for (int k = first; k <= last; k += 3) yield return k;
    }
}
