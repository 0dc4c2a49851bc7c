using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;
using PureHDF;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

public class ObservationFileBadInputTests
{
    private static string WriteTree(TempFolder folder, H5File tree, string name = "bad.h5")
    {
        string path = folder.File(name);
        tree.Write(path);
        return path;
    }

    [Fact]
    public void Hand_built_valid_tree_reads_so_each_broken_variant_below_fails_for_its_own_reason()
    {
        using var folder = new TempFolder();
        var observation = ObservationFile.Read(WriteTree(folder, ObservationSamples.ValidTree(count: 16)));
        Assert.Equal(16, observation.Data.Count);
        Assert.Equal(ObservationSamples.DtSeconds, observation.Data.DtSeconds);
    }

    [Fact]
    public void Missing_file_is_reported_with_its_path()
    {
        using var folder = new TempFolder();
        BadInputAssert.Read(folder.File("nowhere.h5"), null, "file not found");
    }

    [Fact]
    public void Folder_given_as_file_is_reported()
    {
        using var folder = new TempFolder();
        BadInputAssert.Read(folder.Path, null, "is a folder");
    }

    [Fact]
    public void Text_file_with_h5_extension_is_not_an_hdf5_file()
    {
        using var folder = new TempFolder();
        string path = folder.File("notes.h5");
        File.WriteAllText(path, "start,end\n0,10\n");
        BadInputAssert.Read(path, null, "is not an HDF5 file (no HDF5 signature at its start)");
    }

    [Fact]
    public void Empty_file_is_not_an_hdf5_file()
    {
        using var folder = new TempFolder();
        string path = folder.File("empty.h5");
        File.WriteAllBytes(path, []);
        BadInputAssert.Read(path, null, "is empty, not an HDF5 file");
    }

    [Theory]
    [InlineData(1)]
    [InlineData(10)]
    [InlineData(1000)]
    public void Observation_file_missing_its_last_bytes_is_rejected_as_truncated(int bytesCut)
    {
        // PureHDF alone read a copy missing up to 10 trailing bytes (part of the root object header) without error.
        using var folder = new TempFolder();
        string path = folder.File("cut.h5");
        ObservationFile.Write(ObservationSamples.Observation(count: 256), path, overwrite: false);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..^bytesCut]);

        BadInputAssert.Read(path, null, $"is truncated: it has {bytes.Length - bytesCut} bytes but its HDF5 superblock records {bytes.Length}");
    }

    [Fact]
    public void Observation_file_cut_inside_its_superblock_is_rejected()
    {
        using var folder = new TempFolder();
        string path = folder.File("cut.h5");
        ObservationFile.Write(ObservationSamples.Observation(count: 256), path, overwrite: false);
        File.WriteAllBytes(path, File.ReadAllBytes(path)[..20]);

        Assert.Throws<InvalidInputException>(() => ObservationFile.Read(path));
    }

    [Fact]
    public void Foreign_hdf5_file_without_format_version_is_not_an_observation_file()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes.Remove("format_version");
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute format_version", "not a globalfit observation file");
    }

    [Fact]
    public void Unknown_format_version_is_refused_with_the_supported_one()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes["format_version"] = 3;
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute format_version", "format version 3 is not supported; this build reads version 2");
    }

    [Fact]
    public void A_file_of_format_version_one_is_refused_with_what_changed_since()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes["format_version"] = 1;
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute format_version", "format version 1 was written by an earlier globalfit");
    }

    [Fact]
    public void Format_version_stored_as_text_is_refused()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes["format_version"] = "1";
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute format_version", "expected an integer");
    }

    [Fact]
    public void Format_version_as_64_bit_integer_from_other_writers_is_accepted()
    {
        // h5py stores a Python int as int64; PureHDF would reinterpret its bytes if read with the wrong width.
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes["format_version"] = 2L;
        tree.Tdi().Attributes["dt_s"] = 5L;
        var observation = ObservationFile.Read(WriteTree(folder, tree));
        Assert.Equal(2, observation.FormatVersion);
        Assert.Equal(5.0, observation.Data.DtSeconds);
    }

    [Fact]
    public void Missing_tdi_group_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Remove("tdi");
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi", "missing");
    }

    [Fact]
    public void Missing_creation_time_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes.Remove("created_utc");
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute created_utc", "missing");
    }

    [Fact]
    public void Unparsable_creation_time_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Attributes["created_utc"] = "yesterday";
        BadInputAssert.Read(WriteTree(folder, tree), "/ attribute created_utc", "not an ISO 8601 time");
    }

    [Theory]
    [InlineData("t0_s")]
    [InlineData("dt_s")]
    public void Missing_start_time_or_cadence_is_reported_with_the_alternative(string attribute)
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes.Remove(attribute);
        BadInputAssert.Read(WriteTree(folder, tree), $"/tdi attribute {attribute}", "or a time_s dataset");
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-5.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Cadence_that_is_not_positive_and_finite_is_reported(double dt)
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes["dt_s"] = dt;
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute dt_s", "must be a positive finite number");
    }

    [Fact]
    public void Non_finite_start_time_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes["t0_s"] = double.NegativeInfinity;
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute t0_s", "must be finite");
    }

    [Fact]
    public void Cadence_stored_as_text_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes["dt_s"] = "5 s";
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute dt_s", "expected a number");
    }

    [Theory]
    [InlineData("E", 5, double.NaN)]
    [InlineData("A", 0, double.PositiveInfinity)]
    [InlineData("T", 14, double.NegativeInfinity)]
    public void Non_finite_sample_is_reported_with_channel_and_first_bad_index(string channel, int index, double value)
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        var samples = (double[])tree.Tdi()[channel];
        samples[index] = value;
        samples[^1] = double.NaN; // a later bad sample must not be the one reported
        var error = BadInputAssert.Read(WriteTree(folder, tree), $"/tdi/{channel} sample {index}", "samples must be finite");
        Assert.Contains($"channel {channel}", error.Problem);
    }

    [Fact]
    public void Non_finite_michelson_sample_is_reported_in_the_stored_channel_before_conversion()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16, channels: "XYZ");
        ((double[])tree.Tdi()["Y"])[7] = double.NaN;
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/Y sample 7", "samples must be finite");
    }

    [Fact]
    public void Channels_of_different_lengths_are_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi()["T"] = ObservationSamples.Channel(15, 2);
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/T", "has 15 samples but /tdi/A has 16");
    }

    [Fact]
    public void Empty_channels_are_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        foreach (var channel in new[] { "A", "E", "T" }) tree.Tdi()[channel] = Array.Empty<double>();
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/A", "is empty");
    }

    [Fact]
    public void Missing_channel_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Remove("E");
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/E", "missing");
    }

    [Fact]
    public void Single_precision_channel_is_refused_rather_than_misread()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi()["E"] = new float[16];
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/E", "holds float32 values; expected float64");
    }

    [Fact]
    public void Two_dimensional_channel_is_refused()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi()["A"] = new double[4, 4];
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/A", "has 2 dimensions; expected 1");
    }

    [Theory]
    [InlineData("AE")]
    [InlineData("aet")]
    [InlineData("XYZT")]
    public void Unknown_channel_set_is_reported(string channels)
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes["channels"] = channels;
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute channels", "expected 'AET' or 'XYZ'");
    }

    [Fact]
    public void Channels_in_other_units_are_refused()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree();
        tree.Tdi().Attributes["units"] = "strain";
        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute units", "expected 'fractional frequency'");
    }
}
