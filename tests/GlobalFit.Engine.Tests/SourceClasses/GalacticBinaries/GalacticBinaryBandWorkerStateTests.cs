using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryBandWorkerStateTests
{
    private static (GalacticBinaryBandWindow Window, BandTestData Data) Setup()
    {
        var settings = GalacticBinaryBandWorkerTests.SmallSettings;
        var plan = GalacticBinaryBandPlan.Create(settings, new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds));
        var window = plan.Windows[1];
        var source = new GalacticBinaryParameters(window.CoreStartHz + 40.7 * window.DfHz, 0, 3e-22, -0.3, 4.0, 1.1, 2.0, 0.5);
        return (window, new BandTestData(30, window.Padded, [source], 9));
    }

    private static GalacticBinaryBandWorker NewWorker(GalacticBinaryBandWindow window, BandTestData data) =>
        new(GalacticBinaryBandWorkerTests.SmallSettings, window, new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds), 77);

    // ImmutableArray's own equality compares array references, so contents are compared as plain arrays.
    private static void AssertSame(GalacticBinaryBandUpdate expected, GalacticBinaryBandUpdate actual)
    {
        Assert.Equal(expected.Template.A, actual.Template.A);
        Assert.Equal(expected.Template.E, actual.Template.E);
        Assert.Equal(expected.Samples.Length, actual.Samples.Length);
        for (int i = 0; i < expected.Samples.Length; i++)
        {
            Assert.Equal(expected.Samples[i].Step, actual.Samples[i].Step);
            Assert.Equal(expected.Samples[i].LogLikelihood, actual.Samples[i].LogLikelihood);
            Assert.Equal(expected.Samples[i].Sources.ToArray(), actual.Samples[i].Sources.ToArray());
        }
        Assert.Equal(expected.Statistics.LogLikelihood, actual.Statistics.LogLikelihood);
        Assert.Equal(expected.Statistics.Sampler.Proposals.ToArray(), actual.Statistics.Sampler.Proposals.ToArray());
    }

    // Exact equality: resuming must continue the same arithmetic on the same random streams (no tolerance).
    [Fact]
    public void A_restored_worker_continues_bit_for_bit()
    {
        var (window, data) = Setup();
        var original = NewWorker(window, data);
        original.Update(data.Residual(window.Padded), 150);
        byte[] saved = original.SaveState();
        var expected = original.Update(data.Residual(window.Padded), 150);
        var restored = GalacticBinaryBandWorker.Restore(GalacticBinaryBandWorkerTests.SmallSettings, window,
            new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds), saved);
        var actual = restored.Update(data.Residual(window.Padded), 150);
        AssertSame(expected, actual);
        Assert.Equal(original.SaveState(), restored.SaveState());
    }

    [Fact]
    public void The_same_seed_gives_the_same_updates()
    {
        var (window, data) = Setup();
        AssertSame(NewWorker(window, data).Update(data.Residual(window.Padded), 150), NewWorker(window, data).Update(data.Residual(window.Padded), 150));
    }

    [Fact]
    public void A_state_of_another_window_is_refused()
    {
        var (window, data) = Setup();
        var worker = NewWorker(window, data);
        var plan = GalacticBinaryBandPlan.Create(GalacticBinaryBandWorkerTests.SmallSettings, data.Generator);
        Assert.Throws<ArgumentException>(() => GalacticBinaryBandWorker.Restore(GalacticBinaryBandWorkerTests.SmallSettings, plan.Windows[0], data.Generator, worker.SaveState()));
    }

    [Fact]
    public void A_residual_over_the_wrong_bins_is_refused()
    {
        var (window, data) = Setup();
        var worker = NewWorker(window, data);
        var shifted = new Physics.Series.BinWindow(window.Padded.First + 1, window.Padded.Count - 1);
        Assert.Throws<ArgumentException>(() => worker.Update(data.Residual(shifted), 10));
    }

    // Births and the starting search cover only the core, so a source reaches a drift margin by moving there. The test
    // puts it there directly (Adopt into the left worker, whose prior covers the margin), then checks the hand-off.
    [Fact]
    public void A_source_in_the_drift_margin_moves_to_the_neighbour_that_owns_it()
    {
        var settings = GalacticBinaryBandWorkerTests.SmallSettings;
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds);
        var plan = GalacticBinaryBandPlan.Create(settings, generator);
        var (left, right) = (plan.Windows[0], plan.Windows[1]);
        var source = new GalacticBinaryParameters(left.CoreEndHz + 3.4 * left.DfHz, 0, 4e-22, 0.2, 1.0, 0.6, 0.3, 1.0);
        var union = new Physics.Series.BinWindow(left.Padded.First, right.Padded.End - left.Padded.First);
        var data = new BandTestData(30, union, [], 3);
        var leftWorker = new GalacticBinaryBandWorker(settings, left, generator, 5);
        var rightWorker = new GalacticBinaryBandWorker(settings, right, new GalacticBinaryTemplateGenerator(30 * 86400.0, BandTestData.CadenceSeconds), 5);
        Assert.Equal(0, leftWorker.Adopt([new DriftedSource(0, 0, source)]));
        leftWorker.Update(data.Residual(left.Padded), 20);
        rightWorker.Update(data.Residual(right.Padded), 20);
        int rightBefore = rightWorker.CurrentSources().Length;
        Assert.Equal(1, leftWorker.Adopt([new DriftedSource(0, 0, source)]));
        Assert.Contains(leftWorker.CurrentSources(), s => data.Match(s, source) > 0.999999);
        var drifted = leftWorker.TakeDriftedSources();
        var handed = Assert.Single(drifted, d => data.Match(d.Source, source) > 0.999999);
        Assert.Equal((0, 1), (handed.Chain, handed.TargetWindow));
        Assert.DoesNotContain(leftWorker.CurrentSources(), s => !left.OwnsFrequency(s.FrequencyHz));
        Assert.Equal(drifted.Count, rightWorker.Adopt(drifted));
        Assert.Equal(rightBefore + drifted.Count(d => d.Chain == 0), rightWorker.CurrentSources().Length);
        Assert.Contains(rightWorker.CurrentSources(), s => data.Match(s, source) > 0.999999);
        Assert.Throws<ArgumentException>(() => leftWorker.Adopt(drifted));
        // A source beyond the left worker's drift margin lies outside its prior and is not adopted.
        Assert.Equal(0, leftWorker.Adopt([new DriftedSource(0, 0, source with { FrequencyHz = right.CoreStartHz + 60 * right.DfHz })]));
    }
}
