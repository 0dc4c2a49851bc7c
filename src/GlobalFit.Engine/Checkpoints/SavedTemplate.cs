using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.Checkpoints;

/// <summary>A worker's current template as stored in a checkpoint.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="First">First bin.</param>
/// <param name="A">Channel A.</param>
/// <param name="E">Channel E.</param>
/// <param name="T">Channel T or null.</param>
[MessagePackObject]
public sealed record SavedTemplate(
    [property: Key(0)] string WorkerId,
    [property: Key(1)] int First,
    [property: Key(2)] Complex[] A,
    [property: Key(3)] Complex[] E,
    [property: Key(4)] Complex[]? T)
{
    /// <summary>Stores <paramref name="template"/>.</summary>
    public static SavedTemplate From(string workerId, WindowSpectra template)
    {
        ArgumentNullException.ThrowIfNull(template);
        return new(workerId, template.Bins.First, template.A, template.E, template.T);
    }

    /// <summary>The template again.</summary>
    public WindowSpectra ToSpectra() => new(new BinWindow(First, A.Length), A, E, T);
}
