using System.Collections.Immutable;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The inspirals of one run: one worker per <c>[[extreme_mass_ratio_inspirals.start]]</c> row, over the bins
/// its starting template reaches plus <c>margin_bins</c> on each side, and <c>count</c> minus that many blind workers
/// over the bins the search box's templates reach (<see cref="InspiralSearchBox.Reach"/>) plus the margin.</summary>
/// <remarks>Workers whose windows share no bin go into the same group (first fit, start rows first, in row order): one
/// group <c>extreme_mass_ratio_inspirals</c> when all are disjoint, else <c>extreme_mass_ratio_inspirals.1</c>,
/// <c>.2</c>, …. Worker ids are <c>extreme_mass_ratio_inspirals/</c> + the row's id, and
/// <c>extreme_mass_ratio_inspirals/search-1</c>, <c>search-2</c>, … for the blind ones.</remarks>
internal sealed class InspiralFitPlan : IFitSourceClassPlan
{
    private const string Id = ExtremeMassRatioInspiralClass.Id;

    /// <summary>Base of the workers' stream ids ("EMRI" in ASCII, shifted), plus the row index.</summary>
    private const ulong StreamBase = 0x454D5249UL << 16;

    private static readonly string[] Keys =
    [
        "start", "steps_per_update", "temperatures", "max_temperature", "margin_bins", "search_evaluations", "search_segments",
        "search_step_sigma", "box_sigma", "fisher_refresh_steps", "count", "search_draws", "search_chains", "search_chain_steps",
        "search_blind_segments", "search_updates", "detection_significance", .. InspiralSearchBox.Keys,
    ];

    /// <summary>Prefix of the blind workers' row ids (<c>search-1</c>, …).</summary>
    public const string BlindIdPrefix = "search-";

    // The box's centre at its lowest frequency: where a blind worker waits before it finds something.
    private static readonly double[] BoxCentre = [0.5, 0.5, 0.5, 0, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5];

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
            [.. g.Select(i => new WorkerDescriptor(WorkerId(RowId(i)), windows[i], Label(i), false))]))];
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
            if (start.Id.StartsWith(BlindIdPrefix, StringComparison.Ordinal))
                throw row.Invalid("id", $"ids starting \"{BlindIdPrefix}\" name the blind workers, got \"{start.Id}\"");
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
        int count = (int)section.GetInteger("count", starts.Count, 0, 100);
        if (count < starts.Count)
            throw section.Invalid("count", $"must be at least the {starts.Count} start rows (each start row is one of the count workers), got {count}");
        var blind = new InspiralBlindSearchSettings(
            Draws: (int)section.GetInteger("search_draws", 600, 1, 10_000_000),
            Chains: (int)section.GetInteger("search_chains", 6, 1, 1000),
            ChainSteps: (int)section.GetInteger("search_chain_steps", 200, 1, 10_000_000),
            Segments: (int)section.GetInteger("search_blind_segments", 16, 1, 10_000));
        if (blind.Segments < settings.SearchSegments)
            throw section.Invalid("search_blind_segments", $"must be at least search_segments ({settings.SearchSegments}): the blind search hands its candidate to the start search at that many segments");
        settings = settings with
        {
            BlindWorkers = count - starts.Count,
            Box = ReadBox(section),
            Blind = blind,
            SearchUpdates = (int)section.GetInteger("search_updates", 2, 1, 1_000_000),
            DetectionSignificance = section.GetInRange("detection_significance", InspiralFitSettings.DefaultDetectionSignificance, 0, 1e6),
        };
        section.RejectUnknownKeys(Keys);
        if (settings.Temperatures > 1 && !(settings.MaxTemperature > 1))
            throw section.Invalid("max_temperature", "must exceed 1 when temperatures > 1");
        if (settings.Starts.IsEmpty && settings.BlindWorkers == 0)
            throw section.InvalidTable("needs count >= 1 (blind workers) or at least one [[extreme_mass_ratio_inspirals.start]] row (a catalogue row or search candidate to start a worker from)");
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
        if (settings.BlindWorkers > 0)
        {
            var reach = settings.Box!.Reach(generator);
            if (reach.Count == 0)
                throw section.Invalid(InspiralSearchBox.Keys[6], "no template of the search box has a bin in the data record");
            int first = Math.Max(1, reach.First - settings.MarginBins);
            int end = Math.Min(shape.BinCount - 1, reach.End + settings.MarginBins);
            for (int i = 0; i < settings.BlindWorkers; i++) windows.Add(new BinWindow(first, end - first));
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
        // A blind worker holds the centre of its search box until it finds something (it reports no source till then).
        double[] start = index < Settings.Starts.Length ? Settings.Starts[index].Start.ToArray()
            : Settings.Box!.At(BoxCentre)!.Value.ToArray();
        return Worker(index, new InspiralWorkerState(runSeed, 0, null, null, start, null, double.NaN));
    }

    /// <inheritdoc />
    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state) => Worker(Index(workerId), InspiralWorker.ReadState(state));

    /// <inheritdoc />
    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) =>
        new InspiralCatalogue(Generator(_shape), noise, burnInIterations, [.. Enumerable.Range(0, _windows.Length).Select(i => WorkerId(RowId(i)))]);

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
        writer.Key("count", Settings.Starts.Length + Settings.BlindWorkers);
        var blind = Settings.Blind ?? new InspiralBlindSearchSettings();
        writer.Key("search_draws", blind.Draws);
        writer.Key("search_chains", blind.Chains);
        writer.Key("search_chain_steps", blind.ChainSteps);
        writer.Key("search_blind_segments", blind.Segments);
        writer.Key("search_updates", Settings.SearchUpdates);
        writer.Key("detection_significance", Settings.DetectionSignificance);
        double[] box = (Settings.Box ?? InspiralSearchBox.Of(Prior)).ToArray();
        for (int k = 0; k < box.Length; k++) writer.Key(InspiralSearchBox.Keys[k], box[k]);
        foreach (var start in Settings.Starts)
        {
            writer.Section($"[{Id}.start]");
            writer.Key("id", start.Id);
            double[] row = start.Start.ToArray();
            for (int c = 0; c < row.Length; c++) writer.Key(P.ColumnNames[c], row[c]);
        }
    }

    private InspiralWorker Worker(int index, InspiralWorkerState state) =>
        new(WorkerId(RowId(index)), StreamBase + (ulong)index, _windows[index], Settings, Generator(_shape), Prior, state,
            blind: index >= Settings.Starts.Length);

    // Row id of worker index: the start row's, then search-1, search-2, … for the blind workers.
    private string RowId(int index) =>
        index < Settings.Starts.Length ? Settings.Starts[index].Id
        : FormattableString.Invariant($"{BlindIdPrefix}{index - Settings.Starts.Length + 1}");

    private int Index(string workerId)
    {
        for (int i = 0; i < _windows.Length; i++)
            if (WorkerId(RowId(i)) == workerId) return i;
        throw new ArgumentException($"no inspiral worker '{workerId}' in this plan", nameof(workerId));
    }

    private string Label(int index) =>
        FormattableString.Invariant($"inspiral {RowId(index)}{(index < Settings.Starts.Length ? "" : " (blind search)")}, {_windows[index].First / _shape.DurationS * 1e3:F3}-{_windows[index].End / _shape.DurationS * 1e3:F3} mHz");

    // The search box: each bound defaults to the prior's and must lie inside it, every minimum below its maximum.
    private static InspiralSearchBox ReadBox(ConfigTable section)
    {
        var whole = InspiralSearchBox.Of(Prior).ToArray();
        double[] lower = [Prior.MinCentralMassMsun, Prior.MinCompactMassMsun, 0, Prior.MinFrequencyHz, 0];
        double[] upper = [Prior.MaxCentralMassMsun, Prior.MaxCompactMassMsun, Prior.MaxSpin, Prior.MaxFrequencyHz, Prior.MaxEccentricity];
        var values = new double[whole.Length];
        for (int k = 0; k < whole.Length; k++)
            values[k] = section.GetInRange(InspiralSearchBox.Keys[k], whole[k], lower[k / 2], upper[k / 2]);
        for (int k = 0; k < whole.Length; k += 2)
            if (!(values[k] < values[k + 1]))
                throw section.Invalid(InspiralSearchBox.Keys[k], $"must lie below {InspiralSearchBox.Keys[k + 1]} ({values[k + 1]}), got {values[k]}");
        var box = new InspiralSearchBox(values[0], values[1], values[2], values[3], values[4], values[5], values[6], values[7], values[8], values[9]);
        if (box.At(BoxCentre) is null)
            throw section.Invalid(InspiralSearchBox.Keys[6], "lies above the plunge frequency of the box's central mass and eccentricity: no source of the box is inspiralling");
        return box;
    }

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
