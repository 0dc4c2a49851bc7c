using GlobalFit.Inference.LinearAlgebra;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The search that turns a starting row into a start for the chains: climbs of semi-coherent statistics from
/// many segments to one, scans of the three phases, a short climb of the coherent log-likelihood and a few
/// Levenberg–Marquardt steps.</summary>
/// <remarks>
/// <para>The semi-coherent stages maximise ρ²_sc (<see cref="SemiCoherentStatistic"/>: amplitude and phase maximised per segment, so a
/// template that keeps phase over a segment, not the whole record, already collects the power; Gair et al. 2004,
/// Class. Quantum Grav. 21, S1595, arXiv:gr-qc/0405137, reference from memory) by a (1+1) random climb in the scaled
/// coordinates: each trial moves either one coordinate or all of them by a Gaussian step whose width falls
/// geometrically to 0.3 posterior widths; a trial is kept when the statistic grows (common practice: an annealed random
/// search). The segment count halves from stage to stage down to one (a single free amplitude and phase), and the
/// largest step shrinks by 3 each time from <c>search_step_sigma</c>: a hierarchy from a statistic that tolerates large
/// phase errors to one that does not. The last stage sets Φ0, γ̃0 and α0 in turn, twice round, to the best of 16
/// values over each one's period (the semi-coherent statistics leave the sidebands' common phase free), then climbs the coherent ln L for a third of the evaluations with steps from 1 to
/// 0.1 widths, and ends with at most 20 Levenberg–Marquardt iterations (<see cref="Refine"/>). The result is deterministic for the same data, start and stream.</para>
/// </remarks>
internal static class InspiralStartSearch
{
    private const int PhaseTrials = 16;

    /// <summary>Levenberg–Marquardt iterations that end the search.</summary>
    public const int RefineIterations = 20;

    /// <summary>Runs the search from scaled point <paramref name="x"/> (changed in place) and returns the ρ²_sc the
    /// first (most-segmented) stage reached.</summary>
    /// <param name="model">The model of the update (prior, coordinates, coherent likelihood).</param>
    /// <param name="statistics">Semi-coherent statistics from the most segments to one, each climbed in turn.</param>
    /// <param name="evaluations">Evaluations of the semi-coherent stages together; the coherent climb gets a third as many.</param>
    /// <param name="stepSigma">Largest step, in scaled units.</param>
    /// <param name="x">Start, and result.</param>
    /// <param name="random">The search's stream.</param>
    public static double Run(InspiralFitModel model, IReadOnlyList<SemiCoherentStatistic> statistics, int evaluations, double stepSigma, Span<double> x, ref RandomStream random)
    {
        var coordinates = model.Coordinates;
        double Coherent(double[] point) =>
            double.IsFinite(model.LogPrior(point)) ? model.LogLikelihood(point) : double.NegativeInfinity;

        // Fewer segments keep phase over longer stretches: each stage starts where the coarser one ended, with steps
        // that shrink as the statistic becomes more selective.
        double first = double.NaN;
        for (int stage = 0; stage < statistics.Count; stage++)
        {
            var statistic = statistics[stage];
            double Semi(double[] point)
            {
                if (!double.IsFinite(model.LogPrior(point))) return double.NegativeInfinity;
                try
                {
                    return statistic.Evaluate(coordinates.ToParameters(point));
                }
                catch (ArgumentOutOfRangeException)
                {
                    return double.NegativeInfinity;
                }
            }
            double top = stepSigma / Math.Pow(3, stage);
            double value = Climb(Semi, x, Math.Max(evaluations / statistics.Count, 1), Math.Max(top, 0.3), 0.3, ref random);
            if (stage == 0) first = value;
        }

        // The three phases (Φ0, γ̃0, α0: indices 11-13) in turn, each over one period in scaled units, twice round.
        double[] trial = new double[x.Length], current = x.ToArray();
        double bestLogL = Coherent(current);
        for (int round = 0; round < 2; round++)
            foreach (int index in (ReadOnlySpan<int>)[11, 12, 13])
            {
                double period = 2 * Math.PI / coordinates.Scales[index], origin = current[index], best = origin;
                for (int k = 1; k < PhaseTrials; k++)
                {
                    current.CopyTo(trial, 0);
                    trial[index] = origin + period * k / PhaseTrials;
                    double value = Coherent(trial);
                    if (value > bestLogL) (bestLogL, best) = (value, trial[index]);
                }
                current[index] = best;
            }
        current.CopyTo(x);
        Climb(Coherent, x, Math.Max(evaluations / 3, 1), 1, 0.1, ref random);
        Refine(model, x, RefineIterations);
        return first;
    }

    /// <summary>Levenberg–Marquardt on ln L from <paramref name="x"/> (changed in place): steps δ solve
    /// (F + μ diag F) δ = g with F the Fisher matrix and g = (d − h | ∂h) the gradient, the Gauss–Newton model of a
    /// least-squares likelihood (Levenberg 1944, Q. Appl. Math. 2, 164; Marquardt 1963, J. SIAM 11, 431; from memory);
    /// μ falls by 3 after a step that raises ln L and rises by 10 after one that does not. Each iteration costs a Fisher
    /// matrix (29 templates).</summary>
    /// <returns>ln L at the result.</returns>
    public static double Refine(InspiralFitModel model, Span<double> x, int iterations)
    {
        int d = x.Length;
        var fisher = new double[d * d];
        var system = new double[d * d];
        var gradient = new double[d];
        var step = new double[d];
        double[] current = x.ToArray(), trial = new double[d];
        double value = double.IsFinite(model.LogPrior(current)) ? model.LogLikelihood(current) : double.NegativeInfinity;
        double damping = 1e-3;
        for (int iteration = 0; iteration < iterations; iteration++)
        {
            model.FisherAndGradient(current, fisher, gradient);
            bool improved = false;
            for (int attempt = 0; attempt < 6 && !improved; attempt++)
            {
                fisher.CopyTo(system, 0);
                for (int i = 0; i < d; i++) system[i * d + i] += damping * Math.Max(fisher[i * d + i], 1e-9);
                if (!Solve(system, gradient, step, d)) { damping *= 10; continue; }
                for (int i = 0; i < d; i++) trial[i] = current[i] + step[i];
                double candidate = double.IsFinite(model.LogPrior(trial)) ? model.LogLikelihood(trial) : double.NegativeInfinity;
                if (candidate > value)
                {
                    (value, current, trial) = (candidate, trial, current);
                    damping = Math.Max(damping / 3, 1e-9);
                    improved = true;
                }
                else
                {
                    damping *= 10;
                }
            }
            if (!improved) break;
        }
        current.CopyTo(x);
        return value;
    }

    // Cholesky solve of the symmetric positive-definite system A δ = b (A overwritten); false when A is not positive definite.
    private static bool Solve(double[] a, double[] b, double[] solution, int n)
    {
        if (!SmallDenseMatrix.CholeskyInPlace(a, n)) return false;
        for (int i = 0; i < n; i++)
        {
            double sum = b[i];
            for (int k = 0; k < i; k++) sum -= a[i * n + k] * solution[k];
            solution[i] = sum / a[i * n + i];
        }
        for (int i = n - 1; i >= 0; i--)
        {
            double sum = solution[i];
            for (int k = i + 1; k < n; k++) sum -= a[k * n + i] * solution[k];
            solution[i] = sum / a[i * n + i];
        }
        return true;
    }

    private static double Climb(Func<double[], double> score, Span<double> x, int evaluations, double firstStep, double lastStep, ref RandomStream random)
    {
        double[] current = x.ToArray(), trial = new double[x.Length];
        double value = score(current);
        double ratio = lastStep / firstStep;
        for (int k = 0; k < evaluations; k++)
        {
            double step = firstStep * Math.Pow(ratio, (double)k / Math.Max(evaluations - 1, 1));
            current.CopyTo(trial, 0);
            if (random.NextDouble() < 0.5)
            {
                trial[random.NextInt(trial.Length)] += step * random.NextGaussian();
            }
            else
            {
                // Moving all fourteen at once: each by step/√d, so the length of the move stays the step.
                double each = step / Math.Sqrt(trial.Length);
                for (int i = 0; i < trial.Length; i++) trial[i] += each * random.NextGaussian();
            }
            double candidate = score(trial);
            if (candidate > value) (value, current, trial) = (candidate, trial, current);
        }
        current.CopyTo(x);
        return value;
    }
}
