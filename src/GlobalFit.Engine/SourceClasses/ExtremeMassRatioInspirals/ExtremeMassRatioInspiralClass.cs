using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The extreme-mass-ratio inspiral module. Built so far: its scenario section (an invented population and
/// listed inspirals, injected with the fast analytic-kludge template) and its quick bench figures. Fitting the class is
/// not built yet: <see cref="PlanFit"/> refuses a run-configuration section for it.</summary>
public sealed class ExtremeMassRatioInspiralClass : ISourceClass
{
    /// <summary>The class id: config and scenario section, truth table, worker-id prefix. Defined once, by the
    /// physics parameters record.</summary>
    public const string Id = ExtremeMassRatioInspiralParameters.ClassId;

    /// <inheritdoc />
    string ISourceClass.Id => Id;

    /// <inheritdoc />
    public bool RunsWithoutSection => false;

    /// <inheritdoc />
    public ImmutableArray<string> ParameterColumns => ExtremeMassRatioInspiralParameters.ColumnNames;

    /// <inheritdoc />
    public ISimulatedSourceClass Simulation { get; } = new ExtremeMassRatioInspiralSimulation();

    /// <inheritdoc />
    public IReadOnlyList<QuickBenchSuite> BenchSuites { get; } = [new("extreme-mass-ratio inspiral template", ExtremeMassRatioInspiralBench.Run)];

    /// <inheritdoc />
    ISimulatedSourceClass? ISourceClass.Simulation => Simulation;

    /// <summary>None: the demo cannot fit this class yet.</summary>
    public IDemoPart? Demo => null;

    /// <summary>Refuses: fitting extreme-mass-ratio inspirals is not built yet.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">Always; the message names the section.</exception>
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        throw section.InvalidTable(
            $"fitting extreme-mass-ratio inspirals is not built yet: this build can simulate them but not fit them; remove the [{Id}] section");
    }
}
