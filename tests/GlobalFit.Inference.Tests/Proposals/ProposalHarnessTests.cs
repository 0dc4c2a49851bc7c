using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Tests.Support;
using MathNet.Numerics.LinearAlgebra;

namespace GlobalFit.Inference.Tests.Proposals;

/// <summary>
/// One statistical harness for every proposal (after emcee's test_proposal.py): a single untempered chain
/// using only that proposal must reproduce the target's known means and variances. A wrong log proposal
/// ratio or a broken symmetry shows up as a biased moment.
/// </summary>
/// <remarks>
/// Bounds: |estimate − truth| ≤ 4.5 standard errors, the standard error being sd/√ESS of the series
/// (x_i for means, (x_i − μ)² for variances) with the multi-chain ESS of Vehtari et al. 2021. False-failure
/// rate 6.8e-6 per assertion (two-sided normal tail), < 1e-4 per test.
/// </remarks>
public sealed class ProposalHarnessTests
{
    private const double Sigmas = 4.5;

    private static readonly double[] Mean2 = [1.0, -2.0];
    private static readonly Matrix<double> Covariance2 = Matrix<double>.Build.DenseOfArray(new[,] { { 1.0, 0.6 }, { 0.6, 2.0 } });

    private static void AssertGaussianMoments(ProposalSpec proposal, int steps, int burnIn, ulong seed)
    {
        var target = new GaussianTarget(Mean2, Covariance2, -20.0, 20.0);
        var settings = new ParallelTemperingSettings
        {
            Proposals = [proposal],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = seed,
        };
        var sampler = new ParallelTemperingSampler<GaussianTarget>(target, settings);
        var sink = new CollectingSink(4, 2, burnIn);
        sampler.Advance(steps, sink);
        for (int i = 0; i < 2; i++)
        {
            int parameter = i;
            // Source of truth: the target's own mean and covariance (box truncation at ≥ 12σ is negligible).
            MonteCarloBounds.AssertMeanWithin(sink.Chains(parameter), Mean2[parameter], Sigmas, $"{proposal.Name} mean x{parameter}");
            double[][] squares = sink.Chains((r, n) => Math.Pow(sink.Draws[r][parameter][n] - Mean2[parameter], 2));
            MonteCarloBounds.AssertMeanWithin(squares, Covariance2[parameter, parameter], Sigmas, $"{proposal.Name} variance x{parameter}");
        }
    }

    [Fact]
    public void Adaptive_Gaussian_alone_samples_a_correlated_Gaussian() =>
        AssertGaussianMoments(ProposalSpec.AdaptiveGaussian(1.0), steps: 30_000, burnIn: 5_000, seed: 101);

    [Fact]
    public void Differential_evolution_alone_samples_a_correlated_Gaussian() =>
        AssertGaussianMoments(ProposalSpec.DifferentialEvolution(1.0), steps: 40_000, burnIn: 15_000, seed: 102);

    [Fact]
    public void Fisher_eigen_jumps_alone_sample_a_correlated_Gaussian()
    {
        var fisher = new GaussianTarget(Mean2, Covariance2, -20.0, 20.0);
        AssertGaussianMoments(ProposalSpec.FisherEigen(1.0, fisher), steps: 30_000, burnIn: 2_000, seed: 103);
    }

    [Fact]
    public void Prior_draws_alone_sample_a_conjugate_Gaussian_posterior()
    {
        // Source: conjugate normal model (Gelman et al. 2013, Bayesian Data Analysis, 3rd ed., §2.5): prior N(0, 2²), y = 1 with noise 1
        // gives posterior N(0.8, 0.8). Bounds as in the class remarks.
        var model = new ConjugateGaussianModel([1.0], priorSigma: 2.0, noiseSigma: 1.0);
        var sampler = new ParallelTemperingSampler<ConjugateGaussianModel>(model, new ParallelTemperingSettings
        {
            Proposals = [ProposalSpec.PriorDraw(1.0)],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 104,
        });
        var sink = new CollectingSink(4, 1, 500);
        sampler.Advance(20_000, sink);
        MonteCarloBounds.AssertMeanWithin(sink.Chains(0), model.PosteriorMean(0), Sigmas, "prior-draw mean");
        double[][] squares = sink.Chains((r, n) => Math.Pow(sink.Draws[r][0][n] - model.PosteriorMean(0), 2));
        MonteCarloBounds.AssertMeanWithin(squares, model.PosteriorVariance, Sigmas, "prior-draw variance");
    }

    [Fact]
    public void Class_supplied_asymmetric_proposal_with_its_log_ratio_samples_an_exponential()
    {
        // Source: Exp(1) has mean 1 and E[(x − 1)²] = 1. Ignoring the ln x′ − ln x ratio would target
        // e^(−x)/x instead (see the negative control below). Bounds as in the class remarks.
        var sampler = new ParallelTemperingSampler<ExponentialModel>(new ExponentialModel(), new ParallelTemperingSettings
        {
            Proposals = [new ProposalSpec("log-normal-step", 1.0, _ => new LogNormalStepProposal(0.8))],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 105,
        });
        var sink = new CollectingSink(4, 1, 1_000);
        sampler.Advance(30_000, sink);
        MonteCarloBounds.AssertMeanWithin(sink.Chains(0), 1.0, Sigmas, "log-normal step mean");
        MonteCarloBounds.AssertMeanWithin(sink.Chains((r, n) => Math.Pow(sink.Draws[r][0][n] - 1.0, 2)), 1.0, Sigmas, "log-normal step variance");
    }

    [Fact]
    public void Harness_detects_a_proposal_that_omits_its_log_ratio()
    {
        // Negative control: the same multiplicative walk reporting a zero ratio is in detailed balance with
        // e^(−x)/x instead of e^(−x) (not even normalisable: the chain drifts towards 0), so its mean must lie far
        // outside the 4.5σ band around 1 that the correct proposal passes.
        var sampler = new ParallelTemperingSampler<ExponentialModel>(new ExponentialModel(), new ParallelTemperingSettings
        {
            Proposals = [new ProposalSpec("wrong-ratio", 1.0, _ => new ZeroRatioLogNormalStep(0.8))],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 105,
        });
        var sink = new CollectingSink(4, 1, 1_000);
        sampler.Advance(30_000, sink);
        double[][] chains = sink.Chains(0);
        Assert.True(Math.Abs(MonteCarloBounds.Mean(chains) - 1.0) > 10 * MonteCarloBounds.StandardError(chains));
    }

    [Fact]
    public void Wrapped_and_reflected_walks_keep_a_flat_target_uniform()
    {
        // Source: U(0, 1) has mean 1/2 and variance 1/12; a wrong wrap or reflection piles mass at an edge.
        var sampler = new ParallelTemperingSampler<PeriodicUniformModel>(new PeriodicUniformModel(), new ParallelTemperingSettings
        {
            Proposals = [new ProposalSpec("wide-walk", 1.0, _ => new GaussianWalkProposal(0.7))],
            Tempering = new TemperingSettings { ChainsPerTemperature = 4 },
            Seed = 106,
        });
        var sink = new CollectingSink(4, 2, 100);
        sampler.Advance(20_000, sink);
        for (int i = 0; i < 2; i++)
        {
            int parameter = i;
            MonteCarloBounds.AssertMeanWithin(sink.Chains(parameter), 0.5, Sigmas, $"x{parameter} mean");
            MonteCarloBounds.AssertMeanWithin(sink.Chains((r, n) => Math.Pow(sink.Draws[r][parameter][n] - 0.5, 2)), 1.0 / 12.0, Sigmas, $"x{parameter} variance");
            Assert.All(sink.Draws.SelectMany(d => d[parameter]), v => Assert.InRange(v, 0.0, 1.0));
        }
    }

    [Fact]
    public void Prior_draw_candidates_stay_inside_the_bounds()
    {
        var target = new GaussianTarget(Mean2, Covariance2, -3.0, 4.0);
        var proposal = new PriorDrawProposal(target);
        var random = RandomStream.FromSeed(9);
        double[] candidate = new double[2];
        for (int i = 0; i < 10_000; i++)
        {
            double logRatio = proposal.Propose(Mean2, candidate, ref random);
            Assert.True(target.Schema.Contains(candidate));
            Assert.Equal(0.0, logRatio);
        }
    }

    [Fact]
    public void Finite_difference_Fisher_of_a_linear_template_equals_the_analytic_matrix()
    {
        // For h(θ) = A θ the Fisher matrix with weights w is Aᵀ diag(w) A exactly; central differences of a
        // linear function are exact up to rounding, so 1e-9 relative.
        var template = new LinearTemplate();
        double[] weights = [1.0, 2.0, 0.5, 3.0];
        double[] steps = [1e-4, 1e-4];
        double[] matrix = new double[4];
        FiniteDifferenceFisher.Compute(template, [0.3, -0.7], steps, weights, matrix, new double[8], new double[2 + 8]);
        for (int i = 0; i < 2; i++)
        {
            for (int j = 0; j < 2; j++)
            {
                double expected = 0.0;
                for (int k = 0; k < 4; k++)
                {
                    expected += weights[k] * LinearTemplate.A[k, i] * LinearTemplate.A[k, j];
                }

                Assert.Equal(expected, matrix[i * 2 + j], 1e-9 * Math.Abs(expected) + 1e-12);
            }
        }
    }

    private sealed class LinearTemplate : IWhitenedTemplate
    {
        public static readonly double[,] A = { { 1.0, 2.0 }, { -0.5, 0.3 }, { 0.0, 1.5 }, { 2.0, -1.0 } };

        public int Dimension => 2;

        public int TemplateLength => 4;

        public void Template(ReadOnlySpan<double> theta, Span<double> template)
        {
            for (int k = 0; k < 4; k++)
            {
                template[k] = A[k, 0] * theta[0] + A[k, 1] * theta[1];
            }
        }
    }

    private sealed class ZeroRatioLogNormalStep(double scale) : IProposal
    {
        public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
        {
            candidate[0] = current[0] * Math.Exp(scale * random.NextGaussian());
            return 0.0;
        }
    }

    private sealed class GaussianWalkProposal(double sigma) : IProposal
    {
        public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
        {
            for (int i = 0; i < current.Length; i++)
            {
                candidate[i] = current[i] + sigma * random.NextGaussian();
            }

            return 0.0;
        }
    }
}
