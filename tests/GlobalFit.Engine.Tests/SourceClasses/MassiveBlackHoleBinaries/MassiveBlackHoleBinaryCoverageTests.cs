using System.Numerics;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Tempering;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Coverage of the worker's estimation (P–P test): binaries drawn from the prior, injected into Gaussian noise of a
/// known PSD, sampled with the worker's sampler settings and proposal mixture on the heterodyned likelihood; the credible
/// level of each true parameter must be uniform over the injections.</summary>
/// <remarks>
/// <para>The prior is the worker's, truncated to a box of ±4 conditional Fisher widths (1/√Γ_ii) around a fixed binary of
/// SNR ≈ 60 (<see cref="MassiveBlackHoleBinaryTarget"/> draws from exactly that truncation). A P–P test is valid for any
/// prior as long as the injections are drawn from it, and the box keeps each posterior to one sky mode, so what is tested is
/// the sampler and the likelihood, not the search for modes. The heterodyne reference is the box's centre for every
/// injection. Noise: each bin's real and imaginary parts Gaussian with variance (T/4) S.</para>
/// <para>Check: for each of the 11 parameters and each level x ∈ {0.1, …, 0.9}, the number of injections whose credible level
/// is at most x lies within the exact binomial band that leaves 0.135 % in each tail (the "3σ" band). False-failure rate
/// for a correct sampler, derived by simulating uniform credible levels for 11 independent parameters (an upper bound when
/// parameters are correlated): 4 % with 10 injections, 12 % with 50. Seeds are fixed, so a given build passes or fails
/// deterministically.</para>
/// </remarks>
public class MassiveBlackHoleBinaryCoverageTests(ITestOutputHelper output)
{
    private const int BurnInSteps = 1500, SampledSteps = 4000, Thinning = 4;

    [Fact]
    public void Credible_levels_of_ten_injections_are_uniform_within_three_sigma_binomial_bands() => Run(10, 20261205);

    [Fact]
    [Trait("Category", "Long")]
    public void Credible_levels_of_fifty_injections_are_uniform_within_three_sigma_binomial_bands() => Run(50, 20261206);

    private void Run(int injections, ulong seed)
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings() with { Temperatures = 2 };
        var prior = settings.Prior();
        var orbits = new RigidOrbits();
        var centre = MassiveBlackHoleBinaryTestData.Binary(2.5e5);
        var silent = MassiveBlackHoleBinaryTestData.Residual(settings, null, null);
        int n = silent.Bins.Count;
        var generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, n, MassiveBlackHoleBinaryTestData.Shape.StartS);
        var weights = new MassiveBlackHoleBinaryData(silent.Bins, silent.DfHz, [new Complex[n], new Complex[n], new Complex[n]],
            [silent.InverseA, silent.InverseE, new double[n]]);
        var fisher = new ReferenceFisher(generator, weights, centre);
        var matrix = new double[121];
        fisher.FisherMatrix(centre.ToArray(), matrix);
        double[] c = centre.ToArray(), lower = new double[11], upper = new double[11];
        for (int i = 0; i < 11; i++)
        {
            double width = 4 / Math.Sqrt(matrix[i * 11 + i]);
            (lower[i], upper[i]) = (c[i] - width, c[i] + width);
        }
        output.WriteLine($"SNR of the centre {MassiveBlackHoleBinaryTestData.Snr(silent, centre):F1}; box half-widths {string.Join(", ", Enumerable.Range(0, 11).Select(i => $"{(upper[i] - lower[i]) / 2:G3}"))}");
        var drawer = new MassiveBlackHoleBinaryTarget(prior, null, lower, upper);
        var levels = new double[injections, 11];
        var random = RandomStream.ForPath(seed, 1, 0);
        var truth = new double[11];
        for (int j = 0; j < injections; j++)
        {
            drawer.DrawFromPrior(truth, ref random);
            var residual = MassiveBlackHoleBinaryTestData.Residual(settings, MassiveBlackHoleBinaryParameters.FromSpan(truth), seed + 1 + (ulong)j);
            var data = new MassiveBlackHoleBinaryData(residual.Bins, residual.DfHz, [residual.Spectra.A, residual.Spectra.E, new Complex[n]],
                [residual.InverseA, residual.InverseE, new double[n]]);
            var likelihood = new MassiveBlackHoleBinaryHeterodynedLikelihood(generator, data, centre, settings.PhaseStepRad);
            var target = new MassiveBlackHoleBinaryTarget(prior, likelihood, lower, upper);
            var samplerSettings = MassiveBlackHoleBinaryFitWorker.SamplerSettings(settings, seed, (ulong)j, fisher, orbits);
            var sampler = new ParallelTemperingSampler<MassiveBlackHoleBinaryTarget>(target, samplerSettings);
            for (int chain = 0; chain < sampler.ChainCount; chain++) sampler.SetPosition(chain, c);
            sampler.Advance(BurnInSteps);
            var below = new int[11];
            int kept = 0;
            for (int step = 0; step < SampledSteps / Thinning; step++)
            {
                sampler.Advance(Thinning);
                var position = sampler.Position(0);
                for (int i = 0; i < 11; i++) if (position[i] < truth[i]) below[i]++;
                kept++;
            }
            for (int i = 0; i < 11; i++) levels[j, i] = (double)below[i] / kept;
            output.WriteLine($"injection {j + 1}: levels {string.Join(" ", Enumerable.Range(0, 11).Select(i => $"{levels[j, i]:F2}"))}");
        }
        var failures = new List<string>();
        for (int i = 0; i < 11; i++)
            for (int step = 1; step <= 9; step++)
            {
                double x = step / 10.0;
                int count = Enumerable.Range(0, injections).Count(j => levels[j, i] <= x);
                var (low, high) = Band(injections, x);
                if (count < low || count > high)
                    failures.Add($"{MassiveBlackHoleBinaryParameters.ColumnNames[i]} at level {x:F1}: {count} of {injections} (band {low}–{high})");
            }
        foreach (var f in failures) output.WriteLine("outside: " + f);
        Assert.Empty(failures);
    }

    // The counts k with P(X ≤ k) ≥ 0.00135 and P(X ≥ k) ≥ 0.00135 for X ~ Binomial(n, x): the normal 3σ tails, exactly.
    private static (int Low, int High) Band(int n, double x)
    {
        const double tail = 0.00135;
        double Pmf(int k) => Math.Exp(LogChoose(n, k) + k * Math.Log(x) + (n - k) * Math.Log(1 - x));
        int low = 0;
        double below = Pmf(0);
        while (below < tail) below += Pmf(++low);
        int high = n;
        double above = Pmf(n);
        while (above < tail) above += Pmf(--high);
        return (low, high);
    }

    private static double LogChoose(int n, int k)
    {
        double sum = 0;
        for (int i = 1; i <= k; i++) sum += Math.Log(n - k + i) - Math.Log(i);
        return sum;
    }
}
