using System.Collections.Immutable;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The inspirals of one run: one worker per <c>[[extreme_mass_ratio_inspirals.start]]</c> row, over the bins
/// its starting template reaches plus <c>margin_bins</c> on each side.</summary>
/// <remarks>Workers whose windows share no bin go into the same group (first fit, in row order): one group
/// <c>extreme_mass_ratio_inspirals</c> when all are disjoint, else <c>extreme_mass_ratio_inspirals.1</c>, <c>.2</c>, ….
/// Worker ids are <c>extreme_mass_ratio_inspirals/</c> + the row's id.</remarks>
internal sealed class InspiralFitPlan : IFitSourceClassPlan
{
    private const string Id = ExtremeMassRatioInspiralClass.Id;

    /// <summary>Base of the workers' stream ids ("EMRI" in ASCII, shifted), plus the row index.</summary>
    private const ulong StreamBase = 0x454D5249UL << 16;

    private static readonly string[] Keys =
    [
        "start", "steps_per_update", "temperatures", "max_temperature", "margin_bins", "search_evaluations", "search_segments",
        "search_step_sigma", "box_sigma", "fisher_refresh_steps",
    ];

    private readonly FitDataShape _shape;
    private readonly ImmutableArray<BinWindow> _windows;

    private InspiralFitPlan(InspiralFitSettings settings, FitDataShape shape, ImmutableArray<BinWindow> windows)
    {
        Settings = settings;
        _shape = shape;
        _windows = windows;
        var groups = new List<List<int>>();
        for (int i = 0; i < windows.Length; i++)
        {
            var group = groups.FirstOrDefault(g => g.All(j => windows[j].Intersect(windows[i]).Count == 0));
            if (group is null) groups.Add(group = []);
            group.Add(i);
        }
        Groups = [.. groups.Select((g, k) => new WorkerGroup(groups.Count == 1 ? Id : $"{Id}.{k + 1}",
            [.. g.Select(i => new WorkerDescriptor(WorkerId(settings.Starts[i].Id), windows[i], Label(i), false))]))];
    }

    /// <summary>The checked settings.</summary>
    public InspiralFitSettings Settings { get; }

    /// <summary>The prior every worker samples under (the defaults of <see cref="ExtremeMassRatioInspiralPrior"/>).</summary>
    public static ExtremeMassRatioInspiralPrior Prior { get; } = new();

    /// <inheritdoc />
    public string ClassId => Id;

    /// <inheritdoc />
    public IReadOnlyList<WorkerGroup> Groups { get; }

    /// <inheritdoc />
    public int StepsPerUpdate => Settings.StepsPerUpdate;

    /// <summary>The worker id of row <paramref name="rowId"/>.</summary>
    public static string WorkerId(string rowId) => $"{Id}/{rowId}";

    /// <summary>Reads and checks the section.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">A key is malformed, a start row is missing a column or lies
    /// outside the prior, or its template has no bin in the record; the message names the key.</exception>
    public static InspiralFitPlan FromConfig(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(shape);
        var starts = ImmutableArray.CreateBuilder<InspiralStart>();
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (var row in section.GetTableArray("start"))
        {
            var start = ReadStart(row, starts.Count);
            if (!ids.Add(start.Id)) throw row.Invalid("id", $"id \"{start.Id}\" is used twice");
            starts.Add(start);
        }
        var settings = new InspiralFitSettings(
            starts.ToImmutable(),
            StepsPerUpdate: (int)section.GetInteger("steps_per_update", 100, 1, 1_000_000),
            Temperatures: (int)section.GetInteger("temperatures", 4, 1, 64),
            MaxTemperature: section.GetInRange("max_temperature", 30, 1, 1e6),
            MarginBins: (int)section.GetInteger("margin_bins", 32, 0, 1_000_000),
            SearchEvaluations: (int)section.GetInteger("search_evaluations", 300, 0, 10_000_000),
            SearchSegments: (int)section.GetInteger("search_segments", 8, 1, 10_000),
            SearchStepSigma: section.GetInRange("search_step_sigma", 10, 0.3, 1e6),
            BoxSigma: section.GetInRange("box_sigma", 1e4, 10, 1e9),
            FisherRefreshSteps: (int)section.GetInteger("fisher_refresh_steps", 500, 0, int.MaxValue));
        section.RejectUnknownKeys(Keys);
        if (settings.Temperatures > 1 && !(settings.MaxTemperature > 1))
            throw section.Invalid("max_temperature", "must exceed 1 when temperatures > 1");
        if (settings.Starts.IsEmpty)
            throw section.InvalidTable("needs at least one [[extreme_mass_ratio_inspirals.start]] row (a catalogue row or search candidate to start a worker from)");
        var generator = Generator(shape);
        var windows = ImmutableArray.CreateBuilder<BinWindow>();
        var rows = section.GetTableArray("start");
        for (int i = 0; i < settings.Starts.Length; i++)
        {
            var reach = generator.TemplateBins(settings.Starts[i].Start);
            if (reach.Count == 0)
                throw rows[i].Invalid(P.OrbitalFrequencyColumn, "the starting inspiral's template has no bin in the data record");
            int first = Math.Max(1, reach.First - settings.MarginBins);
            int end = Math.Min(shape.BinCount - 1, reach.End + settings.MarginBins);
            windows.Add(new BinWindow(first, end - first));
        }
        return new InspiralFitPlan(settings, shape, windows.ToImmutable());
    }

    /// <summary>A template generator for the record (default accuracy settings, as the simulator's).</summary>
    public static ExtremeMassRatioInspiralTemplateGenerator Generator(FitDataShape shape) =>
        new(shape.SampleCount * shape.CadenceS, shape.CadenceS, startSeconds: shape.StartS);

    /// <inheritdoc />
    public IFitWorker CreateWorker(string workerId, ulong runSeed)
    {
        int index = Index(workerId);
        return Worker(index, new InspiralWorkerState(runSeed, 0, null, null, Settings.Starts[index].Start.ToArray(), null, double.NaN));
    }

    /// <inheritdoc />
    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state) => Worker(Index(workerId), InspiralWorker.ReadState(state));

    /// <inheritdoc />
    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) =>
        new InspiralCatalogue(Generator(_shape), noise, burnInIterations, [.. Settings.Starts.Select(s => WorkerId(s.Id))]);

    /// <summary>Inspiral rows matched by template overlap (<see cref="InspiralMatcher"/>).</summary>
    public ISourceMatcher CreateMatcher(IPsdSource noise) => new InspiralMatcher(Generator(_shape), noise, _windows);

    /// <inheritdoc />
    public void WriteResolved(ResolvedConfigWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Key("steps_per_update", Settings.StepsPerUpdate);
        writer.Key("temperatures", Settings.Temperatures);
        writer.Key("max_temperature", Settings.MaxTemperature);
        writer.Key("margin_bins", Settings.MarginBins);
        writer.Key("search_evaluations", Settings.SearchEvaluations);
        writer.Key("search_segments", Settings.SearchSegments);
        writer.Key("search_step_sigma", Settings.SearchStepSigma);
        writer.Key("box_sigma", Settings.BoxSigma);
        writer.Key("fisher_refresh_steps", Settings.FisherRefreshSteps);
        foreach (var start in Settings.Starts)
        {
            writer.Section($"[{Id}.start]");
            writer.Key("id", start.Id);
            double[] row = start.Start.ToArray();
            for (int c = 0; c < row.Length; c++) writer.Key(P.ColumnNames[c], row[c]);
        }
    }

    private InspiralWorker Worker(int index, InspiralWorkerState state) =>
        new(WorkerId(Settings.Starts[index].Id), StreamBase + (ulong)index, _windows[index], Settings, Generator(_shape), Prior, state);

    private int Index(string workerId)
    {
        for (int i = 0; i < Settings.Starts.Length; i++)
            if (WorkerId(Settings.Starts[i].Id) == workerId) return i;
        throw new ArgumentException($"no inspiral worker '{workerId}' in this plan", nameof(workerId));
    }

    private string Label(int index) =>
        FormattableString.Invariant($"inspiral {Settings.Starts[index].Id}, {_windows[index].First / _shape.DurationS * 1e3:F3}-{_windows[index].End / _shape.DurationS * 1e3:F3} mHz");

    private static InspiralStart ReadStart(ConfigTable row, int index)
    {
        string id = row.GetString("id", $"inspiral-{index + 1}");
        if (id.Length == 0 || id.Contains('/', StringComparison.Ordinal)) throw row.Invalid("id", $"must be non-empty and free of '/', got \"{id}\"");
        foreach (string column in P.ColumnNames)
            if (!row.Has(column)) throw row.InvalidTable($"each start row needs '{column}' (every parameter column of a catalogue row)");
        double[] values = [.. P.ColumnNames.Select(row.RequireDouble)];
        row.RejectUnknownKeys(["id", .. P.ColumnNames]);
        var p = P.FromSpan(values);
        try
        {
            p.Validate();
        }
        catch (ArgumentOutOfRangeException error)
        {
            throw row.Invalid(error.ParamName ?? P.CentralMassColumn, error.Message);
        }
        var prior = Prior;
        static bool Inside(double v, double lo, double hi) => v >= lo && v <= hi;
        if (!Inside(p.CentralMassMsun, prior.MinCentralMassMsun, prior.MaxCentralMassMsun))
            throw row.Invalid(P.CentralMassColumn, $"must lie in the fit's prior range [{prior.MinCentralMassMsun}, {prior.MaxCentralMassMsun}]");
        if (!Inside(p.CompactMassMsun, prior.MinCompactMassMsun, prior.MaxCompactMassMsun))
            throw row.Invalid(P.CompactMassColumn, $"must lie in the fit's prior range [{prior.MinCompactMassMsun}, {prior.MaxCompactMassMsun}]");
        if (!(p.CentralSpin <= prior.MaxSpin)) throw row.Invalid(P.CentralSpinColumn, $"must not exceed the fit's prior bound {prior.MaxSpin}");
        if (!(p.Eccentricity0 <= prior.MaxEccentricity)) throw row.Invalid(P.EccentricityColumn, $"must not exceed the fit's prior bound {prior.MaxEccentricity}");
        if (!Inside(p.DistanceMpc, prior.MinDistanceMpc, prior.MaxDistanceMpc))
            throw row.Invalid(P.DistanceColumn, $"must lie in the fit's prior range [{prior.MinDistanceMpc}, {prior.MaxDistanceMpc}]");
        if (!double.IsFinite(prior.LogDensity(p)))
            throw row.Invalid(P.OrbitalFrequencyColumn, $"must lie in the fit's prior range [{prior.MinFrequencyHz}, {prior.MaxFrequencyHz}] Hz and below the source's plunge frequency");
        return new InspiralStart(id, p);
    }
}
