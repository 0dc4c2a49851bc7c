using System.Diagnostics;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using MathNet.Numerics.LinearAlgebra;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class HeterodynedLikelihoodTests(LoudBinaryScenario scenario, ITestOutputHelper output) : IClassFixture<LoudBinaryScenario>
{
    [Fact]
    public void Heterodyned_likelihood_is_exact_at_the_reference()
    {
        // At the reference r ≡ 1, so the binned sums reproduce (d|h0) and (h0|h0) up to rounding (1e-9 of ~5e5).
        var heterodyned = new MassiveBlackHoleBinaryHeterodynedLikelihood(scenario.Generator.WithOwnBuffers(), scenario.Data, scenario.Truth);
        double full = scenario.Full.LogLikelihoodRatio(scenario.Truth);
        Assert.Equal(full, heterodyned.LogLikelihoodRatio(scenario.Truth), 1e-9 * Math.Abs(full));
    }

    [Fact]
    public void Heterodyned_likelihood_matches_the_full_one_on_posterior_like_draws()
    {
        // Twenty draws from the Fisher-matrix Gaussian at the true point (seed 17) of an SNR-1000 injection in noise, kept only
        // if they are posterior-like: lnL within 15.6 of the truth's (half the 99.9 % quantile of χ² with 11 degrees of
        // freedom). The Fisher Gaussian is wider than the likelihood along the distance–inclination–sky direction, where some
        // draws fall hundreds below; those are not posterior samples. Requirement: |heterodyned − full| < 0.1 for every kept draw
        // (Zackay, Dai & Venumadhav 2018, arXiv:1806.08792, aim at errors ≪ 1).
        double atTruth = scenario.Full.LogLikelihoodRatio(scenario.Truth);
        var draws = new List<MassiveBlackHoleBinaryParameters>();
        var fullValues = new List<double>();
        int tried = 0;
        double spread = 0;
        foreach (var p in FisherDraws(80, seed: 17))
        {
            tried++;
            double full = scenario.Full.LogLikelihoodRatio(p);
            if (full < atTruth - 15.6) continue;
            spread = Math.Max(spread, Math.Abs(full - atTruth));
            draws.Add(p);
            fullValues.Add(full);
            if (draws.Count == 20) break;
        }
        output.WriteLine($"kept {draws.Count} of {tried} Fisher draws");
        Assert.Equal(20, draws.Count);
        // The error for a few bin widths ε, to document the choice of the default.
        foreach (double step in new[] { 0.15, 0.2, 0.3, 0.4 })
        {
            var trial = new MassiveBlackHoleBinaryHeterodynedLikelihood(scenario.Generator.WithOwnBuffers(), scenario.Data, scenario.Truth, step);
            double error = draws.Select((p, i) => Math.Abs(trial.LogLikelihoodRatio(p) - fullValues[i])).Max();
            output.WriteLine($"epsilon {step}: {trial.BinCount} bins, worst |dlnL| {error:E2}");
        }
        var heterodyned = new MassiveBlackHoleBinaryHeterodynedLikelihood(scenario.Generator.WithOwnBuffers(), scenario.Data, scenario.Truth);
        double worst = draws.Select((p, i) => Math.Abs(heterodyned.LogLikelihoodRatio(p) - fullValues[i])).Max();
        var (fullMicroseconds, fastMicroseconds) = Timings(heterodyned, draws[0]);
        output.WriteLine($"bins {heterodyned.BinCount} over {scenario.Window.Count} fine bins; worst |dlnL| {worst:E2}; " +
                         $"largest lnL offset of the draws from the truth {spread:F1}; full {fullMicroseconds:F0} us, " +
                         $"heterodyned {fastMicroseconds:F1} us, ratio {fullMicroseconds / fastMicroseconds:F0}");
        Assert.True(worst < 0.1, $"worst error {worst}");

        // In use the reference is a point near the peak, not the truth: moved to the first draw, the error on the others stays
        // below 0.1 as well.
        heterodyned.UpdateReference(draws[0]);
        double moved = draws.Skip(1).Select((p, i) => Math.Abs(heterodyned.LogLikelihoodRatio(p) - fullValues[i + 1])).Max();
        output.WriteLine($"reference at a draw: worst |dlnL| {moved:E2} with {heterodyned.BinCount} bins");
        Assert.True(moved < 0.1, $"worst error with a moved reference {moved}");
    }

    [Fact]
    public void Recomputed_summaries_follow_a_changed_residual()
    {
        // Scale the data in place (a stand-in for a residual update), recompute the summaries, compare at one draw.
        var data = new GlobalFit.Physics.MassiveBlackHoleBinaries.MassiveBlackHoleBinaryData(scenario.Data.Window, scenario.Data.DfHz,
            scenario.Data.Channels.Select(c => (System.Numerics.Complex[])c.Clone()).ToArray(), scenario.Data.InversePsd);
        var heterodyned = new MassiveBlackHoleBinaryHeterodynedLikelihood(scenario.Generator.WithOwnBuffers(), data, scenario.Truth);
        foreach (var channel in data.Channels)
            for (int k = 0; k < channel.Length; k++) channel[k] *= 0.7;
        heterodyned.UpdateData();
        var full = new MassiveBlackHoleBinaryLikelihood(scenario.Generator.WithOwnBuffers(), data);
        var p = FisherDraws(1, seed: 23)[0];
        Assert.Equal(full.LogLikelihoodRatio(p), heterodyned.LogLikelihoodRatio(p), 0.1);
    }

    private List<MassiveBlackHoleBinaryParameters> FisherDraws(int count, int seed)
    {
        var fisher = Matrix<double>.Build.DenseOfArray(MassiveBlackHoleBinaryFisherMatrix.Compute(scenario.Generator.WithOwnBuffers(), scenario.Data, scenario.Truth));
        var covariance = fisher.Inverse();
        covariance = 0.5 * (covariance + covariance.Transpose());
        var factor = covariance.Cholesky().Factor;
        var random = new Random(seed);
        var truth = Vector<double>.Build.DenseOfArray(scenario.Truth.ToArray());
        var result = new List<MassiveBlackHoleBinaryParameters>();
        while (result.Count < count)
        {
            var z = Vector<double>.Build.Dense(11, _ =>
                Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble()));
            var p = MassiveBlackHoleBinaryParameters.FromSpan((truth + factor * z).ToArray());
            if (p.MassRatio >= 1 && Math.Abs(p.Spin1) <= 1 && Math.Abs(p.Spin2) <= 1 && Math.Abs(p.EclipticLatitudeRad) <= Math.PI / 2 && p.DistanceMpc > 0)
                result.Add(p);
        }
        return result;
    }

    private (double Full, double Heterodyned) Timings(MassiveBlackHoleBinaryHeterodynedLikelihood heterodyned, MassiveBlackHoleBinaryParameters p)
    {
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < 3; i++) scenario.Full.LogLikelihoodRatio(p);
        double full = watch.Elapsed.TotalMicroseconds / 3;
        watch.Restart();
        for (int i = 0; i < 2000; i++) heterodyned.LogLikelihoodRatio(p);
        return (full, watch.Elapsed.TotalMicroseconds / 2000);
    }
}

public sealed class OptimalSnrTests(LoudBinaryScenario scenario) : IClassFixture<LoudBinaryScenario>
{
    [Fact]
    public void Optimal_snr_is_the_injected_value_and_scales_inversely_with_distance()
    {
        // The scenario scales the distance to SNR 1000 with the same weights; the amplitude is ∝ 1/D_L (PhenomDWaveform).
        Assert.Equal(LoudBinaryScenario.TargetSnr, scenario.Full.OptimalSnr(scenario.Truth), 1e-6 * LoudBinaryScenario.TargetSnr);
        var farther = scenario.Truth with { DistanceMpc = 4 * scenario.Truth.DistanceMpc };
        Assert.Equal(LoudBinaryScenario.TargetSnr / 4, scenario.Full.OptimalSnr(farther), 1e-6 * LoudBinaryScenario.TargetSnr);
    }

    [Fact]
    public void Log_likelihood_of_the_true_source_is_half_the_squared_snr_plus_the_noise_term()
    {
        // ln Λ(h) = (n|h) + ½(h|h) for d = h + n, and (n|h) ~ N(0, SNR²): within 5 SNR (false-failure rate ~6e-7) of ½ SNR².
        double value = scenario.Full.LogLikelihoodRatio(scenario.Truth);
        Assert.InRange(value, 0.5e6 - 5 * 1000, 0.5e6 + 5 * 1000);
    }
}
