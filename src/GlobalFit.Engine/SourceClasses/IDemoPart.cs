using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.DataFiles;

namespace GlobalFit.Engine.SourceClasses;

/// <summary>A class's part of the built-in demo: what it adds to the demo's scenario and run configuration, and how it
/// reports its catalogue against the injected truth.</summary>
public interface IDemoPart
{
    /// <summary>TOML tables the class adds to the demo scenario (its own section and sub-tables).</summary>
    string ScenarioToml { get; }

    /// <summary>TOML tables the class adds to the demo's run configuration.</summary>
    string FitToml { get; }

    /// <summary>Writes the comparison of the class's catalogue with its truth table.</summary>
    /// <param name="output">Where to write.</param>
    /// <param name="plan">The class's plan in the demo run.</param>
    /// <param name="dfHz">The record's bin spacing.</param>
    /// <param name="sources">The class's catalogue rows.</param>
    /// <param name="truth">The class's truth table, or null when the data hold none.</param>
    void Report(TextWriter output, IFitSourceClassPlan plan, double dfHz, IReadOnlyList<CatalogueRecord> sources, TruthTable? truth);
}
