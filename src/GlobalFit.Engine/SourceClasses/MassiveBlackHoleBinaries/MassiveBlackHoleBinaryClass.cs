using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary module: one worker per binary over a broadband window, each found by a matched-filter
/// search of its residual and sampled by parallel tempering on the heterodyned likelihood; scenarios inject populations and
/// listed binaries; catalogue rows per binary.</summary>
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

    /// <summary>One invented binary merging inside the demo's month, fitted by the demo.</summary>
    public IDemoPart Demo { get; } = new MassiveBlackHoleBinaryDemo();

    /// <inheritdoc />
    IDemoPart? ISourceClass.Demo => Demo;

    /// <summary>Reads the <c>[massive_black_hole_binaries]</c> section (<see cref="MassiveBlackHoleBinaryFitSettings"/>) and plans
    /// one worker per binary.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown, malformed or cannot work with the data; the
    /// message names it.</exception>
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(shape);
        return new MassiveBlackHoleBinaryFitPlan(MassiveBlackHoleBinaryFitSettings.FromConfig(section, shape), shape);
    }
}
