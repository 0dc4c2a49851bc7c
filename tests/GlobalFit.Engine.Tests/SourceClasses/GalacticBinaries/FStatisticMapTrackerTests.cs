using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class FStatisticMapTrackerTests
{
    // Subtracting a source changes the data on its template's bins only; the tracker re-evaluates the cells that reach them
    // and must end with exactly the map a full computation gives, while evaluating fewer cells than a second full map.
    [Fact]
    public void A_map_refreshed_where_a_source_was_subtracted_equals_the_recomputed_map_bit_for_bit()
    {
        var window = new BinWindow(7776, 256);
        double df = 1 / (30 * 86400.0);
        var source = new GalacticBinaryParameters((7776 + 60.3) * df, 1e-16, 3e-22, 0.3, 1.0, 0.5, 0.2, 0.1);
        var data = new BandTestData(30, window, [source], 8);
        var band = data.Residual(window);
        var statistic = new FStatistic(data.Generator);
        var grid = FStatisticGrid.ForWindow(new BinWindow(7776 + 32, 192), df, 2, -1e-16, 1e-15, 1, 4, 8);
        var tracker = new FStatisticMapTracker(statistic, band, grid);

        var template = (A: new Complex[window.Count], E: new Complex[window.Count]);
        data.Generator.AddResponse(source, window, template.A, template.E, Span<Complex>.Empty);
        for (int k = 0; k < window.Count; k++)
        {
            band.DataA[k] -= template.A[k];
            band.DataE[k] -= template.E[k];
        }
        tracker.Refresh(statistic, band, data.Generator.TemplateBins(source.FrequencyHz, source.FrequencyDerivativeHzS));

        var expected = FStatisticMap.Compute(statistic, band, grid);
        // As arrays: ImmutableArray's own equality compares references.
        Assert.Equal(expected.Values.ToArray(), tracker.ToMap().Values.ToArray());
        Assert.Equal(expected.BestCell(), tracker.BestCell());
        Assert.InRange(tracker.CellsEvaluated, grid.CellCount + 1, 2 * grid.CellCount - 1);
    }
}
