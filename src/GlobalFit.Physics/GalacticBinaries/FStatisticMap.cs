using System.Collections.Immutable;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The F-statistic evaluated at the centre of every cell of an <see cref="FStatisticGrid"/> over one band.</summary>
/// <remarks>The input of a birth proposal (<see cref="FStatisticBirthDensity"/>): Crowder &amp; Cornish 2007 and
/// Littenberg 2011 turn F over frequency and sky into proposal densities (how they do it: from memory). Cost: one
/// <see cref="FStatistic.Evaluate"/> per cell. Immutable once computed.</remarks>
public sealed class FStatisticMap
{
    private FStatisticMap(FStatisticGrid grid, ImmutableArray<double> values)
    {
        Grid = grid;
        Values = values;
    }

    /// <summary>The grid.</summary>
    public FStatisticGrid Grid { get; }

    /// <summary>F at each cell centre, by cell index.</summary>
    public ImmutableArray<double> Values { get; }

    /// <summary>Evaluates F on every cell of <paramref name="grid"/> for the data of <paramref name="band"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A cell centre lies outside (0, Nyquist).</exception>
    public static FStatisticMap Compute(FStatistic statistic, GalacticBinaryBand band, FStatisticGrid grid)
    {
        ArgumentNullException.ThrowIfNull(statistic);
        ArgumentNullException.ThrowIfNull(band);
        ArgumentNullException.ThrowIfNull(grid);
        var values = new double[grid.CellCount];
        for (int cell = 0; cell < values.Length; cell++)
            values[cell] = statistic.Evaluate(grid.Centre(cell), band).Value;
        return new FStatisticMap(grid, ImmutableArray.Create(values));
    }

    /// <summary>A map of values computed elsewhere (e.g. updated cell by cell where the data changed).</summary>
    /// <param name="grid">The grid.</param>
    /// <param name="values">F at each cell centre, by cell index.</param>
    /// <returns>The map.</returns>
    /// <exception cref="ArgumentException">The number of values differs from the grid's cell count.</exception>
    public static FStatisticMap FromValues(FStatisticGrid grid, ImmutableArray<double> values)
    {
        ArgumentNullException.ThrowIfNull(grid);
        if (values.IsDefault || values.Length != grid.CellCount)
            throw new ArgumentException($"need {grid.CellCount} values, one per cell, got {(values.IsDefault ? 0 : values.Length)}", nameof(values));
        return new FStatisticMap(grid, values);
    }

    /// <summary>The cell with the largest F.</summary>
    public int BestCell()
    {
        int best = 0;
        for (int cell = 1; cell < Values.Length; cell++)
            if (Values[cell] > Values[best]) best = cell;
        return best;
    }
}
