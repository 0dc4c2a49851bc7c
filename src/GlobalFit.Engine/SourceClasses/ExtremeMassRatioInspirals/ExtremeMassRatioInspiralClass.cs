using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The extreme-mass-ratio inspiral module: its scenario section (an invented population and listed inspirals,
/// injected with the fast analytic-kludge template), its fit (one parallel-tempering worker per inspiral, started from
/// a row and a semi-coherent search, <see cref="InspiralFitPlan"/>), its catalogue rows, its part of the demo and its
/// quick bench figures.</summary>
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

    /// <summary>One invented inspiral in the demo's month, fitted from a start row some posterior widths off.</summary>
    public IDemoPart? Demo { get; } = new InspiralDemo();

    /// <summary>Reads the <c>[extreme_mass_ratio_inspirals]</c> section (see <see cref="InspiralFitPlan.FromConfig"/>).</summary>
    /// <exception cref="Physics.Files.InvalidInputException">A key is malformed or a start row is unusable; the message
    /// names the key.</exception>
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape) => InspiralFitPlan.FromConfig(section, shape);
}
