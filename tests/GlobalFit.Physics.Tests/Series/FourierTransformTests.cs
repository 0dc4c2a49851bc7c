using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Series;

public class FourierTransformTests
{
    private static double[] RandomSamples(int n, int seed)
    {
        var random = new Random(seed);
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = random.NextDouble() * 2 - 1;
        return x;
    }

    // Direct O(N²) DFT, written independently of the FFT, in the convention h̃_k = dt Σ h_n e^{-2πikn/N}.
    private static Complex DirectBin(double[] x, double dt, int k)
    {
        Complex sum = 0;
        for (int n = 0; n < x.Length; n++)
            sum += x[n] * Complex.FromPolarCoordinates(1, -2 * Math.PI * k * (long)n / x.Length);
        return dt * sum;
    }

    [Theory]
    [InlineData(64)]     // packed power-of-two path
    [InlineData(1024)]
    [InlineData(90)]     // packed, Bluestein on 45 points
    [InlineData(77)]     // odd length
    [InlineData(974)]    // 2·487: packed, Bluestein on the half length
    public void Forward_transform_equals_the_direct_discrete_sum_times_the_cadence(int n)
    {
        var x = RandomSamples(n, seed: n);
        const double dt = 5.0;
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        FourierTransform.Forward(x, dt, spectrum);
        for (int k = 0; k < spectrum.Length; k++)
        {
            Complex expected = DirectBin(x, dt, k);
            // Round-off of an N-term sum of O(1) values times dt: 1e-12 × N × dt is a generous bound.
            Assert.True((spectrum[k] - expected).Magnitude < 1e-12 * n * dt, $"bin {k}: {spectrum[k]} vs {expected}");
        }
    }

    [Theory]
    [InlineData(4096)]
    [InlineData(1000)]
    [InlineData(999)]
    public void Inverse_of_forward_returns_the_original_samples(int n)
    {
        var x = RandomSamples(n, seed: 7 + n);
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        var back = new double[n];
        FourierTransform.Forward(x, 0.25, spectrum);
        FourierTransform.Inverse(spectrum, 0.25, back);
        for (int i = 0; i < n; i++)
            Assert.Equal(x[i], back[i], 1e-12); // two transforms of O(1) data: round-off ~1e-15 √log N
    }

    // Parseval in the continuous convention: dt Σ h² = df Σ_{k=0}^{N-1} |h̃_k|², with the one-sided bins
    // counted twice except DC and Nyquist (derived from the transform's definition in FourierTransform).
    [Theory]
    [InlineData(2048)]
    [InlineData(1500)]
    public void Parseval_holds_in_the_continuous_normalisation(int n)
    {
        var x = RandomSamples(n, seed: 3);
        const double dt = 2.0;
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        FourierTransform.Forward(x, dt, spectrum);
        double timeEnergy = dt * x.Sum(v => v * v);
        double df = 1.0 / (n * dt);
        double freqEnergy = 0;
        for (int k = 0; k < spectrum.Length; k++)
        {
            bool unpaired = k == 0 || (n % 2 == 0 && k == n / 2);
            freqEnergy += (unpaired ? 1 : 2) * spectrum[k].Magnitude * spectrum[k].Magnitude * df;
        }
        Assert.Equal(timeEnergy, freqEnergy, timeEnergy * 1e-12);
    }

    // A unit sinusoid on bin q puts A T/2 into that bin: ∫ cos(2π f_q t) e^{-2πi f_q t} dt = T/2.
    [Fact]
    public void A_sinusoid_on_a_bin_has_half_its_amplitude_times_the_duration_there()
    {
        const int n = 1 << 12;
        const double dt = 5.0, amplitude = 3.0;
        const int q = 137;
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = amplitude * Math.Cos(2 * Math.PI * q * i / n);
        var fs = FourierTransform.Forward(new TimeSeries(0, dt, x));
        Assert.Equal(amplitude * n * dt / 2, fs.Values[q].Real, 1e-9 * n * dt);
        Assert.Equal(0, fs.Values[q].Imaginary, 1e-9 * n * dt);
        Assert.Equal(1.0 / (n * dt), fs.DfHz, 1e-20);
    }

    [Fact]
    public void Forward_rejects_an_output_of_the_wrong_length()
    {
        var ex = Assert.Throws<ArgumentException>(() => FourierTransform.Forward(new double[16], 1.0, new Complex[8]));
        Assert.Contains("9 bins", ex.Message);
    }

    [Fact]
    public void Fft_plan_rejects_lengths_that_are_not_powers_of_two()
    {
        Assert.Throws<ArgumentException>(() => FftPlan.ForLength(96));
        Assert.Throws<ArgumentException>(() => FftPlan.ForLength(0));
    }

    [Fact]
    public void Fft_plan_inverse_undoes_forward_up_to_the_length()
    {
        var plan = FftPlan.ForLength(256);
        var random = new Random(11);
        var data = Enumerable.Range(0, 256).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
        var copy = (Complex[])data.Clone();
        plan.Forward(copy);
        plan.Inverse(copy);
        for (int i = 0; i < data.Length; i++)
            Assert.True((copy[i] / 256 - data[i]).Magnitude < 1e-14, $"sample {i}");
    }
}
