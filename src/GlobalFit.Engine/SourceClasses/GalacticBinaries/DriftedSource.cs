using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A source whose f0 left its worker's core, on its way to the neighbouring window.</summary>
/// <param name="Chain">The chain that held it; the neighbour puts it in its chain of the same index.</param>
/// <param name="TargetWindow">Index of the window whose core now holds f0.</param>
/// <param name="Source">Its parameters.</param>
public sealed record DriftedSource(int Chain, int TargetWindow, GalacticBinaryParameters Source);
