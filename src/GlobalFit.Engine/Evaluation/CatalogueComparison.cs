using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Evaluation;

/// <summary>A class's catalogue against its injected truth: which injections were found, which were missed, which
/// catalogued sources match no injection, per SNR bin; each found source's parameter errors in posterior σ; and the
/// coverage of the 90 % intervals per parameter.</summary>
/// <remarks>
/// <para>Matching rule (stated by the class's <see cref="ISourceMatcher.Rule"/>): for every pair of a covered injection
/// and a catalogued source, the score is the median, over up to <see cref="RowsPerSource"/> posterior samples evenly
/// spaced through the source's samples (its median row when it carries none), of the overlap of the sample's template
/// with the injection's. Pairs scoring at least the class's threshold are taken best first, each injection and each
/// source at most once (ties: lower injection row, then lower source row). The median over samples rather than the
/// overlap of the median row, because medians of angles and of multimodal sky posteriors need not be a signal any
/// sample resembles.</para>
/// <para>Found: matched injections. Missed: covered injections at or above the detectable SNR that nothing matched
/// (quieter ones are only counted per SNR bin). Spurious: catalogued sources that matched no injection. An injection
/// the matcher does not cover (outside the fitted band) takes no part.</para>
/// <para>Errors: (median − truth)/σ with σ = (upper − lower)/(2 · 1.6449), the 90 % interval's half-width of a Gaussian
/// (derived: Φ⁻¹(0.95) = 1.6449), periodic parameters compared on their circle. Coverage per parameter: the fraction of
/// found injections whose value lies in [lower, upper], with its binomial standard error √(p(1 − p)/n).</para>
/// </remarks>
public static class CatalogueComparison
{
    /// <summary>Posterior samples per source whose overlaps with an injection are scored.</summary>
    public const int RowsPerSource = 16;

    /// <summary>Half-width of a central 90 % interval in Gaussian σ: Φ⁻¹(0.95).</summary>
    public const double NinetyPercentHalfWidthInSigma = 1.6448536269514722;

    /// <summary>Injected-SNR bin edges of the report; the last bin is open.</summary>
    public static ImmutableArray<double> DefaultSnrBinEdges { get; } = [0, 5, 7, 10, 20, 50];

    /// <summary>Compares one class's catalogue with its truth table.</summary>
    /// <param name="sources">The class's catalogued sources (parameters in any order that includes the matcher's columns).</param>
    /// <param name="truth">The class's truth table (the matcher's columns and <c>snr</c>; a missing column other than
    /// <c>fddot_hz_s2</c> is refused).</param>
    /// <param name="matcher">The class's matcher.</param>
    /// <param name="detectableSnr">Injected SNR from which an unmatched injection counts as missed.</param>
    /// <param name="snrBinEdges">Ascending lower edges of the SNR bins (default <see cref="DefaultSnrBinEdges"/>).</param>
    /// <exception cref="ArgumentException">The truth table lacks a parameter column or <c>snr</c>, or a source lacks a
    /// matcher column.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The detectable SNR is negative or not finite.</exception>
    public static ClassComparison Compare(IReadOnlyList<CatalogueRecord> sources, TruthTable truth, ISourceMatcher matcher,
        double detectableSnr, IReadOnlyList<double>? snrBinEdges = null)
    {
        ArgumentNullException.ThrowIfNull(sources);
        ArgumentNullException.ThrowIfNull(truth);
        ArgumentNullException.ThrowIfNull(matcher);
        if (!(detectableSnr >= 0) || double.IsInfinity(detectableSnr))
            throw new ArgumentOutOfRangeException(nameof(detectableSnr), detectableSnr, "must be finite and at least 0");
        var edges = snrBinEdges ?? DefaultSnrBinEdges;
        var columns = matcher.ParameterColumns;
        int snrColumn = ColumnIndex(truth, "snr");
        if (snrColumn < 0) throw new ArgumentException($"the {truth.ClassId} truth table has no snr column", nameof(truth));

        var truthRows = new List<(int Row, double[] Values, double Snr)>();
        for (int r = 0; r < truth.RowCount; r++)
        {
            var values = TruthRow(truth, r, columns);
            if (matcher.Covers(values)) truthRows.Add((r, values, truth[r, snrColumn]));
        }
        var sourceRows = sources.Select(s => SampledRows(s, columns)).ToList();

        var candidates = new List<(double Score, int Truth, int Source)>();
        for (int t = 0; t < truthRows.Count; t++)
            for (int s = 0; s < sources.Count; s++)
            {
                double score = Score(matcher, truthRows[t].Values, sourceRows[s]);
                if (score >= matcher.Threshold) candidates.Add((score, t, s));
            }
        candidates.Sort((x, y) => y.Score != x.Score ? y.Score.CompareTo(x.Score) : x.Truth != y.Truth ? x.Truth.CompareTo(y.Truth) : x.Source.CompareTo(y.Source));
        var truthMatch = new int[truthRows.Count];
        var sourceMatched = new bool[sources.Count];
        Array.Fill(truthMatch, -1);
        var overlapOf = new double[truthRows.Count];
        foreach (var (score, t, s) in candidates)
        {
            if (truthMatch[t] >= 0 || sourceMatched[s]) continue;
            truthMatch[t] = s;
            sourceMatched[s] = true;
            overlapOf[t] = score;
        }

        var found = ImmutableArray.CreateBuilder<FoundInjection>();
        var missed = ImmutableArray.CreateBuilder<MissedInjection>();
        for (int t = 0; t < truthRows.Count; t++)
        {
            var (row, values, snr) = truthRows[t];
            if (truthMatch[t] >= 0)
            {
                var source = sources[truthMatch[t]];
                found.Add(new FoundInjection(truth.Ids[row], source.Id, snr, source.Snr, source.Confidence, overlapOf[t],
                    Errors(source, values, columns, matcher.Periods), Covered(source, values, columns, matcher.Periods))
                {
                    Convergence = source.Convergence,
                });
            }
            else if (snr >= detectableSnr)
            {
                missed.Add(new MissedInjection(truth.Ids[row], snr, [.. values]));
            }
        }
        var spurious = ImmutableArray.CreateBuilder<CatalogueRecord>();
        for (int s = 0; s < sources.Count; s++)
            if (!sourceMatched[s]) spurious.Add(sources[s]);

        var bins = ImmutableArray.CreateBuilder<SnrBin>(edges.Count);
        for (int b = 0; b < edges.Count; b++)
        {
            double low = edges[b], high = b + 1 < edges.Count ? edges[b + 1] : double.PositiveInfinity;
            bool In(double snr) => snr >= low && snr < high;
            int injected = truthRows.Count(t => In(t.Snr));
            int foundHere = Enumerable.Range(0, truthRows.Count).Count(t => truthMatch[t] >= 0 && In(truthRows[t].Snr));
            bins.Add(new SnrBin(low, high, injected, foundHere, injected - foundHere, spurious.Count(s => In(s.Snr))));
        }

        var coverage = ImmutableArray.CreateBuilder<ParameterCoverage>(columns.Length);
        for (int p = 0; p < columns.Length; p++)
        {
            int n = found.Count, inside = found.Count(f => f.InsideInterval[p]);
            double fraction = n == 0 ? double.NaN : (double)inside / n;
            coverage.Add(new ParameterCoverage(columns[p], inside, n, fraction, n == 0 ? double.NaN : Math.Sqrt(fraction * (1 - fraction) / n)));
        }
        return new ClassComparison(truth.ClassId, matcher.Rule, matcher.Threshold, detectableSnr, truth.RowCount - truthRows.Count,
            truthRows.Count(t => t.Snr >= detectableSnr), sources.Count, found.ToImmutable(), missed.ToImmutable(), spurious.ToImmutable(),
            bins.MoveToImmutable(), coverage.MoveToImmutable(), columns);
    }

    private static int ColumnIndex(TruthTable truth, string column)
    {
        for (int c = 0; c < truth.ColumnCount; c++)
            if (truth.Columns[c] == column) return c;
        return -1;
    }

    private static double[] TruthRow(TruthTable truth, int row, ImmutableArray<string> columns)
    {
        var values = new double[columns.Length];
        for (int c = 0; c < columns.Length; c++)
        {
            int at = ColumnIndex(truth, columns[c]);
            if (at < 0) throw new ArgumentException($"the {truth.ClassId} truth table has no column {columns[c]} (columns: {string.Join(", ", truth.Columns)})", nameof(truth));
            values[c] = truth[row, at];
        }
        return values;
    }

    // Up to RowsPerSource sample rows evenly spaced through the source's samples, in the matcher's column order.
    private static List<double[]> SampledRows(CatalogueRecord source, ImmutableArray<string> columns)
    {
        var positions = columns.Select(c =>
        {
            int at = source.ParameterNames.IndexOf(c);
            return at >= 0 ? at : throw new ArgumentException($"source {source.Id} has no parameter {c}", nameof(source));
        }).ToArray();
        int width = source.ParameterNames.Length, count = source.SampleCount;
        var rows = new List<double[]>();
        if (count == 0)
        {
            rows.Add([.. positions.Select(p => source.Median[p])]);
            return rows;
        }
        int taken = Math.Min(RowsPerSource, count);
        for (int k = 0; k < taken; k++)
        {
            int sample = (int)((long)k * count / taken);
            rows.Add([.. positions.Select(p => source.Samples[sample * width + p])]);
        }
        return rows;
    }

    private static double Score(ISourceMatcher matcher, double[] truth, List<double[]> rows)
    {
        var overlaps = rows.Select(r => matcher.Overlap(truth, r)).Order().ToArray();
        int n = overlaps.Length;
        return n % 2 == 1 ? overlaps[n / 2] : 0.5 * (overlaps[n / 2 - 1] + overlaps[n / 2]);
    }

    private static ImmutableArray<double> Errors(CatalogueRecord source, double[] truth, ImmutableArray<string> columns, ImmutableArray<double> periods)
    {
        var errors = new double[columns.Length];
        for (int c = 0; c < columns.Length; c++)
        {
            int p = source.ParameterNames.IndexOf(columns[c]);
            double sigma = (source.Upper[p] - source.Lower[p]) / (2 * NinetyPercentHalfWidthInSigma);
            double difference = source.Median[p] - truth[c];
            if (periods[c] > 0) difference -= periods[c] * Math.Round(difference / periods[c], MidpointRounding.ToEven);
            errors[c] = sigma > 0 ? difference / sigma : double.NaN;
        }
        return [.. errors];
    }

    private static ImmutableArray<bool> Covered(CatalogueRecord source, double[] truth, ImmutableArray<string> columns, ImmutableArray<double> periods)
    {
        var inside = new bool[columns.Length];
        for (int c = 0; c < columns.Length; c++)
        {
            int p = source.ParameterNames.IndexOf(columns[c]);
            double value = truth[c];
            if (periods[c] > 0) value -= periods[c] * Math.Floor(value / periods[c]);
            bool In(double v) => v >= source.Lower[p] && v <= source.Upper[p];
            // A class may summarise an angle around its circular mean, so an interval can reach below 0 or above the
            // period: the truth is inside when any of its images is.
            inside[c] = In(value) || (periods[c] > 0 && (In(value - periods[c]) || In(value + periods[c])));
        }
        return [.. inside];
    }
}

/// <summary>The result of <see cref="CatalogueComparison.Compare"/> for one class.</summary>
/// <param name="ClassId">The class.</param>
/// <param name="Rule">The matching rule, as the class states it.</param>
/// <param name="Threshold">The overlap threshold.</param>
/// <param name="DetectableSnr">Injected SNR from which an injection counts as detectable.</param>
/// <param name="NotCovered">Injections outside what the fit looked at (left out).</param>
/// <param name="Detectable">Covered injections at or above <paramref name="DetectableSnr"/>.</param>
/// <param name="Catalogued">Catalogued sources of the class.</param>
/// <param name="Found">Matched injections, any SNR.</param>
/// <param name="Missed">Detectable injections nothing matched.</param>
/// <param name="Spurious">Catalogued sources that matched no injection.</param>
/// <param name="SnrBins">Counts per injected-SNR bin (spurious sources by their catalogued SNR).</param>
/// <param name="Coverage">Interval coverage per parameter over the found injections.</param>
/// <param name="ParameterColumns">The parameters, in the order of the errors and coverage.</param>
public sealed record ClassComparison(string ClassId, string Rule, double Threshold, double DetectableSnr, int NotCovered, int Detectable,
    int Catalogued, ImmutableArray<FoundInjection> Found, ImmutableArray<MissedInjection> Missed, ImmutableArray<CatalogueRecord> Spurious,
    ImmutableArray<SnrBin> SnrBins, ImmutableArray<ParameterCoverage> Coverage, ImmutableArray<string> ParameterColumns)
{
    /// <summary>Found injections at or above the detectable SNR.</summary>
    public int FoundDetectable => Found.Count(f => f.InjectedSnr >= DetectableSnr);
}

/// <summary>An injection and the catalogued source that matched it.</summary>
/// <param name="TruthId">The injection.</param>
/// <param name="SourceId">The catalogued source.</param>
/// <param name="InjectedSnr">Optimal SNR of the injection.</param>
/// <param name="SourceSnr">The source's median SNR.</param>
/// <param name="Confidence">The source's confidence.</param>
/// <param name="Overlap">The matching score.</param>
/// <param name="ErrorsInSigma">(median − truth)/σ per parameter (NaN where the interval has no width).</param>
/// <param name="InsideInterval">Per parameter, whether the truth lies in the 90 % interval.</param>
public sealed record FoundInjection(string TruthId, string SourceId, double InjectedSnr, double SourceSnr, double Confidence, double Overlap,
    ImmutableArray<double> ErrorsInSigma, ImmutableArray<bool> InsideInterval)
{
    /// <summary>The source's convergence report (in the source's own parameter order), when its class gives one.</summary>
    public SourceConvergence? Convergence { get; init; }
}

/// <summary>A detectable injection nothing matched.</summary>
/// <param name="TruthId">The injection.</param>
/// <param name="InjectedSnr">Its optimal SNR.</param>
/// <param name="Parameters">Its parameters, in the comparison's column order.</param>
public sealed record MissedInjection(string TruthId, double InjectedSnr, ImmutableArray<double> Parameters);

/// <summary>Counts in one injected-SNR bin [Low, High).</summary>
/// <param name="Low">Lower edge.</param>
/// <param name="High">Upper edge (infinity for the last bin).</param>
/// <param name="Injected">Covered injections in the bin.</param>
/// <param name="Found">Of them, matched.</param>
/// <param name="NotFound">Of them, not matched (missed when the bin lies above the detectable SNR).</param>
/// <param name="Spurious">Spurious sources whose catalogued SNR lies in the bin.</param>
public sealed record SnrBin(double Low, double High, int Injected, int Found, int NotFound, int Spurious);

/// <summary>How often the 90 % interval of one parameter held the truth.</summary>
/// <param name="Parameter">The parameter.</param>
/// <param name="Inside">Found injections whose value lay inside.</param>
/// <param name="Count">Found injections.</param>
/// <param name="Fraction">Inside / Count (NaN when nothing was found).</param>
/// <param name="StandardError">Its binomial standard error √(p(1 − p)/n).</param>
public sealed record ParameterCoverage(string Parameter, int Inside, int Count, double Fraction, double StandardError);
