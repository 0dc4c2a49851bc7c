using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

public class ObservationFileRoundTripTests
{
    [Fact]
    public void Written_observation_reads_back_with_bit_identical_samples_and_time_axis()
    {
        using var folder = new TempFolder();
        var written = ObservationSamples.Observation();
        string path = folder.File("obs.h5");

        ObservationFile.Write(written, path, overwrite: false);
        var read = ObservationFile.Read(path);

        // Bit patterns, not values: -0.0, subnormals and ±MaxValue must survive unchanged.
        foreach (var (expected, actual) in written.Data.Channels.Zip(read.Data.Channels))
        {
            Assert.Equal(expected.Samples.Select(BitConverter.DoubleToInt64Bits), actual.Samples.Select(BitConverter.DoubleToInt64Bits));
            Assert.Equal(expected.T0Seconds, actual.T0Seconds);
            Assert.Equal(expected.DtSeconds, actual.DtSeconds);
        }
    }

    [Fact]
    public void Written_observation_reads_back_with_identical_gaps_truth_and_provenance()
    {
        using var folder = new TempFolder();
        var written = ObservationSamples.Observation();
        string path = folder.File("obs.h5");

        ObservationFile.Write(written, path, overwrite: false);
        var read = ObservationFile.Read(path);

        Assert.Equal(ObservationFile.CurrentFormatVersion, read.FormatVersion);
        Assert.Equal(written.Gaps, read.Gaps);
        Assert.Equal(written.Provenance.Generator, read.Provenance.Generator);
        Assert.Equal(written.Provenance.CreatedUtc, read.Provenance.CreatedUtc);
        Assert.Equal(written.Provenance.CreatedUtc.Ticks, read.Provenance.CreatedUtc.Ticks);
        Assert.Equal(written.Provenance.Entries, read.Provenance.Entries);
        Assert.Equal(written.Truth.Select(t => t.ClassId), read.Truth.Select(t => t.ClassId));
        foreach (var (expected, actual) in written.Truth.Zip(read.Truth))
        {
            Assert.Equal(expected.Columns, actual.Columns);
            Assert.Equal(expected.Ids, actual.Ids);
            Assert.Equal(expected.Values.ToArray().Select(BitConverter.DoubleToInt64Bits), actual.Values.ToArray().Select(BitConverter.DoubleToInt64Bits));
        }
    }

    [Fact]
    public void Observation_without_gaps_or_truth_round_trips_as_empty()
    {
        using var folder = new TempFolder();
        var written = new Observation(ObservationSamples.Data(8), GapList.None, [], new ObservationProvenance("globalfit test", DateTimeOffset.UnixEpoch, []));
        string path = folder.File("bare.h5");

        ObservationFile.Write(written, path, overwrite: false);
        var read = ObservationFile.Read(path);

        Assert.Empty(read.Gaps);
        Assert.Empty(read.Truth);
        Assert.Empty(read.Provenance.Entries);
        Assert.Equal(8, read.Data.Count);
    }

    [Fact]
    public void Truth_columns_are_found_by_name_after_a_round_trip()
    {
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        ObservationFile.Write(ObservationSamples.Observation(), path, overwrite: false);

        var table = ObservationFile.Read(path).FindTruth("galactic_binaries")!;

        Assert.Equal(4.7e-3, table[1, "f0_hz"]);
        Assert.Equal(15.5, table[0, table.ColumnIndex("snr")]);
        Assert.True(double.IsNaN(table[1, "snr"]));
        Assert.Equal([3.1e-3, 1.2e-17, 2.5e-22, 0.3, 1.7, 0.9, 0.4, 2.2, 15.5], table.Row(0).ToArray());
    }

    [Fact]
    public void Summary_reports_axis_counts_and_provenance_without_a_full_read()
    {
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        var written = ObservationSamples.Observation(count: 64);
        ObservationFile.Write(written, path, overwrite: false);

        var summary = ObservationFile.ReadSummary(path);

        Assert.Equal(2, summary.FormatVersion);
        Assert.Equal("AET", summary.StoredChannels);
        Assert.Equal(64, summary.SampleCount);
        Assert.Equal(ObservationSamples.T0Seconds, summary.T0Seconds);
        Assert.Equal(ObservationSamples.DtSeconds, summary.DtSeconds);
        Assert.Equal(64 * 5.0, summary.DurationSeconds);
        Assert.Equal(2, summary.Gaps.Count);
        Assert.Equal(72.5, summary.Gaps.TotalSeconds);
        Assert.Equal(new Dictionary<string, int> { ["galactic_binaries"] = 2, ["massive_black_hole_binaries"] = 0 }, summary.TruthRowCounts);
        Assert.Equal("globalfit 0.1.0-test", summary.Provenance.Generator);
        Assert.Equal("42", summary.Provenance.Entries["seed"]);
    }

    [Fact]
    public void Summary_does_not_load_samples_so_a_file_with_a_bad_sample_still_summarises()
    {
        using var folder = new TempFolder();
        string path = folder.File("nan.h5");
        var tree = ObservationSamples.ValidTree(count: 16);
        ((double[])tree.Tdi()["E"])[3] = double.NaN;
        tree.Write(path);

        Assert.Equal(16, ObservationFile.ReadSummary(path).SampleCount);
        Assert.Throws<Physics.Files.InvalidInputException>(() => ObservationFile.Read(path));
    }

    [Fact]
    [Trait("Category", "Long")]
    public void One_year_at_five_second_cadence_round_trips()
    {
        // 6 311 520 samples per channel: checks that nothing in the path overflows or truncates at full size.
        const int count = 6_311_520;
        using var folder = new TempFolder();
        string path = folder.File("year.h5");
        var random = new Random(7);
        TimeSeries Channel() => new(0, 5.0, Enumerable.Range(0, count).Select(_ => random.NextDouble() - 0.5).ToArray());
        var written = new Observation(new AetTimeSeries(Channel(), Channel(), Channel()), GapList.None, [], ObservationSamples.Provenance());

        ObservationFile.Write(written, path, overwrite: false);
        var read = ObservationFile.Read(path);

        Assert.Equal(count, read.Data.Count);
        Assert.True(written.Data.T.Samples.AsSpan().SequenceEqual(read.Data.T.Samples));
    }
}
