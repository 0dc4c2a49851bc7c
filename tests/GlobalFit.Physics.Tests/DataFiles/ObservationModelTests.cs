using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

public class ObservationModelTests
{
    [Fact]
    public void Observation_with_a_non_finite_sample_is_refused_naming_channel_and_index()
    {
        var data = ObservationSamples.Data(8);
        data.E.Samples[6] = double.NaN;
        var error = Assert.Throws<ArgumentException>(() => new Observation(data, GapList.None, [], ObservationSamples.Provenance()));
        Assert.Contains("channel E sample 6", error.Message);
    }

    [Fact]
    public void Observation_without_samples_is_refused()
    {
        var empty = new TimeSeries(0, 5, []);
        Assert.Throws<ArgumentException>(() => new Observation(new AetTimeSeries(empty, empty, empty), GapList.None, [], ObservationSamples.Provenance()));
    }

    [Fact]
    public void Two_truth_tables_for_one_class_are_refused()
    {
        Assert.Throws<ArgumentException>(() => new Observation(
            ObservationSamples.Data(8), GapList.None, [ObservationSamples.GalacticBinaries(), ObservationSamples.GalacticBinaries()], ObservationSamples.Provenance()));
    }

    [Fact]
    public void Truth_tables_are_kept_sorted_by_class_id()
    {
        var observation = new Observation(
            ObservationSamples.Data(8), GapList.None, [ObservationSamples.EmptyMassiveBlackHoles(), ObservationSamples.GalacticBinaries()], ObservationSamples.Provenance());
        Assert.Equal(["galactic_binaries", "massive_black_hole_binaries"], observation.Truth.Select(t => t.ClassId));
        Assert.Null(observation.FindTruth("extreme_mass_ratio_inspirals"));
    }

    [Theory]
    [InlineData("GalacticBinaries")]
    [InlineData("galactic-binaries")]
    [InlineData("_galactic")]
    [InlineData("galactic__binaries")]
    [InlineData("")]
    public void Class_id_must_be_snake_case(string classId)
    {
        Assert.Throws<ArgumentException>(() => new TruthTable(classId, ["f0_hz"], ["a"], [1.0]));
    }

    [Fact]
    public void Truth_table_refuses_a_value_count_that_does_not_fill_the_rows()
    {
        var error = Assert.Throws<ArgumentException>(() => new TruthTable("galactic_binaries", ["f0_hz", "amplitude"], ["a", "b"], [1, 2, 3]));
        Assert.Contains("2 rows × 2 columns need 4 values, got 3", error.Message);
    }

    [Fact]
    public void Truth_table_refuses_repeated_column_names_and_empty_ids()
    {
        Assert.Throws<ArgumentException>(() => new TruthTable("galactic_binaries", ["amplitude", "amplitude"], ["a"], [1, 2]));
        Assert.Throws<ArgumentException>(() => new TruthTable("galactic_binaries", ["amplitude"], [""], [1]));
        Assert.Throws<ArgumentException>(() => new TruthTable("galactic_binaries", [], [], []));
    }

    [Fact]
    public void Truth_table_names_its_columns_when_one_is_missing()
    {
        var error = Assert.Throws<KeyNotFoundException>(() => ObservationSamples.GalacticBinaries().ColumnIndex("mchirp_msun"));
        Assert.Contains("f0_hz", error.Message);
    }

    [Theory]
    [InlineData("")]
    [InlineData("a/b")]
    [InlineData("line\nbreak")]
    public void Provenance_key_must_be_a_plain_attribute_name(string key)
    {
        Assert.Throws<ArgumentException>(() => new ObservationProvenance("globalfit", DateTimeOffset.UnixEpoch, [new(key, "x")]));
    }

    [Fact]
    public void Provenance_creation_time_is_held_in_utc()
    {
        var provenance = new ObservationProvenance("globalfit", new DateTimeOffset(2026, 12, 1, 23, 0, 0, TimeSpan.FromHours(1)), []);
        Assert.Equal(TimeSpan.Zero, provenance.CreatedUtc.Offset);
        Assert.Equal(22, provenance.CreatedUtc.Hour);
    }
}
