namespace GlobalFit.Engine.SourceClasses;

/// <summary>A class's part of the built-in demo: what it adds to the demo's scenario and run configuration. The demo
/// reports every class against the truth through <c>globalfit compare</c>'s code path (the class's
/// <see cref="Fitting.ISourceMatcher"/>).</summary>
public interface IDemoPart
{
    /// <summary>TOML tables the class adds to the demo scenario (its own section and sub-tables).</summary>
    string ScenarioToml { get; }

    /// <summary>TOML tables the class adds to the demo's run configuration.</summary>
    string FitToml { get; }
}
