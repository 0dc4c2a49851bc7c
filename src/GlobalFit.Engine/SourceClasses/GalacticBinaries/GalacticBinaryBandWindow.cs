using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>One window of a <see cref="GalacticBinaryBandPlan"/>: the unit of work of one band worker.</summary>
/// <remarks>A source belongs to the window whose <see cref="Core"/> holds its f0. The worker's f0 prior covers
/// <see cref="SourceRange"/>, the core widened towards each neighbour by the drift margin, so a source can cross the
/// core edge without being killed; it is then handed to the neighbour between updates. Its template always fits in
/// <see cref="Padded"/>, the bins the worker reads.</remarks>
/// <param name="Index">Position in the plan, 0 for the lowest frequencies.</param>
/// <param name="Stage">0 or 1: windows of one stage are never adjacent and can be updated at the same time.</param>
/// <param name="Core">Bins whose sources this window owns.</param>
/// <param name="SourceRange">Bins the worker's f0 prior covers (core plus drift margins).</param>
/// <param name="Padded">Bins of the residual the worker reads and writes (core plus padding).</param>
/// <param name="DfHz">Bin spacing 1/T.</param>
public sealed record GalacticBinaryBandWindow(int Index, int Stage, BinWindow Core, BinWindow SourceRange, BinWindow Padded, double DfHz)
{
    /// <summary>Lower edge of the core.</summary>
    /// <value>Hz.</value>
    public double CoreStartHz => Core.First * DfHz;

    /// <summary>Upper edge of the core.</summary>
    /// <value>Hz.</value>
    public double CoreEndHz => Core.End * DfHz;

    /// <summary>Lower edge of the f0 prior.</summary>
    /// <value>Hz.</value>
    public double SourceStartHz => SourceRange.First * DfHz;

    /// <summary>Upper edge of the f0 prior.</summary>
    /// <value>Hz.</value>
    public double SourceEndHz => SourceRange.End * DfHz;

    /// <summary>True when f0 lies in the core [start, end).</summary>
    /// <param name="frequencyHz">f0.</param>
    public bool OwnsFrequency(double frequencyHz) => frequencyHz >= CoreStartHz && frequencyHz < CoreEndHz;
}
