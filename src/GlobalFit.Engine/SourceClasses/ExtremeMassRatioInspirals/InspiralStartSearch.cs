using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The stochastic search that turns a starting row into a start for the chains: a climb of the semi-coherent
/// statistic, then a scan of the initial phase and a short climb of the coherent log-likelihood.</summary>
/// <remarks>
/// <para>The semi-coherent stages maximise ρ²_sc (<see cref="SemiCoherentStatistic"/>: amplitude and phase maximised per segment, so a
/// template that keeps phase over a segment, not the whole record, already collects the power; Gair et al. 2004,
/// Class. Quantum Grav. 21, S1595, arXiv:gr-qc/0405137, reference from memory) by a (1+1) random climb in the scaled
/// coordinates: each trial moves either one coordinate or all of them by a Gaussian step whose width falls
/// geometrically to 0.3 posterior widths; a trial is kept when the statistic grows (common practice: an annealed random
/// search). The segment count halves from stage to stage down to one (a single free amplitude and phase), and the
/// largest step shrinks by 3 each time from <c>search_step_sigma</c>: a hierarchy from a statistic that tolerates large
/// phase errors to one that does not. The last stage sets Φ0, γ̃0 and α0 in turn, twice round, to the best of 16
/// values over each one's period (the semi-coherent statistics leave the sidebands' common phase free), then climbs the coherent ln L for as many evaluations again with steps from 1 to
/// 0.1 widths. The result is deterministic for the same data, start and stream.</para>
/// </remarks>
internal static class InspiralStartSearch
{
    private const int PhaseTrials = 16;

    /// <summary>Runs the search from scaled point <paramref name="x"/> (changed in place) and returns the final ρ²_sc of
    /// the finest segmentation.</summary>
    /// <param name="model">The model of the update (prior, coordinates, coherent likelihood).</param>
    /// <param name="statistics">Semi-coherent statistics from the most segments to one, each climbed in turn.</param>
    /// <param name="evaluations">Evaluations of the semi-coherent stages together, and again of the coherent stage.</param>
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
        Climb(Coherent, x, Math.Max(evaluations, 1), 1, 0.1, ref random);
        return first;
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
