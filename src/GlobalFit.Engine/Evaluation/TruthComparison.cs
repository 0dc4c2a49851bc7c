using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.Evaluation;

/// <summary>Compares a class's catalogue with the injected sources of a simulation: which loud injections were found,
/// which were missed, which entries match nothing, and how far each found source's medians lie from the truth in units
/// of its posterior width.</summary>
/// <remarks>
/// <para>Matching: injections with optimal SNR ≥ the threshold whose key parameter lies in the analysed range are
/// "detectable". Injections are taken loudest first, each matched to the nearest unmatched entry whose key parameter lies
/// within the tolerance. An entry left unmatched is "spurious" only if it lies within the tolerance of no injection at all
/// (an entry on a quiet injection is a real, if marginal, detection).</para>
/// <para>Errors in σ: (median − truth)/σ with σ = (95 % − 5 % quantile)/(2 × 1.645), the standard deviation a Gaussian
/// with that central 90 % interval would have.</para>
/// </remarks>
public static class TruthComparison
{
    private const double NinetyPercentHalfWidthInSigma = 1.6448536269514722;

    /// <summary>Compares.</summary>
    /// <param name="entries">The class's catalogue entries.</param>
    /// <param name="truth">The class's truth table (with an <c>snr</c> column).</param>
    /// <param name="keyParameter">Column used to match (e.g. <c>f0_hz</c>).</param>
    /// <param name="tolerance">Largest |entry − truth| of the key parameter for a match.</param>
    /// <param name="rangeLow">Lower end of the analysed range of the key parameter.</param>
    /// <param name="rangeHigh">Upper end.</param>
    /// <param name="snrThreshold">Optimal SNR from which an injection counts as detectable.</param>
    public static ComparisonResult Compare(IReadOnlyList<CatalogueRecord> entries, TruthTable truth, string keyParameter, double tolerance,
        double rangeLow, double rangeHigh, double snrThreshold)
    {
        ArgumentNullException.ThrowIfNull(entries);
        ArgumentNullException.ThrowIfNull(truth);
        int keyColumn = truth.ColumnIndex(keyParameter), snrColumn = truth.ColumnIndex("snr");
        var inRange = Enumerable.Range(0, truth.RowCount).Where(r => truth[r, keyColumn] >= rangeLow && truth[r, keyColumn] < rangeHigh).ToList();
        var detectable = inRange.Where(r => truth[r, snrColumn] >= snrThreshold).OrderByDescending(r => truth[r, snrColumn]).ToList();
        double Key(CatalogueRecord e) => e.Median[e.ParameterNames.IndexOf(keyParameter)];
        var taken = new bool[entries.Count];
        var found = ImmutableArray.CreateBuilder<FoundSource>();
        var missed = ImmutableArray.CreateBuilder<MissedSource>();
        foreach (int row in detectable)
        {
            double value = truth[row, keyColumn];
            int best = -1;
            for (int e = 0; e < entries.Count; e++)
                if (!taken[e] && Math.Abs(Key(entries[e]) - value) <= tolerance && (best < 0 || Math.Abs(Key(entries[e]) - value) < Math.Abs(Key(entries[best]) - value)))
                    best = e;
            if (best < 0) { missed.Add(new MissedSource(truth.Ids[row], value, truth[row, snrColumn])); continue; }
            taken[best] = true;
            found.Add(new FoundSource(truth.Ids[row], entries[best].Id, truth[row, snrColumn], entries[best].Snr, entries[best].Confidence, Errors(entries[best], truth, row)));
        }
        var spurious = ImmutableArray.CreateBuilder<CatalogueRecord>();
        for (int e = 0; e < entries.Count; e++)
        {
            if (taken[e]) continue;
            double key = Key(entries[e]);
            if (!Enumerable.Range(0, truth.RowCount).Any(r => Math.Abs(truth[r, keyColumn] - key) <= tolerance)) spurious.Add(entries[e]);
        }
        return new ComparisonResult(detectable.Count, found.ToImmutable(), missed.ToImmutable(), spurious.ToImmutable());
    }

    private static ImmutableSortedDictionary<string, double> Errors(CatalogueRecord entry, TruthTable truth, int row)
    {
        var errors = ImmutableSortedDictionary.CreateBuilder<string, double>(StringComparer.Ordinal);
        for (int p = 0; p < entry.ParameterNames.Length; p++)
        {
            string name = entry.ParameterNames[p];
            if (!truth.Columns.Contains(name)) continue;
            double sigma = (entry.Upper[p] - entry.Lower[p]) / (2 * NinetyPercentHalfWidthInSigma);
            if (sigma > 0) errors[name] = (entry.Median[p] - truth[row, name]) / sigma;
        }
        return errors.ToImmutable();
    }
}

/// <summary>The result of <see cref="TruthComparison.Compare"/>.</summary>
/// <param name="DetectableCount">Injections at or above the SNR threshold inside the analysed range.</param>
/// <param name="Found">Detectable injections matched to an entry.</param>
/// <param name="Missed">Detectable injections with no entry.</param>
/// <param name="Spurious">Entries near no injection at all.</param>
public sealed record ComparisonResult(int DetectableCount, ImmutableArray<FoundSource> Found, ImmutableArray<MissedSource> Missed, ImmutableArray<CatalogueRecord> Spurious);

/// <summary>A detectable injection and the entry that found it.</summary>
/// <param name="TruthId">The injection.</param>
/// <param name="EntryId">The entry.</param>
/// <param name="InjectedSnr">Optimal SNR of the injection.</param>
/// <param name="EntrySnr">The entry's median SNR.</param>
/// <param name="Confidence">The entry's confidence.</param>
/// <param name="ErrorsInSigma">(median − truth)/σ per parameter.</param>
public sealed record FoundSource(string TruthId, string EntryId, double InjectedSnr, double EntrySnr, double Confidence, ImmutableSortedDictionary<string, double> ErrorsInSigma);

/// <summary>A detectable injection no entry matched.</summary>
/// <param name="TruthId">The injection.</param>
/// <param name="Key">Its key parameter.</param>
/// <param name="InjectedSnr">Its optimal SNR.</param>
public sealed record MissedSource(string TruthId, double Key, double InjectedSnr);
