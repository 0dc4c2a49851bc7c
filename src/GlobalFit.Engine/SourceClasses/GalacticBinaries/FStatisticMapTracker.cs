using System.Collections.Immutable;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>An F-statistic map kept up to date while its data change in a few bins: only the cells whose basis templates
/// reach a changed bin are evaluated again.</summary>
/// <remarks>F at a cell is computed from the data and inverse PSDs on the bins of the cell's basis templates
/// (<see cref="GalacticBinaryTemplateGenerator.TemplateBins"/>) and nothing else, so a cell whose bins did not change
/// keeps exactly the value a full <see cref="FStatisticMap.Compute"/> would give it: the updated map equals the recomputed
/// one bit for bit. Not thread-safe.</remarks>
internal sealed class FStatisticMapTracker
{
    private readonly FStatisticGrid _grid;
    private readonly double[] _values;

    /// <summary>Evaluates every cell for <paramref name="band"/>.</summary>
    public FStatisticMapTracker(FStatistic statistic, GalacticBinaryBand band, FStatisticGrid grid)
    {
        _grid = grid;
        _values = new double[grid.CellCount];
        for (int cell = 0; cell < _values.Length; cell++) _values[cell] = statistic.Evaluate(grid.Centre(cell), band).Value;
        CellsEvaluated = _values.Length;
    }

    /// <summary>Cell evaluations so far.</summary>
    public long CellsEvaluated { get; private set; }

    /// <summary>F of cell <paramref name="cell"/>.</summary>
    public double this[int cell] => _values[cell];

    /// <summary>Re-evaluates the cells whose basis bins meet <paramref name="changed"/> (full-resolution bins) after the
    /// data of <paramref name="band"/> changed there and nowhere else.</summary>
    public void Refresh(FStatistic statistic, GalacticBinaryBand band, BinWindow changed)
    {
        if (changed.Count <= 0) return;
        var generator = statistic.Generator;
        for (int cell = 0; cell < _values.Length; cell++)
        {
            var centre = _grid.Centre(cell);
            var bins = generator.TemplateBins(centre.FrequencyHz, centre.FrequencyDerivativeHzS);
            if (bins.End <= changed.First || bins.First >= changed.End) continue;
            _values[cell] = statistic.Evaluate(centre, band).Value;
            CellsEvaluated++;
        }
    }

    /// <summary>The cell with the largest F (the first one on ties, as <see cref="FStatisticMap.BestCell"/>).</summary>
    public int BestCell()
    {
        int best = 0;
        for (int cell = 1; cell < _values.Length; cell++)
            if (_values[cell] > _values[best]) best = cell;
        return best;
    }

    /// <summary>The current values as a map.</summary>
    public FStatisticMap ToMap() => FStatisticMap.FromValues(_grid, ImmutableArray.Create(_values));
}
