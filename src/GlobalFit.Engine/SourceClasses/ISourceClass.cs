using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;

namespace GlobalFit.Engine.SourceClasses;

/// <summary>One module of the global fit under one id: a source class or the noise model. It gives the program everything it needs of the class: its run
/// configuration section as a plan and workers, its scenario section as injections and a truth table, its samples as
/// catalogue rows, its parameter columns, its bench figures and its part of the demo. The engine and the CLI never
/// switch on the class; a module is one folder and one line of <see cref="SourceClassRegistry.Default"/>.</summary>
public interface ISourceClass
{
    /// <summary>The id: config and scenario section name, truth-table name, worker-id prefix, catalogue class.</summary>
    string Id { get; }

    /// <summary>Whether the fit runs the module when the run configuration has no section for it (the noise model
    /// always runs; a source class runs only when asked for).</summary>
    bool RunsWithoutSection { get; }

    /// <summary>The parameter columns of its samples, catalogue rows and truth table, in order (without
    /// <c>id</c> and <c>snr</c>).</summary>
    ImmutableArray<string> ParameterColumns { get; }

    /// <summary>How the simulator injects the class, or null when it has no scenario section of its own (the noise is
    /// the observation's).</summary>
    ISimulatedSourceClass? Simulation { get; }

    /// <summary>The quick measurements <c>globalfit bench</c> runs for the class (hot kernels).</summary>
    IReadOnlyList<QuickBenchSuite> BenchSuites { get; }

    /// <summary>The class's part of the built-in demo, or null when the demo leaves it out.</summary>
    IDemoPart? Demo { get; }

    /// <summary>Reads and validates the class's run-configuration section against the data record and plans its workers.</summary>
    /// <param name="section">The <c>[id]</c> table of the run configuration (an empty one when absent and
    /// <see cref="RunsWithoutSection"/>).</param>
    /// <param name="shape">The data record.</param>
    /// <returns>The plan.</returns>
    /// <exception cref="Physics.Files.InvalidInputException">A key is malformed or cannot work with the data; the
    /// message names it.</exception>
    IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape);
}
