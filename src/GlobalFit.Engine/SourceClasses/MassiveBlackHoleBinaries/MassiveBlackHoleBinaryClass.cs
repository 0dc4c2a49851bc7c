using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary module. Scenarios inject populations and listed binaries; the fit side is not
/// built yet, so a run configuration that asks for the class is refused.</summary>
public sealed class MassiveBlackHoleBinaryClass : ISourceClass
{
    /// <summary>The class id: config and scenario section, truth table, worker-id prefix.</summary>
    public const string Id = "massive_black_hole_binaries";

    /// <inheritdoc />
    string ISourceClass.Id => Id;

    /// <inheritdoc />
    public bool RunsWithoutSection => false;

    /// <inheritdoc />
    public ImmutableArray<string> ParameterColumns => MassiveBlackHoleBinaryParameters.ColumnNames;

    /// <inheritdoc />
    public ISimulatedSourceClass Simulation { get; } = new MassiveBlackHoleBinarySimulation();

    /// <inheritdoc />
    public IReadOnlyList<QuickBenchSuite> BenchSuites { get; } = [new("massive black-hole binary template", MassiveBlackHoleBinaryBench.Run)];

    /// <inheritdoc />
    ISimulatedSourceClass? ISourceClass.Simulation => Simulation;

    /// <summary>None: the demo fit cannot fit this class yet.</summary>
    public IDemoPart? Demo => null;

    /// <summary>Always refuses: fitting massive black-hole binaries is not built yet.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">Always; the message names the section.</exception>
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        throw section.InvalidTable($"fitting source class '{Id}' is not built yet (only simulating it is); remove the [{Id}] section from the run configuration");
    }
}
