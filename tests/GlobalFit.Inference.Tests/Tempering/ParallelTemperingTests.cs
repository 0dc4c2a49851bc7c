using GlobalFit.Inference.Diagnostics;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Tests.Support;
using MathNet.Numerics.LinearAlgebra;

namespace GlobalFit.Inference.Tests.Tempering;

public sealed class ParallelTemperingTests
{
    [Fact]
    public void Correlated_10D_Gaussian_mean_and_covariance_are_recovered()
    {
        // Target: N(μ, Σ) with μ_i = i − 4.5 and Σ_ij = s_i s_j 0.7^|i−j|, s_i = 1 + 0.3 i (source of truth:
        // the target itself; the ±60 box is > 12σ away). 29 checks (10 means, 10 variances, 9 neighbour
        // covariances), each within 4.5 ESS-based standard errors: false-failure rate 6.8e-6 per assertion,
        // < 2e-4 for the test.
        const int d = 10;
        double[] mean = Enumerable.Range(0, d).Select(i => i - 4.5).ToArray();
        var covariance = Matrix<double>.Build.Dense(d, d, (i, j) => (1 + 0.3 * i) * (1 + 0.3 * j) * Math.Pow(0.7, Math.Abs(i - j)));
        var target = new GaussianTarget(mean, covariance, -60.0, 60.0);
        var sampler = new ParallelTemperingSampler<GaussianTarget>(target, new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 201,
        });
        var sink = new CollectingSink(4, d, burnIn: 10_000);
        sampler.Advance(40_000, sink);

        for (int i = 0; i < d; i++)
        {
            int p = i;
            // Vehtari et al. 2021 recommend R̂ < 1.01; with bulk ESS ≈ 3000 per parameter the sampling spread of
            // R̂ − 1 is ~1e-3, so this holds unless the chains disagree.
            Assert.True(ConvergenceDiagnostics.SplitRhat(sink.Chains(p)) < 1.01, $"R-hat x{p}");
            MonteCarloBounds.AssertMeanWithin(sink.Chains(p), mean[p], 4.5, $"mean x{p}");
            MonteCarloBounds.AssertMeanWithin(
                sink.Chains((r, n) => Math.Pow(sink.Draws[r][p][n] - mean[p], 2)), covariance[p, p], 4.5, $"variance x{p}");
            if (p + 1 < d)
            {
                MonteCarloBounds.AssertMeanWithin(
                    sink.Chains((r, n) => (sink.Draws[r][p][n] - mean[p]) * (sink.Draws[r][p + 1][n] - mean[p + 1])),
                    covariance[p, p + 1], 4.5, $"covariance x{p},x{p + 1}");
            }
        }
    }

    [Fact]
    public void Tempering_samples_the_Rosenbrock_banana_with_its_closed_form_moments()
    {
        // Source: BananaModel remarks (a = 1, b = 1/2): E x = 1, Var x = 1/2, E y = 3/2, Var y = 7/2,
        // Cov(x, y) = 1. Bounds: 4.5 ESS-based standard errors, 6.8e-6 per assertion.
        var sampler = new ParallelTemperingSampler<BananaModel>(new BananaModel(), new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings { TemperatureCount = 4, ChainsPerTemperature = 4, MaxTemperature = 20.0 },
            Seed = 202,
        });
        var sink = new CollectingSink(4, 2, burnIn: 10_000);
        sampler.Advance(50_000, sink);
        MonteCarloBounds.AssertMeanWithin(sink.Chains(0), 1.0, 4.5, "E x");
        MonteCarloBounds.AssertMeanWithin(sink.Chains(1), 1.5, 4.5, "E y");
        MonteCarloBounds.AssertMeanWithin(sink.Chains((r, n) => Math.Pow(sink.Draws[r][0][n] - 1.0, 2)), 0.5, 4.5, "Var x");
        MonteCarloBounds.AssertMeanWithin(sink.Chains((r, n) => Math.Pow(sink.Draws[r][1][n] - 1.5, 2)), 3.5, 4.5, "Var y");
        MonteCarloBounds.AssertMeanWithin(
            sink.Chains((r, n) => (sink.Draws[r][0][n] - 1.0) * (sink.Draws[r][1][n] - 1.5)), 1.0, 4.5, "Cov(x, y)");
    }

    [Fact]
    public void Tempering_finds_both_modes_with_their_weights()
    {
        // Source: BimodalModel weights 0.3/0.7. The right-mode indicator's mean must be within 4.5 ESS-based
        // standard errors of 0.7 (6.8e-6 false-failure rate); both modes must be visited by every cold replica.
        var sampler = new ParallelTemperingSampler<BimodalModel>(new BimodalModel(), new ParallelTemperingSettings
        {
            Proposals = [ProposalSpec.AdaptiveGaussian(1.0)],
            Tempering = new TemperingSettings { TemperatureCount = 10, ChainsPerTemperature = 2, MaxTemperature = 3_000.0 },
            Seed = 203,
        });
        var sink = new CollectingSink(2, 2, burnIn: 5_000);
        sampler.Advance(40_000, sink);
        double[][] right = sink.Chains((r, n) => sink.Draws[r][0][n] > 0 ? 1.0 : 0.0);
        MonteCarloBounds.AssertMeanWithin(right, BimodalModel.RightWeight, 4.5, "right-mode weight");
        Assert.All(right, chain => Assert.InRange(chain.Average(), 0.05, 0.95));

        SamplerStatistics statistics = sampler.GetStatistics();
        Assert.All(statistics.SwapAcceptanceRates, rate => Assert.InRange(rate, 0.05, 1.0));
    }

    [Fact]
    public void Untempered_chains_stay_in_the_mode_they_start_in()
    {
        // Same target and local proposal without tempering: crossing needs a ~140-nat uphill excursion, so each
        // chain's mode indicator is constant (probability of a crossing in 4·30000 steps is < e^-100).
        var sampler = new ParallelTemperingSampler<BimodalModel>(new BimodalModel(), new ParallelTemperingSettings
        {
            Proposals = [ProposalSpec.AdaptiveGaussian(1.0)],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 204,
        });
        var sink = new CollectingSink(4, 2, burnIn: 2_000);
        sampler.Advance(30_000, sink);
        double[][] right = sink.Chains((r, n) => sink.Draws[r][0][n] > 0 ? 1.0 : 0.0);
        Assert.All(right, chain => Assert.True(chain.All(v => v == chain[0]), "a chain crossed between modes"));
    }

    [Fact]
    public void Thermodynamic_integration_recovers_the_conjugate_Gaussian_evidence()
    {
        // Source: ConjugateGaussianModel evidence Π N(y_i; 0, τ² + σ²). 24 rungs geometric from T = 1 to 10⁵
        // (ratio 1.65): the [0, 10⁻⁵] segment contributes < 10⁻⁴ nats, leaving the trapezoid rule (reported by
        // the estimator) and Monte-Carlo error: per rung sd(ln L) ≈ √(d/2) = 1 with ESS ≳ 2000 gives se ≲ 0.02,
        // and the Δβ weights sum to 1, so se(ln Z) ≲ 0.02; the bound is 4 × 0.02 plus twice the reported
        // quadrature error (false-failure rate < 1e-4).
        var model = new ConjugateGaussianModel([1.0, -0.5], priorSigma: 2.0, noiseSigma: 0.5);
        var sampler = new ParallelTemperingSampler<ConjugateGaussianModel>(model, new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings
            {
                TemperatureCount = 24, MaxTemperature = 1e5, AdaptLadder = false,
            },
            Seed = 205,
        });
        sampler.Advance(5_000);
        sampler.ResetEvidenceAccumulators();
        sampler.Advance(40_000);
        EvidenceEstimate estimate = sampler.EstimateEvidence();
        Assert.InRange(estimate.LogEvidence, model.LogEvidence() - 0.08 - 2 * estimate.QuadratureError, model.LogEvidence() + 0.08 + 2 * estimate.QuadratureError);
    }

    [Fact]
    public void Ladder_adaptation_keeps_the_ladder_ordered_and_the_ends_fixed()
    {
        var sampler = new ParallelTemperingSampler<BananaModel>(new BananaModel(), new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings { TemperatureCount = 6, MaxTemperature = 1_000.0, AdaptationLag = 100, AdaptationTime = 10 },
            Seed = 206,
        });
        sampler.Advance(5_000);
        double[] betas = sampler.InverseTemperatures.ToArray();
        Assert.Equal(1.0, betas[0]);
        Assert.Equal(1e-3, betas[^1], 12);
        for (int i = 1; i < betas.Length; i++)
        {
            Assert.True(betas[i] < betas[i - 1]);
        }

        Assert.NotEqual(Math.Pow(1_000.0, -1.0 / 5.0), betas[1]);
    }
}
