using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The stochastic search that turns a starting row into a start for the chains: a climb of the semi-coherent
/// statistic, then a scan of the initial phase and a short climb of the coherent log-likelihood.</summary>
/// <remarks>
/// <para>Stage 1 maximises ρ²_sc (<see cref="SemiCoherentStatistic"/>: amplitude and phase maximised per segment, so a
/// template that keeps phase over a segment, not the whole record, already collects the power; Gair et al. 2004,
/// Class. Quantum Grav. 21, S1595, arXiv:gr-qc/0405137, reference from memory) by a (1+1) random climb in the scaled
/// coordinates: each trial moves either one coordinate or all of them by a Gaussian step whose width falls
/// geometrically from <c>search_step_sigma</c> to 0.3 posterior widths; a trial is kept when the statistic grows
/// (common practice: an annealed random search). Stage 2 sets Φ0 to the best of 16 values over its period (the
/// semi-coherent statistic cannot see it), then climbs ln L the same way for a third of the evaluations with steps
/// from 3 to 0.1 widths. The result is deterministic for the same data, start and stream.</para>
/// </remarks>
internal static class InspiralStartSearch
{
    private const int PhaseTrials = 16;

    /// <summary>Runs the search from scaled point <paramref name="x"/> (changed in place) and returns the final ρ²_sc.</summary>
    public static double Run(InspiralFitModel model, SemiCoherentStatistic statistic, int evaluations, double stepSigma, Span<double> x, ref RandomStream random)
    {
        var coordinates = model.Coordinates;
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
        double Coherent(double[] point) =>
            double.IsFinite(model.LogPrior(point)) ? model.LogLikelihood(point) : double.NegativeInfinity;

        double best = Climb(Semi, x, evaluations, stepSigma, 0.3, ref random);

        // Φ0 (index 11) over one period, in scaled units.
        double[] trial = new double[x.Length], start = x.ToArray();
        double period = 2 * Math.PI / coordinates.Scales[11];
        double bestPhase = x[11], bestLogL = Coherent(start);
        for (int k = 1; k < PhaseTrials; k++)
        {
            start.CopyTo(trial, 0);
            trial[11] = x[11] + period * k / PhaseTrials;
            double value = Coherent(trial);
            if (value > bestLogL) (bestLogL, bestPhase) = (value, trial[11]);
        }
        x[11] = bestPhase;
        Climb(Coherent, x, Math.Max(evaluations / 3, 1), Math.Min(3, stepSigma), 0.1, ref random);
        return double.IsFinite(best) ? Semi(x.ToArray()) : best;
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
