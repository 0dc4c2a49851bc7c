using System.Numerics;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>How much a blind inspiral search spends.</summary>
/// <param name="Draws">Random points of the search box scored first [<c>search_draws</c>].</param>
/// <param name="Chains">Annealed chains started from the best draws [<c>search_chains</c>].</param>
/// <param name="ChainSteps">Steps of each chain at each segment count [<c>search_chain_steps</c>].</param>
/// <param name="Segments">Segments of the first, most tolerant statistic [<c>search_blind_segments</c>]; halved stage by
/// stage down to the start search's <c>search_segments</c>.</param>
public sealed record InspiralBlindSearchSettings(int Draws = 2000, int Chains = 4, int ChainSteps = 300, int Segments = 32);

/// <summary>The result of a blind search.</summary>
/// <param name="Best">The best candidate, its distance set from the amplitude the statistic found.</param>
/// <param name="Statistic">ρ²_sc of the candidate with <paramref name="Segments"/> segments (the last stage's).</param>
/// <param name="Segments">Segments of that statistic.</param>
/// <param name="Evaluations">Semi-coherent evaluations spent.</param>
internal readonly record struct InspiralBlindSearchResult(ExtremeMassRatioInspiralParameters Best, double Statistic, int Segments, long Evaluations)
{
    /// <summary>How far the statistic lies above pure noise, in standard deviations of its noise-only distribution at a
    /// fixed template: (ρ²_sc − 2M)/(2√M), ρ²_sc being χ² with 2M degrees of freedom in noise
    /// (<see cref="SemiCoherentStatistic"/>).</summary>
    public double Significance => (Statistic - 2.0 * Segments) / (2 * Math.Sqrt(Segments));
}

/// <summary>A blind search for one inspiral in a window of the residual: random draws over a search box scored by a
/// many-segment semi-coherent statistic, then annealed chains from the best draws through statistics of fewer and
/// fewer segments.</summary>
/// <remarks>
/// <para>Why this shape: a template that keeps phase only over a short segment collects the power of a signal whose
/// parameters it matches only roughly, so the many-segment statistic has broad peaks that random draws can land on;
/// fewer segments narrow the peaks and raise the signal's share over the noise's 2M (Gair et al. 2004, Class. Quantum
/// Grav. 21, S1595, arXiv:gr-qc/0405137, reference from memory; the hierarchy of segment counts is common practice).</para>
/// <para>Coordinates: the unit cube of <see cref="InspiralSearchBox.At"/> (log-uniform masses and frequency, uniform
/// spin and eccentricity, isotropic angles, uniform phases); the distance is not searched. Chains: Metropolis on
/// exp(ρ²_sc / 2T) (ρ²_sc/2 is the log-likelihood maximised per segment), T falling geometrically from 2√M (the noise's
/// standard deviation of ρ²_sc) to 1 within each stage, steps (one coordinate, or all at once scaled by 1/√14)
/// falling geometrically from 0.05 to 1e-4 of the cube over the whole search; common practice for simulated annealing
/// (Kirkpatrick, Gelatt &amp; Vecchi 1983, Science 220, 671; from memory). Each stage starts every chain at its best point
/// so far. Deterministic for the same data, settings and stream.</para>
/// </remarks>
internal static class InspiralBlindSearch
{
    private const int Dimension = InspiralSamplingCoordinates.Dimension;
    private const double FirstStep = 0.05, LastStep = 1e-4;

    /// <summary>Runs the search.</summary>
    /// <param name="generator">The template generator of the record.</param>
    /// <param name="window">Bins of the data.</param>
    /// <param name="dataA">Residual A over the window.</param>
    /// <param name="dataE">Residual E over the window.</param>
    /// <param name="inverseA">Inverse PSD of A over the window.</param>
    /// <param name="inverseE">Inverse PSD of E over the window.</param>
    /// <param name="box">Where to search.</param>
    /// <param name="settings">How much to spend.</param>
    /// <param name="lastSegments">Segments of the last stage (at least 1, at most <c>settings.Segments</c>).</param>
    /// <param name="random">The search's stream.</param>
    public static InspiralBlindSearchResult Run(ExtremeMassRatioInspiralTemplateGenerator generator, BinWindow window,
        Complex[] dataA, Complex[] dataE, double[] inverseA, double[] inverseE, InspiralSearchBox box,
        InspiralBlindSearchSettings settings, int lastSegments, ref RandomStream random)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(box);
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(lastSegments);
        if (lastSegments > settings.Segments)
            throw new ArgumentOutOfRangeException(nameof(lastSegments), lastSegments, $"must not exceed the first stage's {settings.Segments} segments");
        var ladder = new List<int>();
        for (int m = settings.Segments; m > lastSegments; m /= 2) ladder.Add(m);
        ladder.Add(lastSegments);
        long evaluations = 0;
        var statistic = new SemiCoherentStatistic(generator, window, ladder[0], dataA, dataE, inverseA, inverseE);
        double Score(double[] u)
        {
            evaluations++;
            if (box.At(u) is not { } p) return double.NegativeInfinity;
            try
            {
                return statistic.Evaluate(p);
            }
            catch (ArgumentOutOfRangeException)
            {
                return double.NegativeInfinity;
            }
            catch (InvalidOperationException)
            {
                // The orbit integration gave up (a source at the edge of plunge): no template, not a candidate.
                return double.NegativeInfinity;
            }
        }

        // Draws: the best `Chains` of them (ties to the earlier draw) start the chains.
        int chains = Math.Min(settings.Chains, settings.Draws);
        var starts = new List<(double Value, double[] U)>(chains + 1);
        for (int k = 0; k < settings.Draws; k++)
        {
            double[] u = new double[Dimension];
            for (int i = 0; i < Dimension; i++) u[i] = random.NextDouble();
            double value = Score(u);
            if (!double.IsFinite(value)) continue;
            if (starts.Count == chains && value <= starts[^1].Value) continue;
            int at = starts.FindIndex(s => value > s.Value);
            starts.Insert(at < 0 ? starts.Count : at, (value, u));
            if (starts.Count > chains) starts.RemoveAt(starts.Count - 1);
        }
        if (starts.Count == 0) throw new InvalidOperationException("no draw of the search box gave a template in the window");

        var best = starts.Select(s => s.U).ToArray();
        var bestValue = starts.Select(s => s.Value).ToArray();
        double[] trial = new double[Dimension];
        int totalSteps = Math.Max(1, ladder.Count * settings.ChainSteps - 1);
        for (int stage = 0; stage < ladder.Count; stage++)
        {
            int m = ladder[stage];
            if (stage > 0)
            {
                statistic = new SemiCoherentStatistic(generator, window, m, dataA, dataE, inverseA, inverseE);
                for (int c = 0; c < best.Length; c++) bestValue[c] = Score(best[c]);
            }
            double hot = Math.Max(1, 2 * Math.Sqrt(m));
            for (int c = 0; c < best.Length; c++)
            {
                double[] current = (double[])best[c].Clone();
                double value = bestValue[c];
                for (int k = 0; k < settings.ChainSteps; k++)
                {
                    double fraction = settings.ChainSteps == 1 ? 1 : (double)k / (settings.ChainSteps - 1);
                    double temperature = hot * Math.Pow(1 / hot, fraction);
                    double step = FirstStep * Math.Pow(LastStep / FirstStep, (double)(stage * settings.ChainSteps + k) / totalSteps);
                    current.CopyTo(trial, 0);
                    if (random.NextDouble() < 0.6)
                    {
                        trial[random.NextInt(Dimension)] += step * random.NextGaussian();
                    }
                    else
                    {
                        double each = step / Math.Sqrt(Dimension);
                        for (int i = 0; i < Dimension; i++) trial[i] += each * random.NextGaussian();
                    }
                    for (int i = 0; i < Dimension; i++) trial[i] = Fold(trial[i], InspiralSearchBox.IsPeriodic(i));
                    double candidate = Score(trial);
                    if (!double.IsFinite(candidate)) continue;
                    if (candidate >= value || random.NextLogUniform() < (candidate - value) / (2 * temperature))
                    {
                        (current, trial) = (trial, current);
                        value = candidate;
                        if (value > bestValue[c])
                        {
                            bestValue[c] = value;
                            current.CopyTo(best[c], 0);
                        }
                    }
                }
            }
        }

        int winner = 0;
        for (int c = 1; c < best.Length; c++)
            if (bestValue[c] > bestValue[winner]) winner = c;
        var found = box.At(best[winner])!.Value;
        return new InspiralBlindSearchResult(WithFittedDistance(generator, window, inverseA, inverseE, found, bestValue[winner], ladder[^1]),
            bestValue[winner], ladder[^1], evaluations);
    }

    // The distance at which the template's power equals the excess of the statistic over the noise's mean,
    // ρ²_sc − 2M ≈ a² (h|h) for a template a h that matches (clamped to a tenth of the reference's power).
    private static ExtremeMassRatioInspiralParameters WithFittedDistance(ExtremeMassRatioInspiralTemplateGenerator generator, BinWindow window,
        double[] inverseA, double[] inverseE, in ExtremeMassRatioInspiralParameters p, double statistic, int segments)
    {
        var (a, e) = (new Complex[window.Count], new Complex[window.Count]);
        generator.AddResponse(p, window, a, e, Span<Complex>.Empty);
        double df = generator.FrequencyResolutionHz;
        double power = InnerProduct.SquaredNorm(a, inverseA, df) + InnerProduct.SquaredNorm(e, inverseE, df);
        if (!(power > 0)) return p;
        double excess = Math.Max(statistic - 2.0 * segments, 0.1 * power);
        return p with { DistanceMpc = p.DistanceMpc * Math.Sqrt(power / excess) };
    }

    // Reflects a coordinate into [0, 1], or wraps it when periodic.
    private static double Fold(double x, bool periodic)
    {
        if (periodic) return x - Math.Floor(x);
        x = Math.Abs(x) % 2;
        return x > 1 ? 2 - x : Math.Min(x, 1 - 1e-15);
    }
}
