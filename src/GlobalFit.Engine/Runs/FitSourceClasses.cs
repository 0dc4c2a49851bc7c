using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.GalacticBinaryBands;

namespace GlobalFit.Engine.Runs;

/// <summary>The source classes this build can fit: the one registration list the engine reads. Adding a class is
/// one line here, its folder, and its config section.</summary>
public static class FitSourceClasses
{
    /// <summary>The implemented classes, in the order their groups enter the default schedule.</summary>
    public static IReadOnlyList<IFitSourceClass> All { get; } = [new GalacticBinaryFitClass()];

    /// <summary>Class ids the project names (see the design's "Names") whose fitting is not built yet; a config that
    /// asks for one is refused with that reason rather than as an unknown section.</summary>
    public static IReadOnlyList<string> Planned { get; } = ["massive_black_holes", "inspirals"];
}
