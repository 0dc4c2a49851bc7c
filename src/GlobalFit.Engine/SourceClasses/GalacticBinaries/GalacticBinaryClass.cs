using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The galactic-binary module: one reversible-jump worker per band window, the even and odd windows in two
/// groups so that each group's templates never share a bin; populations and listed binaries in scenarios; catalogue
/// rows per resolved binary.</summary>
public sealed class GalacticBinaryClass : ISourceClass
{
    /// <summary>The class id: config and scenario section, truth table, worker-id prefix.</summary>
    public const string Id = "galactic_binaries";

    /// <inheritdoc />
    string ISourceClass.Id => Id;

    /// <inheritdoc />
    public bool RunsWithoutSection => false;

    /// <inheritdoc />
    public ImmutableArray<string> ParameterColumns => GalacticBinaryParameters.ColumnNames;

    /// <inheritdoc />
    public ISimulatedSourceClass Simulation { get; } = new GalacticBinarySimulation();

    /// <inheritdoc />
    public IReadOnlyList<QuickBenchSuite> BenchSuites { get; } = [new("galactic-binary template", GalacticBinaryBench.Run)];

    /// <inheritdoc />
    public IDemoPart Demo { get; } = new GalacticBinaryDemo();

    /// <inheritdoc />
    ISimulatedSourceClass? ISourceClass.Simulation => Simulation;

    /// <inheritdoc />
    IDemoPart? ISourceClass.Demo => Demo;

    /// <inheritdoc />
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(shape);
        var generator = CreateGenerator(shape);
        var (settings, plan) = GalacticBinaryBandSettings.FromConfig(section, generator);
        return new GalacticBinaryFitPlan(settings, plan, generator);
    }

    internal static GalacticBinaryTemplateGenerator CreateGenerator(FitDataShape shape) =>
        new(shape.DurationS, shape.CadenceS, startSeconds: shape.StartS);
}
