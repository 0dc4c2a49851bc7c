using System.Diagnostics.CodeAnalysis;
using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>The data, every source worker's current template and the current inverse noise PSDs; cuts each worker's
/// residual: data minus every <em>other</em> worker's template over its window (for the noise worker, which holds no
/// template, that is data minus every template).</summary>
/// <remarks>
/// <para>A residual is always summed afresh in one canonical order, ((d − h₁) − h₂) − … over the other workers in
/// ordinal id order, rather than kept as a running difference. So it depends only on the current set of templates, not
/// on the order or history in which they were replaced: replacing templates in any order gives the same bits, and a run
/// resumed from a checkpoint (which stores the templates) continues exactly. The cost is one pass over the templates
/// that overlap the window, which for band workers is the two neighbours.</para>
/// <para>Not thread-safe; owned by the residual-data actor.</para>
/// </remarks>
public sealed class ResidualBook
{
    private readonly FitData _data;
    private readonly SortedDictionary<string, WindowSpectra> _templates = new(StringComparer.Ordinal);
    private readonly Dictionary<string, BinWindow> _windows = new(StringComparer.Ordinal);
    private readonly Dictionary<string, bool> _includesT = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string[]> _overlapping = new(StringComparer.Ordinal);
    private double[] _inverseA;
    private double[] _inverseE;
    private double[] _inverseT;

    /// <summary>Creates a book for <paramref name="workers"/>, all templates zero and the inverse PSDs given.</summary>
    /// <param name="data">The data.</param>
    /// <param name="workers">Every worker of the run: its window, whether it uses T and whether it holds a template.</param>
    /// <param name="inverseA">1/S_A over all bins.</param>
    /// <param name="inverseE">1/S_E over all bins.</param>
    /// <param name="inverseT">1/S_T over all bins.</param>
    public ResidualBook(FitData data, IEnumerable<WorkerDescriptor> workers, double[] inverseA, double[] inverseE, double[] inverseT)
    {
        _data = data ?? throw new ArgumentNullException(nameof(data));
        ArgumentNullException.ThrowIfNull(workers);
        foreach (var worker in workers)
        {
            var (id, bins) = (worker.Id, worker.Bins);
            if (bins.First < 0 || bins.End > data.Shape.BinCount)
                throw new ArgumentException($"worker {id} reads bins {bins} outside the data's 0…{data.Shape.BinCount - 1}", nameof(workers));
            if (!_windows.TryAdd(id, bins)) throw new ArgumentException($"worker id {id} appears twice", nameof(workers));
            _includesT[id] = worker.IncludesT;
            if (worker.Role == WorkerRole.Sources) _templates[id] = WindowSpectra.Zero(bins, worker.IncludesT);
        }
        // Windows sorted by first bin; each window's overlap list is found by scanning neighbours in that order.
        var byStart = _windows.OrderBy(w => w.Value.First).ThenBy(w => w.Key, StringComparer.Ordinal).ToArray();
        foreach (var (id, bins) in _windows)
        {
            var others = new List<string>();
            foreach (var (other, otherBins) in byStart)
            {
                if (otherBins.First >= bins.End) break;
                if (other != id && otherBins.End > bins.First && _templates.ContainsKey(other)) others.Add(other);
            }
            others.Sort(StringComparer.Ordinal);
            _overlapping[id] = [.. others];
        }
        SetInversePsd(inverseA, inverseE, inverseT);
    }

    /// <summary>The current template of <paramref name="workerId"/>.</summary>
    public WindowSpectra Template(string workerId) => _templates[workerId];

    /// <summary>Replaces the template of one worker.</summary>
    /// <param name="workerId">The worker.</param>
    /// <param name="template">Its new template, over exactly its window, with T exactly when the old one had it.</param>
    public void Replace(string workerId, WindowSpectra template)
    {
        ArgumentNullException.ThrowIfNull(template);
        if (!_windows.TryGetValue(workerId, out var bins) || !_templates.ContainsKey(workerId))
            throw new ArgumentException($"{workerId} is not a worker that holds a template", nameof(workerId));
        if (template.Bins != bins) throw new ArgumentException($"template of {workerId} covers {template.Bins}, its window is {bins}", nameof(template));
        if ((template.T is null) != (_templates[workerId].T is null))
            throw new ArgumentException($"template of {workerId} changes whether it holds channel T", nameof(template));
        if (template.A.Length != bins.Count || template.E.Length != bins.Count || (template.T is { } t && t.Length != bins.Count))
            throw new ArgumentException($"template of {workerId} does not hold {bins.Count} bins per channel", nameof(template));
        _templates[workerId] = template;
    }

    /// <summary>Sets the inverse noise PSDs over all bins (0 excludes a bin).</summary>
    [MemberNotNull(nameof(_inverseA), nameof(_inverseE), nameof(_inverseT))]
    public void SetInversePsd(double[] inverseA, double[] inverseE, double[] inverseT)
    {
        ArgumentNullException.ThrowIfNull(inverseA);
        ArgumentNullException.ThrowIfNull(inverseE);
        ArgumentNullException.ThrowIfNull(inverseT);
        int n = _data.Shape.BinCount;
        if (inverseA.Length != n || inverseE.Length != n || inverseT.Length != n)
            throw new ArgumentException($"inverse PSDs must hold all {n} bins");
        _inverseA = inverseA;
        _inverseE = inverseE;
        _inverseT = inverseT;
    }

    /// <summary>The residual of <paramref name="workerId"/>: data minus every other worker's template over its window,
    /// with channel T exactly when the worker uses it.</summary>
    /// <param name="workerId">The worker.</param>
    public WorkerResidual ResidualFor(string workerId)
    {
        var bins = _windows[workerId];
        bool includeT = _includesT[workerId];
        var a = _data.A.AsSpan(bins.First, bins.Count).ToArray();
        var e = _data.E.AsSpan(bins.First, bins.Count).ToArray();
        var t = includeT ? _data.T.AsSpan(bins.First, bins.Count).ToArray() : null;
        foreach (string other in _overlapping[workerId]) Subtract(_templates[other], bins, a, e, t);
        return new WorkerResidual(new WindowSpectra(bins, a, e, t), _data.Shape.DfHz,
            _inverseA.AsSpan(bins.First, bins.Count).ToArray(), _inverseE.AsSpan(bins.First, bins.Count).ToArray(),
            includeT ? _inverseT.AsSpan(bins.First, bins.Count).ToArray() : null);
    }

    // Subtracts the part of `template` inside `bins` from the arrays that hold `bins`.
    private static void Subtract(WindowSpectra template, BinWindow bins, Complex[] a, Complex[] e, Complex[]? t)
    {
        var shared = template.Bins.Intersect(bins);
        if (shared.Count <= 0) return;
        int from = shared.First - template.Bins.First, to = shared.First - bins.First;
        SubtractInto(a.AsSpan(to, shared.Count), template.A.AsSpan(from, shared.Count));
        SubtractInto(e.AsSpan(to, shared.Count), template.E.AsSpan(from, shared.Count));
        if (t is not null && template.T is { } tt) SubtractInto(t.AsSpan(to, shared.Count), tt.AsSpan(from, shared.Count));
    }

    private static void SubtractInto(Span<Complex> target, ReadOnlySpan<Complex> values)
    {
        for (int i = 0; i < target.Length; i++) target[i] -= values[i];
    }
}
