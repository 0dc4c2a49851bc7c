using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

public class GapListTests
{
    [Fact]
    public void Mask_flags_samples_inside_half_open_gaps()
    {
        // Samples at 0, 5, …, 45 s; gap [10, 25) holds the samples at 10, 15, 20 and not the one at 25; [37, 41) holds 40.
        var gaps = new GapList([new Gap(10, 25), new Gap(37, 41)]);

        var observed = gaps.ObservedMask(t0Seconds: 0, dtSeconds: 5, sampleCount: 10);

        Assert.Equal([true, true, false, false, false, true, true, true, false, true], observed);
    }

    [Fact]
    public void Mask_agrees_with_the_sample_times_a_series_reports()
    {
        // Offset start and a cadence that is not exact in binary: the mask must match Gap.Contains(TimeOf(n)) for every n.
        var series = new TimeSeries(1.9e9 + 0.1, 0.3, new double[5000]);
        var gaps = new GapList([new Gap(series.TimeOf(100), series.TimeOf(250) + 1e-9), new Gap(series.TimeOf(1000) - 0.05, series.TimeOf(4999))]);

        var observed = gaps.ObservedMask(series.T0Seconds, series.DtSeconds, series.Count);

        for (int n = 0; n < series.Count; n++)
            Assert.Equal(!gaps.Any(g => g.Contains(series.TimeOf(n))), observed[n]);
        Assert.False(observed[100]);
        Assert.True(observed[99]);
        Assert.True(observed[4999]);
    }

    [Fact]
    public void Gaps_outside_a_short_mask_do_not_touch_it()
    {
        var gaps = new GapList([new Gap(-50, -10), new Gap(500, 600)]);
        Assert.All(gaps.ObservedMask(0, 5, 10), Assert.True);
    }

    [Fact]
    public void Total_length_sums_the_gaps()
    {
        Assert.Equal(18.5, new GapList([new Gap(0, 10), new Gap(10, 12), new Gap(20, 26.5)]).TotalSeconds);
        Assert.Equal(0.0, GapList.None.TotalSeconds);
    }

    [Fact]
    public void Overlapping_gaps_are_refused_naming_the_later_gap()
    {
        var error = Assert.Throws<ArgumentException>(() => new GapList([new Gap(0, 10), new Gap(5, 15)]));
        Assert.Contains("gap 1", error.Message);
    }

    [Fact]
    public void Gap_sticking_out_of_the_record_is_refused()
    {
        var gaps = new GapList([new Gap(0, 10), new Gap(90, 101)]);
        var error = Assert.Throws<ArgumentException>(() => gaps.CheckWithin(0, 100));
        Assert.Contains("gap 1 [90, 101) is not inside the record [0, 100)", error.Message);
    }

    [Fact]
    public void Observation_with_a_gap_outside_its_record_is_refused()
    {
        Assert.Throws<ArgumentException>(() => new Observation(
            ObservationSamples.Data(8), new GapList([new Gap(0, 10)]), [], ObservationSamples.Provenance()));
    }
}
