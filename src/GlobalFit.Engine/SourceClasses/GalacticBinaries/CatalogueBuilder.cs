using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Turns cold-chain samples of variable-size source lists into catalogue sources: sources of different samples
/// that are the same signal are associated by the noise-weighted overlap of their templates.</summary>
/// <remarks>
/// <para>Association: each new sample source is compared with the reference template of every entry (the template of
/// the first source that opened it) whose carrier lies within one template length; it joins the entry with the
/// largest overlap <c>(h_1|h_2)/√((h_1|h_1)(h_2|h_2))</c> (<see cref="Match.Overlap"/>, A and E, no maximisation over
/// time or phase) if that overlap is at least the threshold, else it opens a new entry. Within one sample an entry takes
/// at most one source (the best-matching one; the others try their next choices), because one signal is one source.
/// The default threshold 0.5 is our choice: two sources whose templates overlap by less than half are separately
/// detectable at the SNRs catalogued (overlap 0.5 costs a quarter of ρ² when one is fitted with the other), and noise
/// fluctuations seldom overlap a real source that well. Feed samples after burn-in: a poor first member makes a poor
/// reference.</para>
/// <para>Confidence is the fraction of samples in which the entry appears (the posterior probability that the source is
/// in the model). Deterministic: sources are built in sample order and reported by median f0. Not thread-safe.</para>
/// </remarks>
public sealed class CatalogueBuilder
{
    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly BinWindow _bins;
    private readonly double[] _inverseA;
    private readonly double[] _inverseE;
    private readonly double _dfHz;
    private readonly List<Entry> _entries = [];
    private readonly Complex[] _scratchA;
    private readonly Complex[] _scratchE;
    private readonly GalacticBinarySkyModes _skyModes;
    private long _sampleCount;

    /// <summary>Creates a builder for sources whose templates lie in <paramref name="bins"/>.</summary>
    /// <param name="generator">Template generator of the data record.</param>
    /// <param name="bins">Bins the templates are compared on (e.g. the analysed range plus padding).</param>
    /// <param name="inverseA">1/S_A over the bins.</param>
    /// <param name="inverseE">1/S_E over the bins.</param>
    /// <param name="matchThreshold">Smallest overlap that associates a source with an entry, in (0, 1]; default 0.5.</param>
    /// <exception cref="ArgumentException">A weight array does not cover the bins or the threshold is outside (0, 1].</exception>
    public CatalogueBuilder(GalacticBinaryTemplateGenerator generator, BinWindow bins, double[] inverseA, double[] inverseE, double matchThreshold = 0.5)
    {
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        ArgumentNullException.ThrowIfNull(inverseA);
        ArgumentNullException.ThrowIfNull(inverseE);
        if (inverseA.Length != bins.Count || inverseE.Length != bins.Count)
            throw new ArgumentException($"inverse PSDs must hold the {bins.Count} bins");
        if (!(matchThreshold > 0 && matchThreshold <= 1))
            throw new ArgumentException($"match threshold must lie in (0, 1], got {matchThreshold}", nameof(matchThreshold));
        _bins = bins;
        _inverseA = inverseA;
        _inverseE = inverseE;
        _dfHz = generator.FrequencyResolutionHz;
        MatchThreshold = matchThreshold;
        _skyModes = new GalacticBinarySkyModes(generator);
        _scratchA = new Complex[generator.MaximumEnvelopeLength];
        _scratchE = new Complex[generator.MaximumEnvelopeLength];
    }

    /// <summary>The association threshold.</summary>
    public double MatchThreshold { get; }

    /// <summary>Samples added so far.</summary>
    public long SampleCount => _sampleCount;

    /// <summary>Adds every sample of <paramref name="samples"/>.</summary>
    /// <param name="samples">Cold-chain samples, e.g. <see cref="GalacticBinaryBandUpdate.Samples"/>.</param>
    public void AddRange(IEnumerable<GalacticBinarySample> samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        foreach (var sample in samples) Add(sample.Sources);
    }

    /// <summary>Adds one sample: the sources present in one configuration (possibly several windows' worth).</summary>
    /// <param name="sources">The sources.</param>
    public void Add(IReadOnlyList<GalacticBinaryParameters> sources)
    {
        ArgumentNullException.ThrowIfNull(sources);
        _sampleCount++;
        var templates = sources.Select(Template).ToList();
        // All (source, entry) pairs above threshold, best first; greedy one-to-one assignment.
        var candidates = new List<(double Overlap, int Source, int Entry)>();
        for (int s = 0; s < templates.Count; s++)
            for (int e = 0; e < _entries.Count; e++)
            {
                double overlap = Overlap(templates[s], _entries[e].Reference);
                if (overlap >= MatchThreshold) candidates.Add((overlap, s, e));
            }
        candidates.Sort((x, y) => y.Overlap != x.Overlap ? y.Overlap.CompareTo(x.Overlap) : x.Source != y.Source ? x.Source.CompareTo(y.Source) : x.Entry.CompareTo(y.Entry));
        var sourceTaken = new bool[templates.Count];
        var entryTaken = new bool[_entries.Count];
        foreach (var (_, s, e) in candidates)
        {
            if (sourceTaken[s] || entryTaken[e]) continue;
            sourceTaken[s] = entryTaken[e] = true;
            _entries[e].Add(sources[s], templates[s].Snr);
        }
        for (int s = 0; s < templates.Count; s++)
        {
            if (sourceTaken[s]) continue;
            var entry = new Entry(templates[s]);
            entry.Add(sources[s], templates[s].Snr);
            _entries.Add(entry);
        }
    }

    /// <summary>The sources so far, by median f0.</summary>
    /// <param name="minimumConfidence">Entries below this confidence are left out; default 0 (all).</param>
    /// <param name="minimumSnr">Entries whose median SNR lies below this are left out; default 0 (all).</param>
    public ImmutableArray<CatalogueEntry> Build(double minimumConfidence = 0.0, double minimumSnr = 0.0) =>
        [.. _entries.Select(Summarise).Where(e => e.Confidence >= minimumConfidence && e.MedianSnr >= minimumSnr).OrderBy(e => e.Median.FrequencyHz)];

    private CatalogueEntry Summarise(Entry entry)
    {
        var members = entry.Members;
        GalacticBinaryParameters At(double quantile) => new(
            Quantile(members.Select(m => m.FrequencyHz), quantile),
            Quantile(members.Select(m => m.FrequencyDerivativeHzS), quantile),
            Quantile(members.Select(m => m.Amplitude), quantile),
            Quantile(members.Select(m => m.EclipticLatitudeRad), quantile),
            Quantile(members.Select(m => Wrap(m.EclipticLongitudeRad, 2 * Math.PI)), quantile),
            Quantile(members.Select(m => m.InclinationRad), quantile),
            Quantile(members.Select(m => Wrap(m.PolarisationRad, Math.PI)), quantile),
            Quantile(members.Select(m => Wrap(m.InitialPhaseRad, 2 * Math.PI)), quantile),
            Quantile(members.Select(m => m.SecondFrequencyDerivativeHzS2), quantile));
        var rows = members.Select(m => m.ToTableRow()).ToList();
        int width = GalacticBinaryParameters.TableColumnNames.Length;
        var rhat = new double[width];
        var ess = new double[width];
        for (int c = 0; c < width; c++) (rhat[c], ess[c]) = SourceConvergence.Of(rows.Select(r => r[c]).ToList());
        var convergence = new SourceConvergence([.. rhat], [.. ess], GalacticBinarySkyModes.Names, _skyModes.Fractions(members));
        return new CatalogueEntry((double)members.Count / _sampleCount, members.Count, At(0.5), At(0.05), At(0.95), Quantile(entry.Snrs, 0.5), [.. members], convergence);
    }

    /// <summary>The type-7 sample quantile (linear interpolation between order statistics).</summary>
    private static double Quantile(IEnumerable<double> values, double quantile)
    {
        var sorted = values.Order().ToArray();
        double position = quantile * (sorted.Length - 1);
        int below = (int)Math.Floor(position);
        int above = Math.Min(below + 1, sorted.Length - 1);
        return sorted[below] + (position - below) * (sorted[above] - sorted[below]);
    }

    private static double Wrap(double value, double period)
    {
        double wrapped = value - period * Math.Floor(value / period);
        return wrapped >= period ? 0.0 : wrapped;
    }

    private StoredTemplate Template(GalacticBinaryParameters source)
    {
        var bins = _generator.TemplateBins(source.FrequencyHz, source.FrequencyDerivativeHzS).Intersect(_bins);
        var a = _scratchA.AsSpan(0, bins.Count);
        var e = _scratchE.AsSpan(0, bins.Count);
        a.Clear();
        e.Clear();
        _generator.AddResponse(source, bins, a, e, Span<Complex>.Empty);
        int offset = bins.First - _bins.First;
        double norm = InnerProduct.SquaredNorm(a, _inverseA.AsSpan(offset, bins.Count), _dfHz)
            + InnerProduct.SquaredNorm(e, _inverseE.AsSpan(offset, bins.Count), _dfHz);
        return new StoredTemplate(bins, a.ToArray(), e.ToArray(), norm);
    }

    private double Overlap(StoredTemplate first, StoredTemplate second)
    {
        var shared = first.Bins.Intersect(second.Bins);
        if (shared.Count == 0 || first.SquaredNorm <= 0 || second.SquaredNorm <= 0) return 0.0;
        int i = shared.First - first.Bins.First, j = shared.First - second.Bins.First, w = shared.First - _bins.First;
        double product = InnerProduct.Real(first.A.AsSpan(i, shared.Count), second.A.AsSpan(j, shared.Count), _inverseA.AsSpan(w, shared.Count), _dfHz)
            + InnerProduct.Real(first.E.AsSpan(i, shared.Count), second.E.AsSpan(j, shared.Count), _inverseE.AsSpan(w, shared.Count), _dfHz);
        return product / Math.Sqrt(first.SquaredNorm * second.SquaredNorm);
    }

    private sealed record StoredTemplate(BinWindow Bins, Complex[] A, Complex[] E, double SquaredNorm)
    {
        public double Snr => Math.Sqrt(SquaredNorm);
    }

    private sealed class Entry(StoredTemplate reference)
    {
        public StoredTemplate Reference { get; } = reference;
        public List<GalacticBinaryParameters> Members { get; } = [];
        public List<double> Snrs { get; } = [];

        public void Add(in GalacticBinaryParameters source, double snr)
        {
            Members.Add(source);
            Snrs.Add(snr);
        }
    }
}
