using System.Collections.Immutable;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The four sky cells a galactic binary's sky posterior is reported in: ecliptic hemisphere (north: β ≥ 0) times
/// the side of the constellation's plane at mid-record (above: n̂·ν ≥ 0 for the plane's unit normal
/// ν = (p₂ − p₁) × (p₃ − p₁)/|…| from the spacecraft positions p₁, p₂, p₃, and n̂ the direction to the source).</summary>
/// <remarks>The short-record sky degeneracies are maps between these cells: the mirror image through the constellation
/// plane (same long-wavelength response) changes the side, the reflection in the ecliptic the hemisphere, the antipode
/// both (see <see cref="DopplerSkyJumpProposal"/>). So a chain that visits the modes spreads its samples over several
/// cells, and one caught in a mode keeps them all in one.</remarks>
public sealed class GalacticBinarySkyModes
{
    private readonly Vector3D _planeNormal;

    /// <summary>Creates the cells for the record of <paramref name="generator"/>.</summary>
    /// <param name="generator">Template generator of the data record (orbits, start, duration).</param>
    public GalacticBinarySkyModes(GalacticBinaryTemplateGenerator generator)
    {
        ArgumentNullException.ThrowIfNull(generator);
        _planeNormal = DopplerSkyJumpProposal.Geometry(generator.Orbits, generator.StartSeconds, generator.DurationSeconds).PlaneNormal;
    }

    /// <summary>The cell names, in the order of <see cref="Fractions"/>.</summary>
    public static ImmutableArray<string> Names { get; } = ["north_above", "north_below", "south_above", "south_below"];

    /// <summary>The cell of one source: index into <see cref="Names"/>.</summary>
    /// <param name="source">The source.</param>
    public int Cell(in GalacticBinaryParameters source)
    {
        double beta = source.EclipticLatitudeRad, lambda = source.EclipticLongitudeRad;
        var n = new Vector3D(Math.Cos(beta) * Math.Cos(lambda), Math.Cos(beta) * Math.Sin(lambda), Math.Sin(beta));
        return (beta >= 0 ? 0 : 2) + (n.Dot(_planeNormal) >= 0 ? 0 : 1);
    }

    /// <summary>Fraction of <paramref name="sources"/> in each cell (all zero for none).</summary>
    /// <param name="sources">Posterior samples of one source.</param>
    public ImmutableArray<double> Fractions(IReadOnlyCollection<GalacticBinaryParameters> sources)
    {
        ArgumentNullException.ThrowIfNull(sources);
        var counts = new double[Names.Length];
        foreach (var source in sources) counts[Cell(source)]++;
        if (sources.Count > 0)
            for (int i = 0; i < counts.Length; i++) counts[i] /= sources.Count;
        return [.. counts];
    }
}
