using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

/// <summary>A plain sequential stand-in for the actor engine: updates the windows stage by stage, forms each residual
/// from the data minus the other windows' current templates, hands drifted sources on, and feeds a catalogue.</summary>
internal sealed class BandFitDriver
{
    private readonly BandTestData _data;
    private readonly GalacticBinaryBandWorker[] _workers;
    private readonly WindowSpectra[] _templates;
    private readonly double _catalogueMinSnr;

    public BandFitDriver(GalacticBinaryBandSettings settings, BandTestData data, double durationDays, ulong seed)
    {
        _catalogueMinSnr = settings.CatalogueMinSnr;
        _data = data;
        Plan = GalacticBinaryBandPlan.Create(settings, data.Generator);
        _workers = [.. Plan.Windows.Select(w => new GalacticBinaryBandWorker(settings, w, new GalacticBinaryTemplateGenerator(durationDays * 86400.0, BandTestData.CadenceSeconds), seed))];
        _templates = [.. _workers.Select(w => w.CurrentTemplate())];
        Catalogue = new CatalogueBuilder(data.Generator, data.Bins, data.InverseA, data.InverseE);
    }

    public GalacticBinaryBandPlan Plan { get; }


    public CatalogueBuilder Catalogue { get; }

    public static BinWindow DataBins(GalacticBinaryBandPlan plan) =>
        new(plan.Windows[0].Padded.First, plan.Windows[^1].Padded.End - plan.Windows[0].Padded.First);

    /// <summary>One Gibbs round over both stages; samples go to the catalogue when <paramref name="record"/> is set
    /// (sample n of every window forms global sample n).</summary>
    public void Round(int steps, bool record)
    {
        var samples = new List<GalacticBinarySample>[_workers.Length];
        for (int stage = 0; stage < 2; stage++)
        {
            foreach (var window in Plan.Stage(stage))
            {
                var update = _workers[window.Index].Update(Residual(window), steps);
                _templates[window.Index] = update.Template;
                samples[window.Index] = [.. update.Samples];
            }
        }
        var drifted = _workers.SelectMany(w => w.TakeDriftedSources()).ToList();
        foreach (var group in drifted.GroupBy(d => d.TargetWindow)) _workers[group.Key].Adopt(group);
        for (int i = 0; i < _workers.Length; i++) _templates[i] = _workers[i].CurrentTemplate();
        if (!record) return;
        int count = samples.Min(s => s.Count);
        for (int n = 0; n < count; n++) Catalogue.Add([.. samples.SelectMany(s => s[n].Sources)]);
    }

    private GalacticBinaryBand Residual(GalacticBinaryBandWindow window)
    {
        int offset = window.Padded.First - _data.Bins.First;
        var a = _data.A.AsSpan(offset, window.Padded.Count).ToArray();
        var e = _data.E.AsSpan(offset, window.Padded.Count).ToArray();
        foreach (var other in _templates)
        {
            if (other.Bins == window.Padded) continue;
            var shared = other.Bins.Intersect(window.Padded);
            for (int bin = shared.First; bin < shared.End; bin++)
            {
                a[bin - window.Padded.First] -= other.A[bin - other.Bins.First];
                e[bin - window.Padded.First] -= other.E[bin - other.Bins.First];
            }
        }
        return new GalacticBinaryBand(window.Padded, _data.DfHz, a, e,
            _data.InverseA.AsSpan(offset, window.Padded.Count).ToArray(), _data.InverseE.AsSpan(offset, window.Padded.Count).ToArray());
    }

    /// <summary>Recovered fraction of the injected sources with SNR ≥ 10 and spurious fraction of the confident sources.</summary>
    /// <remarks>Recovered: some entry with confidence ≥ 0.5 whose members match the source with median overlap ≥ 0.9.
    /// Spurious: an entry with confidence ≥ 0.5 whose median overlap with every injected source (loud or weak) is below
    /// the association threshold 0.5.</remarks>
    /// <summary>The catalogue as the engine publishes it: sources with confidence ≥ 0.5 and median SNR at or above the
    /// settings' <c>catalogue_min_snr</c>.</summary>
    public ImmutableArray<CatalogueEntry> Entries() => Catalogue.Build(0.5, _catalogueMinSnr);

    public (int Loud, int Recovered, int Confident, int Spurious) Score(IReadOnlyList<GalacticBinaryParameters> injected)
    {
        var rows = Entries();
        double MedianMatch(CatalogueEntry entry, GalacticBinaryParameters truth) =>
            entry.Members.Select(m => _data.Match(m, truth)).Order().ElementAt(entry.Members.Length / 2);
        var loud = injected.Where(s => _data.Snr(s) >= 10).ToList();
        var near = rows.ToDictionary(e => e, e => injected.Where(s => Math.Abs(s.FrequencyHz - e.Median.FrequencyHz) < 40 * _data.DfHz).ToList());
        int recovered = loud.Count(s => rows.Any(e => near[e].Contains(s) && MedianMatch(e, s) >= 0.9));
        int spurious = rows.Count(e => !near[e].Any(s => MedianMatch(e, s) >= 0.5));
        return (loud.Count, recovered, rows.Length, spurious);
    }

    /// <summary>One line per spurious confident entry: where it is, how loud and how certain, and its nearest injected
    /// source and nearest other confident entry, so a failing run shows whether the spurious sources are split companions.</summary>
    public IEnumerable<string> DescribeSpurious(IReadOnlyList<GalacticBinaryParameters> injected)
    {
        var rows = Entries();
        double MedianMatch(CatalogueEntry entry, GalacticBinaryParameters truth) =>
            entry.Members.Select(m => _data.Match(m, truth)).Order().ElementAt(entry.Members.Length / 2);
        foreach (var entry in rows)
        {
            double f = entry.Median.FrequencyHz;
            var near = injected.Where(s => Math.Abs(s.FrequencyHz - f) < 40 * _data.DfHz).ToList();
            if (near.Any(s => MedianMatch(entry, s) >= 0.5)) continue;
            var truth = injected.MinBy(s => Math.Abs(s.FrequencyHz - f) / _data.DfHz - _data.Snr(s) / 10.0);
            var neighbour = rows.Where(e => e != entry).MinBy(e => Math.Abs(e.Median.FrequencyHz - f));
            yield return $"spurious f0 {f * 1e3:F6} mHz snr {entry.MedianSnr:F1} conf {entry.Confidence:F2} | nearest loud-weighted truth "
                + $"{(truth.FrequencyHz - f) / _data.DfHz:+0.00;-0.00} bins snr {_data.Snr(truth):F1} match {MedianMatch(entry, truth):F2} | "
                + $"neighbour entry {(neighbour is null ? double.NaN : (neighbour.Median.FrequencyHz - f) / _data.DfHz):+0.00;-0.00} bins "
                + $"snr {neighbour?.MedianSnr:F1} conf {neighbour?.Confidence:F2} | injected within 4 bins: "
                + string.Join(", ", injected.Where(s => Math.Abs(s.FrequencyHz - f) < 4 * _data.DfHz && _data.Snr(s) > 2)
                    .Select(s => $"{(s.FrequencyHz - f) / _data.DfHz:+0.00;-0.00} bins snr {_data.Snr(s):F1} match {MedianMatch(entry, s):F2}"));
        }
    }
}
