using System.Numerics;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A deterministic search that gives a worker's chains their starting sources: repeatedly take the loudest
/// F-statistic cell of the residual, refine it by a pattern search on F, fit its amplitudes, subtract it, until no cell
/// is above the stopping threshold.</summary>
/// <remarks>
/// <para>Only the starting point of the chains, not a move, so the posterior is unaffected. It matters because births
/// from a coarse map place a loud source imprecisely: the first birth fits part of it, later births patch the remainder
/// with extra sources, and reversible jump without split/merge moves rarely undoes such a patchwork (a death loses the
/// patch's share of ln L). Starting from one well-placed source per signal avoids that local mode; the sampler then
/// adds, removes and moves sources as usual. Hierarchical search before sampling is standard for these sources
/// (Crowder &amp; Cornish 2007, PRD 75, 043008, cited from memory; the stopping rule and the search are ours).</para>
/// <para>After the greedy pass the sources are backfitted (Hastie &amp; Tibshirani 1990, Generalized Additive Models,
/// §4.4, the algorithm; its use here is ours): each is refitted against the data minus all the others and dropped
/// if it no longer passes the stopping threshold, which removes companions that only patched a loud neighbour's
/// misfit.</para>
/// <para>Stopping: F ≥ <see cref="StoppingF"/> = 25, i.e. 2F ≥ 50 (ρ ≈ 7). In noise alone 2F is χ² with 4 degrees of
/// freedom, P(F ≥ 25) = e^{−25}·26 ≈ 4·10⁻¹⁰ per cell, so a map of 10⁵ cells starts no chain on noise.</para>
/// </remarks>
internal static class GreedyFStatisticSearch
{
    public const double StoppingF = 25.0;

    // Two passes: the first moves the loud sources off their neighbour-biased fits, the second lets the companions that
    // patched them fall below the threshold. Each pass costs about one compass search per source.
    private const int BackfittingPasses = 2;

    public static List<GalacticBinaryParameters> Run(FStatistic statistic, GalacticBinaryBand residual, FStatisticGrid grid, int maxSources)
    {
        var a = (Complex[])residual.DataA.Clone();
        var e = (Complex[])residual.DataE.Clone();
        var t = residual.DataT is null ? null : (Complex[])residual.DataT.Clone();
        var working = new GalacticBinaryBand(residual.Window, residual.DfHz, a, e, residual.InverseA, residual.InverseE, t, residual.InverseT);
        var found = new List<GalacticBinaryParameters>();
        var generator = statistic.Generator;
        var template = (A: new Complex[a.Length], E: new Complex[a.Length], T: t is null ? null : new Complex[a.Length]);
        // After each subtraction only the cells whose templates reach the subtracted source's bins change; the map is
        // updated there (bit for bit the full recomputation, at a fraction of its cost).
        FStatisticMapTracker? map = null;
        while (found.Count < maxSources)
        {
            if (map is null) map = new FStatisticMapTracker(statistic, working, grid);
            else map.Refresh(statistic, working, generator.TemplateBins(found[^1].FrequencyHz, found[^1].FrequencyDerivativeHzS));
            int best = map.BestCell();
            if (!(map[best] >= StoppingF)) break;
            var point = Refine(statistic, working, grid, grid.Centre(best), map[best]);
            var result = statistic.Evaluate(point, working);
            if (!result.IsDefined) break;
            var source = point.With(result.Amplitudes.ToExtrinsics());
            found.Add(source);
            Array.Clear(template.A);
            Array.Clear(template.E);
            if (template.T is not null) Array.Clear(template.T);
            generator.AddResponse(source, working.Window, template.A, template.E, template.T);
            Subtract(working, template, 1.0);
        }
        for (int pass = 0; pass < BackfittingPasses && found.Count > 0; pass++)
            Backfit(statistic, working, grid, found, template);
        return found;
    }

    // One backfitting pass: each source in turn is put back into the residual, refined against the data minus all the
    // others, and subtracted again, or dropped when F there is below the stopping threshold. A source found early is
    // fitted with its unsubtracted neighbours present and ends slightly off; the next pick then fits that misfit as a
    // companion a bin or so away. Refitting each source without the others' share undoes that, and a companion whose
    // only job was to patch the misfit loses its F and is dropped.
    private static void Backfit(FStatistic statistic, GalacticBinaryBand working, FStatisticGrid grid, List<GalacticBinaryParameters> found,
        (Complex[] A, Complex[] E, Complex[]? T) template)
    {
        for (int i = 0; i < found.Count;)
        {
            Render(statistic.Generator, found[i], working, template);
            Subtract(working, template, -1.0);
            var start = new GalacticBinaryIntrinsics(found[i].FrequencyHz, found[i].FrequencyDerivativeHzS, found[i].EclipticLatitudeRad, found[i].EclipticLongitudeRad);
            var point = Refine(statistic, working, grid, start, statistic.Evaluate(start, working).Value);
            var result = statistic.Evaluate(point, working);
            if (!result.IsDefined || !(result.Value >= StoppingF))
            {
                found.RemoveAt(i);
                continue;
            }
            found[i] = point.With(result.Amplitudes.ToExtrinsics());
            Render(statistic.Generator, found[i], working, template);
            Subtract(working, template, 1.0);
            i++;
        }
    }

    private static void Render(GalacticBinaryTemplateGenerator generator, in GalacticBinaryParameters source, GalacticBinaryBand band,
        (Complex[] A, Complex[] E, Complex[]? T) template)
    {
        Array.Clear(template.A);
        Array.Clear(template.E);
        if (template.T is not null) Array.Clear(template.T);
        generator.AddResponse(source, band.Window, template.A, template.E, template.T);
    }

    // residual −= sign · template, channel by channel.
    private static void Subtract(GalacticBinaryBand residual, (Complex[] A, Complex[] E, Complex[]? T) template, double sign)
    {
        var (a, e, t) = (residual.DataA, residual.DataE, residual.DataT);
        for (int k = 0; k < a.Length; k++)
        {
            a[k] -= sign * template.A[k];
            e[k] -= sign * template.E[k];
            if (t is not null) t[k] -= sign * template.T![k];
        }
    }

    // Compass search on (f0, sin β, λ) from the cell centre, starting with half-cell steps and halving on failure.
    private static GalacticBinaryIntrinsics Refine(FStatistic statistic, GalacticBinaryBand band, FStatisticGrid grid, GalacticBinaryIntrinsics start, double startF)
    {
        double f0 = start.FrequencyHz, sinBeta = Math.Sin(start.EclipticLatitudeRad), lambda = start.EclipticLongitudeRad;
        double bestF = startF;
        double[] steps = [0.5 * grid.FrequencyCellHz, 1.0 / grid.LatitudeCount, Math.PI / grid.LongitudeCount];
        double lowF = grid.FrequencyStartHz, highF = grid.FrequencyStartHz + grid.FrequencyCount * grid.FrequencyCellHz;
        for (int round = 0; round < 60 && steps[0] > 1e-4 * grid.FrequencyCellHz; round++)
        {
            bool improved = false;
            for (int axis = 0; axis < 3; axis++)
            {
                foreach (int sign in (ReadOnlySpan<int>)[1, -1])
                {
                    double nf = f0, ns = sinBeta, nl = lambda;
                    if (axis == 0) nf += sign * steps[0];
                    else if (axis == 1) ns = Math.Clamp(ns + sign * steps[1], -1.0, 1.0);
                    else nl = (nl + sign * steps[2] + 2.0 * Math.PI) % (2.0 * Math.PI);
                    if (nf < lowF || nf >= highF) continue;
                    var candidate = new GalacticBinaryIntrinsics(nf, start.FrequencyDerivativeHzS, Math.Asin(ns), nl);
                    double value = statistic.Evaluate(candidate, band).Value;
                    if (value > bestF)
                    {
                        (bestF, f0, sinBeta, lambda, improved) = (value, nf, ns, nl, true);
                        break;
                    }
                }
            }
            if (!improved)
                for (int i = 0; i < 3; i++) steps[i] *= 0.5;
        }
        return new GalacticBinaryIntrinsics(f0, start.FrequencyDerivativeHzS, Math.Asin(sinBeta), lambda);
    }
}
