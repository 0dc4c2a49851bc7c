using GlobalFit.Inference.Random;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Tests.Support;
using MathNet.Numerics.Distributions;

namespace GlobalFit.Inference.Tests.Calibration;

public sealed class SimulationBasedCalibrationTests
{
    [Fact]
    public void Simulation_based_calibration_ranks_of_a_linear_Gaussian_model_are_uniform()
    {
        // Source: Talts, Betancourt, Simpson, Vehtari & Gelman 2018 (arXiv:1804.06788), algorithm 1. For each of
        // 400 replications: θ* ~ N(0, 1), y ~ N(θ*, 0.5²), run the sampler (1000 burn-in steps, then 19 draws
        // thinned by 25, which is several autocorrelation times for this 1-D target), and record the rank of θ*
        // among the draws (0..19). Ranks are uniform on 20 bins iff the sampler is calibrated. Pearson
        // chi-square with 19 degrees of freedom against the 0.999 quantile: false-failure rate 1e-3.
        const int replications = 400, draws = 19, thin = 25, burnIn = 1_000;
        var truthStream = RandomStream.FromSeed(401);
        long[] histogram = new long[draws + 1];
        for (int replication = 0; replication < replications; replication++)
        {
            double truth = truthStream.NextGaussian();
            double observation = truth + 0.5 * truthStream.NextGaussian();
            var model = new ConjugateGaussianModel([observation], priorSigma: 1.0, noiseSigma: 0.5);
            var sampler = new ParallelTemperingSampler<ConjugateGaussianModel>(model, new ParallelTemperingSettings
            {
                Seed = 402,
                StreamId = (ulong)replication,
            });
            sampler.Advance(burnIn);
            int rank = 0;
            for (int n = 0; n < draws; n++)
            {
                sampler.Advance(thin);
                if (sampler.Position(0)[0] < truth)
                {
                    rank++;
                }
            }

            histogram[rank]++;
        }

        double expected = replications / (double)(draws + 1);
        double chiSquare = histogram.Sum(count => (count - expected) * (count - expected) / expected);
        double critical = ChiSquared.InvCDF(draws, 0.999);
        Assert.True(chiSquare < critical, $"SBC chi-square {chiSquare:F1} ≥ {critical:F1}; histogram {string.Join(",", histogram)}");
        Console.WriteLine($"SBC chi-square {chiSquare:F2} (critical {critical:F2}); histogram {string.Join(",", histogram)}");
    }
}
