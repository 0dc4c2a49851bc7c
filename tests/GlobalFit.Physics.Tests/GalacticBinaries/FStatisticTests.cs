using GlobalFit.Physics.GalacticBinaries;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class FStatisticTests(ITestOutputHelper output)
{
    private static readonly GalacticBinaryTemplateGenerator Generator = new(30 * 86400.0, 15.0);
    private static readonly GalacticBinaryParameters Source = new(3.0002e-3, 3e-17, 2e-22, 0.5, 2.3, 1.0, 0.7, 2.0);

    [Fact]
    public void Amplitudes_match_the_reference_values()
    {
        // Source: derived: the amplitude formulas of FStatisticAmplitudes (our convention; Jaranowski, Królak &
        // Schutz 1998 for the idea) evaluated independently at A+ = 1, Ax = 0.5, psi = 0.3, phi0 = 1.1. Printed to 8
        // decimals, so 5e-9.
        var a = FStatisticAmplitudes.FromPolarisationAmplitudes(1.0, 0.5, 0.3, 1.1);
        Assert.Equal(0.12276227, a.A1, 5e-9);
        Assert.Equal(0.62389222, a.A2, 5e-9);
        Assert.Equal(-0.86360499, a.A3, 5e-9);
        Assert.Equal(-0.31602901, a.A4, 5e-9);
    }

    [Fact]
    public void Reference_amplitudes_invert_to_the_reference_physical_parameters()
    {
        // Source: derived: the example above inverts to A = 0.9330127, cos iota = 0.2679492 (= 2 - sqrt 3),
        // psi = 0.3, phi0 = 1.1. Printed to 7 decimals, so 5e-8; psi and phi0 are exact inputs (1e-12).
        var physical = new FStatisticAmplitudes(0.12276227, 0.62389222, -0.86360499, -0.31602901).ToExtrinsics();
        Assert.Equal(0.9330127, physical.Amplitude, 5e-8);
        Assert.Equal(0.2679492, physical.CosInclination, 5e-8);
        var exact = FStatisticAmplitudes.FromPolarisationAmplitudes(1.0, 0.5, 0.3, 1.1).ToExtrinsics();
        Assert.Equal(2.0 - Math.Sqrt(3.0), exact.CosInclination, 1e-12);
        Assert.Equal(0.3, exact.PolarisationRad, 1e-12);
        Assert.Equal(1.1, exact.InitialPhaseRad, 1e-12);
    }

    [Fact]
    public void Any_amplitude_vector_round_trips_through_physical_parameters()
    {
        // Derived (FStatisticAmplitudes remarks): every real 4-vector belongs to a physical point; an independent
        // check found a -> physical -> a to 3e-15. With the
        // psi/phi0 reduction into [0, pi/2) x [0, 2 pi) we allow 1e-12 of |a|. Also the identities
        // A+^2 + Ax^2 = |a|^2 and A+ Ax = a1 a4 - a2 a3 (derived from the same formulas).
        var random = new Random(5);
        for (int i = 0; i < 2000; i++)
        {
            var a = new FStatisticAmplitudes(Normal(random), Normal(random), Normal(random), Normal(random));
            var physical = a.ToExtrinsics();
            Assert.InRange(physical.CosInclination, -1.0, 1.0);
            Assert.InRange(physical.PolarisationRad, 0.0, 0.5 * Math.PI);
            Assert.InRange(physical.InitialPhaseRad, 0.0, 2.0 * Math.PI);
            var back = FStatisticAmplitudes.FromExtrinsics(physical);
            double norm = Math.Sqrt(a.A1 * a.A1 + a.A2 * a.A2 + a.A3 * a.A3 + a.A4 * a.A4);
            Assert.Equal(a.A1, back.A1, 1e-12 * norm);
            Assert.Equal(a.A2, back.A2, 1e-12 * norm);
            Assert.Equal(a.A3, back.A3, 1e-12 * norm);
            Assert.Equal(a.A4, back.A4, 1e-12 * norm);
            double c = physical.CosInclination, plus = physical.Amplitude * (1 + c * c), cross = 2 * physical.Amplitude * c;
            Assert.Equal(norm * norm, plus * plus + cross * cross, 1e-12 * norm * norm);
            Assert.Equal(a.A1 * a.A4 - a.A2 * a.A3, plus * cross, 1e-12 * norm * norm);
        }
    }

    private static double Normal(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Noiseless_data_give_twice_F_equal_to_the_squared_SNR_and_the_injected_parameters(bool includeT)
    {
        // Derived (Jaranowski, Królak & Schutz 1998 in our notation): for d = h, a^ = a and 2F = (h|h) = SNR^2 (an
        // independent computation reached 2F/SNR^2 - 1 < 1e-15; we allow 1e-10 for the sum over bins in a different
        // order), and the inversion returns the injected (A, cos iota, psi, phi0) (independently 1e-14; we allow 1e-9 relative).
        var band = new FStatisticTestBand(Generator, Source.FrequencyHz, 8);
        band.AddSignal(Source);
        var statistic = new FStatistic(Generator);
        var result = statistic.Evaluate(GalacticBinaryIntrinsics.Of(Source), includeT ? band.Band : band.BandAE);
        double snr2 = band.SquaredSnr(Source, includeT);
        output.WriteLine($"2F/SNR^2 - 1 = {2 * result.Value / snr2 - 1:E2} (SNR {Math.Sqrt(snr2):F1}), |W|/sqrt(UV) = {result.W.Magnitude / Math.Sqrt(result.U * result.V):F4}");
        Assert.True(result.IsDefined);
        Assert.Equal(snr2, 2 * result.Value, 1e-10 * snr2);
        var recovered = result.Amplitudes.ToExtrinsics();
        var injected = FStatisticAmplitudes.FromExtrinsics(new GalacticBinaryExtrinsics(Source.Amplitude, Math.Cos(Source.InclinationRad), Source.PolarisationRad, Source.InitialPhaseRad)).ToExtrinsics();
        Assert.Equal(Source.Amplitude, recovered.Amplitude, 1e-9 * Source.Amplitude);
        Assert.Equal(Math.Cos(Source.InclinationRad), recovered.CosInclination, 1e-9);
        // The injected psi = 0.7 already lies in [0, pi/2), so the canonical copy is the injected one itself.
        Assert.Equal(Source.PolarisationRad, injected.PolarisationRad, 1e-12);
        Assert.Equal(Source.PolarisationRad, recovered.PolarisationRad, 1e-9);
        Assert.Equal(Source.InitialPhaseRad, recovered.InitialPhaseRad, 1e-9);
        var best = GalacticBinaryIntrinsics.Of(Source).With(recovered);
        Assert.Equal(Source.InclinationRad, best.InclinationRad, 1e-8);
    }

    [Fact]
    public void F_equals_the_log_likelihood_ratio_maximised_numerically_over_the_amplitudes()
    {
        // Jaranowski, Królak & Schutz 1998: F = max over (A, iota, psi, phi0) of ln Lambda = (d|h) - (1/2)(h|h)
        // (derived: in an independent computation Nelder-Mead from 30 starts reached F to 1e-15). Data: signal of SNR ~20 plus seeded Gaussian noise. MathNet Nelder-Mead over
        // (ln A, s, psi, phi0) with cos iota = sin s (every real s is physical), five starts; the best must reach F from
        // below to 1e-7 relative (the simplex stops when the value changes by < 1e-12, far below that), and never
        // exceed it by more than rounding (1e-10 relative).
        var band = new FStatisticTestBand(Generator, Source.FrequencyHz, 8);
        band.AddSignal(Source);
        band.AddNoise(seed: 77);
        var statistic = new FStatistic(Generator);
        var intrinsics = GalacticBinaryIntrinsics.Of(Source);
        double f = statistic.Evaluate(intrinsics, band.Band).Value;
        var likelihood = new GalacticBinaryBandLikelihood(Generator, band.Band);
        double Negative(Vector<double> v) => -likelihood.LogLikelihoodRatio(intrinsics.With(
            new GalacticBinaryExtrinsics(Math.Exp(v[0]), Math.Sin(v[1]), v[2], v[3])));
        var objective = ObjectiveFunction.Value(Negative);
        var solver = new NelderMeadSimplex(1e-12, 20000);
        var random = new Random(3);
        double best = double.NegativeInfinity;
        for (int start = 0; start < 5; start++)
        {
            var guess = Vector<double>.Build.DenseOfArray([Math.Log(Source.Amplitude) + random.NextDouble() - 0.5,
                random.NextDouble() * 3 - 1.5, random.NextDouble() * Math.PI, random.NextDouble() * 2 * Math.PI]);
            var found = solver.FindMinimum(objective, guess, Vector<double>.Build.DenseOfArray([0.3, 0.3, 0.3, 0.3]));
            best = Math.Max(best, -found.FunctionInfoAtMinimum.Value);
        }
        output.WriteLine($"F = {f:F9}, numerical maximum = {best:F9}, relative difference {(f - best) / f:E2}");
        Assert.True(best <= f * (1 + 1e-10), $"numerical maximum {best} exceeds F = {f}");
        Assert.True(best >= f * (1 - 1e-7), $"numerical maximum {best} below F = {f}");
    }

    [Fact]
    public void Twice_F_in_pure_noise_averages_four()
    {
        // Jaranowski, Królak & Schutz 1998 (derived in FStatisticFalseAlarm): with noise only, 2F is chi-square with 4
        // degrees of freedom (mean 4, variance 8). 400 seeded
        // frequency-domain Gaussian realisations at fixed intrinsic parameters: the mean has standard deviation
        // sqrt(8/400) = 0.141; asserting |mean - 4| <= 0.57 (4 sigma) fails falsely with probability ~6e-5. The sample
        // variance (expected 8) is printed.
        var band = new FStatisticTestBand(Generator, Source.FrequencyHz, 8);
        var statistic = new FStatistic(Generator);
        var intrinsics = GalacticBinaryIntrinsics.Of(Source);
        const int realisations = 400;
        double sum = 0, sumSquares = 0;
        for (int seed = 0; seed < realisations; seed++)
        {
            band.Clear();
            band.AddNoise(1000 + seed);
            double twiceF = 2 * statistic.Evaluate(intrinsics, band.Band).Value;
            sum += twiceF;
            sumSquares += twiceF * twiceF;
        }
        double mean = sum / realisations;
        output.WriteLine($"mean 2F = {mean:F3}, variance {sumSquares / realisations - mean * mean:F2}");
        Assert.InRange(mean, 4.0 - 0.57, 4.0 + 0.57);
    }

    [Fact]
    public void False_alarm_probability_of_a_single_template_matches_the_chi_square_survival()
    {
        // Source: derived: survival function of chi-square with 4 dof, P(2F > 2F0) = (1 + F0) exp(-F0): 4.042768e-2,
        // 4.993992e-4, 4.328423e-8 for F0 = 5, 10, 20; printed to 7 figures, so 1e-6 relative.
        Assert.Equal(4.042768e-2, FStatisticFalseAlarm.SingleTemplate(5.0), 1e-6 * 4.042768e-2);
        Assert.Equal(4.993992e-4, FStatisticFalseAlarm.SingleTemplate(10.0), 1e-6 * 4.993992e-4);
        Assert.Equal(4.328423e-8, FStatisticFalseAlarm.SingleTemplate(20.0), 1e-6 * 4.328423e-8);
        Assert.Equal(1.0, FStatisticFalseAlarm.SingleTemplate(0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => FStatisticFalseAlarm.SingleTemplate(-1.0));
    }

    [Fact]
    public void A_template_outside_the_band_gives_an_undefined_zero_statistic()
    {
        var band = new FStatisticTestBand(Generator, Source.FrequencyHz, 8);
        var result = new FStatistic(Generator).Evaluate(GalacticBinaryIntrinsics.Of(Source) with { FrequencyHz = 6e-3 }, band.Band);
        Assert.False(result.IsDefined);
        Assert.Equal(0.0, result.Value);
    }
}
