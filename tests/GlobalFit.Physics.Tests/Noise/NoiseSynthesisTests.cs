using System.Numerics;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

public class NoiseSynthesisTests
{
    private static readonly AetNoiseModel Model = new(InstrumentNoiseSettings.Default, new GalacticConfusionSettings(1.0));

    // Source: one-sided noise statistics E|ñ_k|² = (T/2) S_k (derived from the FourierTransform convention). For the synthesised noise
    // each ratio r_k = |ñ_k|²/((T/2)S_k) is exactly Exp(1) and independent across bins, so the mean over the
    // M = 8191 interior bins has standard deviation 1/√M = 0.011; the 4σ bound (0.044) fails with probability
    // 6e-5 for a random seed (the seed is fixed, so the test is deterministic).
    [Fact]
    public void Spectrum_of_synthesised_noise_has_the_expected_power_per_bin()
    {
        const int n = 1 << 14;
        const double dt = 5.0;
        var psd = new double[n / 2 + 1];
        Model.FillPsd(AetChannel.A, 0.0, 1.0 / (n * dt), psd);
        var samples = new double[n];
        NoiseSynthesis.ColourWhiteNoise(StandardNormals.Draw(11, n - 1), psd, dt, samples);
        var spectrum = new Complex[n / 2 + 1];
        FourierTransform.Forward(samples, dt, spectrum);
        double sum = 0;
        for (int k = 1; k < n / 2; k++)
            sum += spectrum[k].Magnitude * spectrum[k].Magnitude / (0.5 * n * dt * psd[k]);
        double mean = sum / (n / 2 - 1);
        Assert.InRange(mean, 1 - 4 / Math.Sqrt(n / 2 - 1), 1 + 4 / Math.Sqrt(n / 2 - 1));
        Assert.Equal(0.0, spectrum[0].Magnitude, 1e-30);
    }

    // The documented draw order: bin k takes normals 2k−2 (real) and 2k−1 (imaginary), Nyquist the last one.
    // Checked by transforming back; 1e-9 relative covers the FFT round trip.
    [Fact]
    public void Normals_are_consumed_bin_by_bin_with_the_Nyquist_bin_last()
    {
        const int n = 256;
        const double dt = 2.0, t = n * dt;
        var psd = new double[n / 2 + 1];
        for (int k = 0; k < psd.Length; k++) psd[k] = 1.0 + k;
        var normals = StandardNormals.Draw(3, NoiseSynthesis.RequiredNormalCount(n));
        Assert.Equal(n - 1, normals.Length);
        var samples = new double[n];
        NoiseSynthesis.ColourWhiteNoise(normals, psd, dt, samples);
        var spectrum = new Complex[n / 2 + 1];
        FourierTransform.Forward(samples, dt, spectrum);
        foreach (int k in new[] { 1, 2, 77, n / 2 - 1 })
        {
            var expected = Math.Sqrt(t * psd[k] / 4) * new Complex(normals[2 * k - 2], normals[2 * k - 1]);
            Assert.True((spectrum[k] - expected).Magnitude < 1e-9 * expected.Magnitude, $"bin {k}");
        }
        RelativeAssert.Close(Math.Sqrt(t * psd[n / 2] / 2) * normals[n - 2], spectrum[n / 2].Real, 1e-9);
    }

    // Odd lengths have no Nyquist bin and still take N − 1 normals (all in complex bins).
    [Fact]
    public void Odd_lengths_use_all_normals_in_complex_bins()
    {
        const int n = 101;
        var psd = Enumerable.Repeat(2.0, n / 2 + 1).ToArray();
        var normals = StandardNormals.Draw(5, n - 1);
        var samples = new double[n];
        NoiseSynthesis.ColourWhiteNoise(normals, psd, 1.0, samples);
        var spectrum = new Complex[n / 2 + 1];
        FourierTransform.Forward(samples, 1.0, spectrum);
        var last = Math.Sqrt(n * 2.0 / 4) * new Complex(normals[n - 3], normals[n - 2]);
        Assert.True((spectrum[n / 2] - last).Magnitude < 1e-9 * last.Magnitude);
    }

    // Source: derived (Parseval): the expected mean square is the discrete ∫S df, Δf(Σ_{0<k<N/2} S_k + S_{N/2}/2).
    // For a Lorentzian S = S0/(1 + (f/fc)²) the continuous integral is S0 fc atan(f_Nyq/fc); the discrete sum
    // differs by O(Δf/fc) = 1e-4. The sampling standard deviation of the mean square is Δf √(Σ S_k²) (each complex
    // bin contributes S_k Δf × Exp(1)); the 4σ bound fails with probability 6e-5.
    [Fact]
    public void Sample_variance_equals_the_integrated_PSD_within_sampling_error()
    {
        const int n = 1 << 16;
        const double dt = 1.0, s0 = 3e-40, fc = 0.1;
        double df = 1.0 / (n * dt);
        var psd = new double[n / 2 + 1];
        for (int k = 0; k < psd.Length; k++) psd[k] = s0 / (1 + Math.Pow(k * df / fc, 2));
        double expected = 0, spread = 0;
        for (int k = 1; k < n / 2; k++) { expected += psd[k] * df; spread += Math.Pow(psd[k] * df, 2); }
        expected += 0.5 * psd[n / 2] * df;
        double sigma = Math.Sqrt(spread);
        RelativeAssert.Close(s0 * fc * Math.Atan(0.5 / dt / fc), expected, 1e-3);

        var samples = new double[n];
        NoiseSynthesis.ColourWhiteNoise(StandardNormals.Draw(2024, n - 1), psd, dt, samples);
        double meanSquare = samples.Sum(v => v * v) / n;
        Assert.InRange(meanSquare, expected - 4 * sigma, expected + 4 * sigma);
        Assert.True(Math.Abs(samples.Average()) < 1e-6 * Math.Sqrt(meanSquare), "no DC offset");
    }

    [Fact]
    public void Same_normals_give_the_same_series_and_each_channel_uses_its_own()
    {
        const int n = 512;
        const double dt = 5.0;
        var normalsA = StandardNormals.Draw(1, n - 1);
        var normalsE = StandardNormals.Draw(2, n - 1);
        var normalsT = StandardNormals.Draw(3, n - 1);
        var first = NoiseSynthesis.SynthesiseAet(Model, n, dt, 100.0, normalsA, normalsE, normalsT);
        var second = NoiseSynthesis.SynthesiseAet(Model, n, dt, 100.0, normalsA, normalsE, normalsT);
        Assert.Equal(first.A.Samples, second.A.Samples);
        Assert.Equal(100.0, first.T0Seconds);
        Assert.Equal(dt, first.DtSeconds);

        var psdT = new double[n / 2 + 1];
        Model.FillPsd(AetChannel.T, 0.0, 1.0 / (n * dt), psdT);
        var alone = new double[n];
        NoiseSynthesis.ColourWhiteNoise(normalsT, psdT, dt, alone);
        Assert.Equal(alone, first.T.Samples);
    }

    [Fact]
    public void Mismatched_lengths_and_invalid_PSDs_are_rejected()
    {
        var output = new double[64];
        var psd = Enumerable.Repeat(1.0, 33).ToArray();
        Assert.Throws<ArgumentException>(() => NoiseSynthesis.ColourWhiteNoise(new double[64], psd, 1.0, output));
        Assert.Throws<ArgumentException>(() => NoiseSynthesis.ColourWhiteNoise(new double[63], new double[32], 1.0, output));
        Assert.Throws<ArgumentException>(() => NoiseSynthesis.ColourWhiteNoise(new double[63], psd, 0.0, output));
        psd[5] = -1.0;
        var error = Assert.Throws<ArgumentException>(() => NoiseSynthesis.ColourWhiteNoise(new double[63], psd, 1.0, output));
        Assert.Contains("bin 5", error.Message);
        Assert.Throws<ArgumentException>(() => NoiseSynthesis.SynthesiseAet(Model, 64, 5.0, 0.0, new double[63], new double[63], new double[62]));
    }

    // Bin 0 of a model PSD is +∞ (noise undefined at DC); the synthesiser ignores it instead of producing NaN.
    [Fact]
    public void Infinite_PSD_at_DC_is_ignored()
    {
        var psd = new double[33];
        Model.FillPsd(AetChannel.A, 0.0, 1e-3, psd);
        Assert.Equal(double.PositiveInfinity, psd[0]);
        var output = new double[64];
        NoiseSynthesis.ColourWhiteNoise(StandardNormals.Draw(9, 63), psd, 15.0, output);
        Assert.All(output, v => Assert.True(double.IsFinite(v)));
    }

    [Fact]
    public void Probe_reports_a_positive_rate()
    {
        var measurement = NoiseSynthesisProbe.Measure(4096);
        Assert.Equal(4096, measurement.SamplesPerChannel);
        Assert.True(measurement.Seconds > 0 && measurement.SamplesPerSecond > 0);
    }
}
