using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class BandUpdateClockTests
{
    [Fact]
    public void A_band_update_reports_every_part_once_with_disjoint_times_inside_its_wall_time()
    {
        var settings = GalacticBinaryBandWorkerTests.SmallSettings;
        var plan = GalacticBinaryBandPlan.Create(settings, new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds));
        var window = plan.Windows[0];
        var probe = new BandTestData(30, window.Padded, [], 1, noise: false);
        var truth = probe.WithSnr(new GalacticBinaryParameters(window.CoreStartHz + 40.3 * window.DfHz, 0, 1e-22, 0.5, 1.2, 0.9, 0.4, 2.1), 30);
        var data = new BandTestData(30, window.Padded, [truth], 5);
        var worker = new GalacticBinaryBandWorker(settings, window, data.Generator, 3);

        var first = worker.Update(data.Residual(window.Padded), 50).Statistics;
        var second = worker.Update(data.Residual(window.Padded), 50).Statistics;

        string[] names = [.. Enum.GetValues<BandUpdatePhase>().Select(BandUpdateClock.Name)];
        foreach (var statistics in new[] { first, second })
        {
            Assert.Equal(names, statistics.Phases.Select(p => p.Name));
            Assert.Equal(["template", "likelihood"], statistics.Phases.Where(p => p.IsKernel).Select(p => p.Name));
            Assert.All(statistics.Phases, p => Assert.True(p.Milliseconds >= 0, $"{p.Name} {p.Milliseconds}"));
            // The parts are disjoint, so together they fit inside the update's wall time (the clock reads in between are
            // the only time left out).
            Assert.True(statistics.Phases.Sum(p => p.Milliseconds) <= statistics.WallTime.TotalMilliseconds, string.Join(", ", statistics.Phases.Select(p => $"{p.Name} {p.Milliseconds}")) + $" wall {statistics.WallTime.TotalMilliseconds}");
            var byName = statistics.Phases.ToDictionary(p => p.Name);
            // Every rendered template has its inner products taken once.
            Assert.Equal(byName["template"].Count, byName["likelihood"].Count);
            Assert.Equal(1, byName["state_capture"].Count);
        }
        // Only a new worker searches for starting sources.
        Assert.Equal(1, first.Phases.Single(p => p.Name == "greedy_search").Count);
        Assert.Equal(0, second.Phases.Single(p => p.Name == "greedy_search").Count);
    }
}
