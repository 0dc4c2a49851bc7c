using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.NoiseFitting;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Input;

namespace GlobalFit.Engine.Runs;

/// <summary>A run configuration read, checked against its data and resolved: the settings, the classes that run and
/// their workers, the noise model and the schedule. Everything that can be wrong with a configuration is found here,
/// before any actor starts.</summary>
public sealed class RunPlan
{
    private readonly Dictionary<string, (IFitSourceClassPlan Plan, WorkerDescriptor Worker)> _workers = new(StringComparer.Ordinal);

    private RunPlan(RunSettings settings, FitDataShape shape, IReadOnlyList<IFitSourceClassPlan> classes, NoiseFitSettings noise, FitSchedule schedule)
    {
        Settings = settings;
        Shape = shape;
        Classes = classes;
        Noise = noise;
        Schedule = schedule;
        foreach (var plan in classes)
            foreach (var group in plan.Groups)
                foreach (var worker in group.Workers)
                    _workers.Add(worker.Id, (plan, worker));
    }

    /// <summary>Assembles a plan from parts already checked (tests of the engine with stand-in classes).</summary>
    internal static RunPlan Create(RunSettings settings, FitDataShape shape, IReadOnlyList<IFitSourceClassPlan> classes, NoiseFitSettings noise, FitSchedule schedule) =>
        new(settings, shape, classes, noise, schedule);

    /// <summary>Top-level settings.</summary>
    public RunSettings Settings { get; }

    /// <summary>The data record's shape.</summary>
    public FitDataShape Shape { get; }

    /// <summary>The source classes that run, in registration order.</summary>
    public IReadOnlyList<IFitSourceClassPlan> Classes { get; }

    /// <summary>The noise model.</summary>
    public NoiseFitSettings Noise { get; }

    /// <summary>The schedule.</summary>
    public FitSchedule Schedule { get; }

    /// <summary>Every source worker, by id.</summary>
    public IEnumerable<WorkerDescriptor> Workers => _workers.Values.Select(w => w.Worker).OrderBy(w => w.Id, StringComparer.Ordinal);

    /// <summary>The class plan a worker belongs to.</summary>
    public IFitSourceClassPlan ClassOf(string workerId) => _workers[workerId].Plan;

    /// <summary>A worker's descriptor.</summary>
    public WorkerDescriptor Worker(string workerId) => _workers[workerId].Worker;

    /// <summary>The workers of a schedule group (empty for the noise group).</summary>
    public IReadOnlyList<WorkerDescriptor> GroupWorkers(string group) =>
        group == FitSchedule.NoiseGroup ? [] : Classes.SelectMany(c => c.Groups).Single(g => g.Name == group).Workers;

    /// <summary>Reads and checks a run configuration file.</summary>
    /// <param name="configPath">The file.</param>
    /// <exception cref="InvalidInputException">Anything wrong with the file or its data, naming the key.</exception>
    public static RunPlan Load(string configPath)
    {
        var root = ConfigDocument.Load(configPath);
        return FromConfig(root, Path.GetDirectoryName(Path.GetFullPath(configPath))!);
    }

    /// <summary>Checks a parsed configuration.</summary>
    /// <param name="root">Its root table.</param>
    /// <param name="configFolder">Folder relative paths are taken from.</param>
    public static RunPlan FromConfig(ConfigTable root, string configFolder) => FromConfig(root, configFolder, knownShape: null);

    /// <summary>Checks a parsed configuration against <paramref name="knownShape"/> instead of its data file (which then
    /// need not exist): for validating shipped examples without their data.</summary>
    internal static RunPlan FromConfig(ConfigTable root, string configFolder, FitDataShape? knownShape)
    {
        ArgumentNullException.ThrowIfNull(root);
        foreach (string planned in FitSourceClasses.Planned)
            if (root.Has(planned))
                throw root.Invalid(planned, $"source class '{planned}' has no implementation in this build yet; remove the section (implemented: {string.Join(", ", FitSourceClasses.All.Select(c => c.ClassId))})");
        var settings = RunSettings.FromConfig(root, configFolder, requireData: knownShape is null);
        var shape = knownShape ?? ReadShape(settings.DataPath);
        var classes = new List<IFitSourceClassPlan>();
        foreach (var sourceClass in FitSourceClasses.All)
            if (root.GetTable(sourceClass.ClassId) is { } section)
                classes.Add(sourceClass.Plan(section, shape));
        var noiseTable = root.GetTable("noise") ?? EmptyTable(root, "noise");
        var noise = NoiseFitSettings.FromConfig(noiseTable, shape);
        var schedule = FitSchedule.FromConfig(root.GetTable("schedule"), classes);
        root.RejectUnknownKeys([.. RunSettings.Keys, "noise", "schedule", .. FitSourceClasses.All.Select(c => c.ClassId)]);
        return new RunPlan(settings, shape, classes, noise, schedule);
    }

    /// <summary>The resolved configuration (every default written out) for <c>RUN/run.toml</c>.</summary>
    public string ResolvedToml()
    {
        var writer = new ResolvedConfigWriter();
        writer.Comment("Resolved configuration of this run: every setting, defaults included. 'globalfit resume' reads it.");
        Settings.WriteResolved(writer);
        writer.Section("schedule");
        writer.Key("stages", Schedule.Stages.Select(s => (IEnumerable<string>)s));
        writer.Section("noise");
        Noise.WriteResolved(writer);
        foreach (var plan in Classes)
        {
            writer.Section(plan.ClassId);
            plan.WriteResolved(writer);
        }
        return writer.ToString();
    }

    private static FitDataShape ReadShape(string dataPath)
    {
        var summary = ObservationFile.ReadSummary(dataPath);
        return new FitDataShape(dataPath, summary.SampleCount, summary.DtSeconds, summary.T0Seconds);
    }

    private static ConfigTable EmptyTable(ConfigTable root, string name) => ConfigDocument.Parse($"[{name}]\n", root.SourceName).GetTable(name)!;
}
