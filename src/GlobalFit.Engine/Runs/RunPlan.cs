using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>A run configuration read, checked against its data and resolved: the settings, the modules that run (source
/// classes and the noise model) with their workers, and the schedule. Everything that can be wrong with a configuration
/// is found here, before any actor starts.</summary>
public sealed class RunPlan
{
    private readonly Dictionary<string, (IFitSourceClassPlan Plan, WorkerDescriptor Worker)> _workers = new(StringComparer.Ordinal);

    private RunPlan(RunSettings settings, FitDataShape shape, IReadOnlyList<IFitSourceClassPlan> classes, FitSchedule schedule)
    {
        Settings = settings;
        Shape = shape;
        Classes = classes;
        Schedule = schedule;
        foreach (var plan in classes)
            foreach (var group in plan.Groups)
                foreach (var worker in group.Workers)
                    _workers.Add(worker.Id, (plan, worker));
    }

    /// <summary>Assembles a plan from parts already checked (tests of the engine with stand-in classes).</summary>
    internal static RunPlan Create(RunSettings settings, FitDataShape shape, IReadOnlyList<IFitSourceClassPlan> classes, FitSchedule schedule) =>
        new(settings, shape, classes, schedule);

    /// <summary>Top-level settings.</summary>
    public RunSettings Settings { get; }

    /// <summary>The data record's shape.</summary>
    public FitDataShape Shape { get; }

    /// <summary>The modules that run, in registration order (the noise model among them).</summary>
    public IReadOnlyList<IFitSourceClassPlan> Classes { get; }

    /// <summary>The schedule.</summary>
    public FitSchedule Schedule { get; }

    /// <summary>Every worker, by id.</summary>
    public IEnumerable<WorkerDescriptor> Workers => _workers.Values.Select(w => w.Worker).OrderBy(w => w.Id, StringComparer.Ordinal);

    /// <summary>The class plan a worker belongs to.</summary>
    public IFitSourceClassPlan ClassOf(string workerId) => _workers[workerId].Plan;

    /// <summary>A worker's descriptor.</summary>
    public WorkerDescriptor Worker(string workerId) => _workers[workerId].Worker;

    /// <summary>The workers of a schedule group.</summary>
    public IReadOnlyList<WorkerDescriptor> GroupWorkers(string group) => Classes.SelectMany(c => c.Groups).Single(g => g.Name == group).Workers;

    /// <summary>The worker that models the noise (<see cref="WorkerRole.Noise"/>).</summary>
    public WorkerDescriptor NoiseWorker => Workers.Single(w => w.Role == WorkerRole.Noise);

    /// <summary>The stages the coordinator walks, with the run's limits.</summary>
    /// <param name="configDigest">Digest of the resolved configuration, for checkpoints.</param>
    public StagePlan StagePlan(string configDigest) => new(
        [.. Schedule.Stages.Select(groups => new Stage(groups, [.. groups.SelectMany(GroupWorkers).Select(w => new StageMember(w.Id, ClassOf(w.Id).ClassId, ClassOf(w.Id).StepsPerUpdate, w.Role))]))],
        Settings.Iterations, Settings.CheckpointEvery, Settings.CheckpointMinutes, Settings.MaxWorkerFailures, configDigest);

    /// <summary>Reads and checks a run configuration file.</summary>
    /// <param name="configPath">The file.</param>
    /// <param name="registry">The modules the configuration may use; <see cref="SourceClassRegistry.Default"/> when null.</param>
    /// <exception cref="InvalidInputException">Anything wrong with the file or its data, naming the key.</exception>
    public static RunPlan Load(string configPath, SourceClassRegistry? registry = null)
    {
        var root = ConfigDocument.Load(configPath);
        return FromConfig(root, Path.GetDirectoryName(Path.GetFullPath(configPath))!, registry);
    }

    /// <summary>Checks a parsed configuration.</summary>
    /// <param name="root">Its root table.</param>
    /// <param name="configFolder">Folder relative paths are taken from.</param>
    /// <param name="registry">The modules the configuration may use; <see cref="SourceClassRegistry.Default"/> when null.</param>
    public static RunPlan FromConfig(ConfigTable root, string configFolder, SourceClassRegistry? registry = null) =>
        FromConfig(root, configFolder, knownShape: null, registry);

    /// <summary>Checks a parsed configuration against <paramref name="knownShape"/> instead of its data file (which then
    /// need not exist): for validating shipped examples without their data.</summary>
    internal static RunPlan FromConfig(ConfigTable root, string configFolder, FitDataShape? knownShape, SourceClassRegistry? registry = null)
    {
        ArgumentNullException.ThrowIfNull(root);
        registry ??= SourceClassRegistry.Default;
        var settings = RunSettings.FromConfig(root, configFolder, requireData: knownShape is null);
        var shape = knownShape ?? ReadShape(settings.DataPath);
        var classes = new List<IFitSourceClassPlan>();
        foreach (var module in registry.Classes)
        {
            var section = root.GetTable(module.Id) ?? (module.RunsWithoutSection ? EmptyTable(root, module.Id) : null);
            if (section is not null) classes.Add(module.PlanFit(section, shape));
        }
        if (classes.SelectMany(c => c.Groups).SelectMany(g => g.Workers).Count(w => w.Role == WorkerRole.Noise) != 1)
            throw root.InvalidTable("a fit needs exactly one noise model worker");
        var schedule = FitSchedule.FromConfig(root.GetTable("schedule"), classes);
        root.RejectUnknownKeys([.. RunSettings.Keys, "schedule", .. registry.Ids]);
        return new RunPlan(settings, shape, classes, schedule);
    }

    /// <summary>The resolved configuration (every default written out) for <c>RUN/run.toml</c>.</summary>
    public string ResolvedToml()
    {
        var writer = new ResolvedConfigWriter();
        writer.Comment("Resolved configuration of this run: every setting, defaults included. 'globalfit resume' reads it.");
        Settings.WriteResolved(writer);
        writer.Section("schedule");
        writer.Key("stages", Schedule.Stages.Select(s => (IEnumerable<string>)s));
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
        return new FitDataShape(dataPath, summary.SampleCount, summary.DtSeconds, summary.T0Seconds)
        {
            ScenarioForegroundFitYears = RecordedForegroundFitYears(summary.Provenance, dataPath),
        };
    }

    // The [noise.foreground] of the scenario recorded in the file's provenance; null when there is none or it is off.
    private static double? RecordedForegroundFitYears(ObservationProvenance provenance, string dataPath)
    {
        if (!provenance.Entries.TryGetValue(ObservationSimulator.ScenarioProvenanceKey, out var toml)) return null;
        var foreground = ConfigDocument.Parse(toml, $"{dataPath} (provenance {ObservationSimulator.ScenarioProvenanceKey})")
            .GetTable("noise")?.GetTable("foreground");
        if (foreground is null || !foreground.GetBool("enabled", true)) return null;
        return foreground.GetDouble("fit_years", 1.0);
    }

    private static ConfigTable EmptyTable(ConfigTable root, string name) => ConfigDocument.Parse($"[{name}]\n", root.SourceName).GetTable(name)!;
}
