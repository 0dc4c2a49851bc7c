using System.Runtime.CompilerServices;
using GlobalFit.Physics.DataFiles;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

/// <summary>A file written by the HDF5 C library through h5py (Reference/make_h5py_observation.py), not by PureHDF.</summary>
public class ObservationFileFromOtherWritersTests
{
    // The reference file sits beside this source file; tests run on the machine that built them.
    private static string ReferenceFile([CallerFilePath] string here = "") =>
        Path.Combine(Path.GetDirectoryName(here)!, "Reference", "h5py_observation.h5");

    [Fact]
    public void File_written_by_h5py_with_a_user_block_reads_with_its_time_axis_and_metadata()
    {
        var observation = ObservationFile.Read(ReferenceFile());

        Assert.Equal(1.9e9, observation.Data.T0Seconds);
        Assert.Equal(0.5, observation.Data.DtSeconds);
        Assert.Equal(4, observation.Data.Count);
        Assert.Equal("h5py reference writer", observation.Provenance.Generator);
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 22, 5, 0, TimeSpan.Zero), observation.Provenance.CreatedUtc);
        Assert.Equal("7", observation.Provenance.Entries["seed"]);
        Assert.Equal([new Gap(1.9e9 + 0.5, 1.9e9 + 1.5)], observation.Gaps);
        var table = observation.FindTruth("galactic_binaries")!;
        Assert.Equal(["gb-a", "gb-b"], table.Ids);
        Assert.Equal(["f0_hz", "amplitude"], table.Columns);
        Assert.Equal(4.5e-3, table[1, "f0_hz"]);
        Assert.True(double.IsNaN(table[1, "amplitude"]));
    }

    [Fact]
    public void Michelson_channels_from_h5py_convert_to_the_hand_computed_aet()
    {
        // X, Y, Z = (1, 2, 4), (0, 1, 0), (3, 3, 3), (−1, 0, 1) in the script. By hand with A = (Z − X)/√2,
        // E = (X − 2Y + Z)/√6, T = (X + Y + Z)/√3 (TdiCombination): A = 3/√2, 0, 0, 2/√2;
        // E = 1/√6, −2/√6, 0, 0; T = 7/√3, 1/√3, 9/√3, 0. 1e-15 relative allows one or two roundings.
        var data = ObservationFile.Read(ReferenceFile()).Data;

        double[] a = [3 / Math.Sqrt(2), 0, 0, 2 / Math.Sqrt(2)];
        double[] e = [1 / Math.Sqrt(6), -2 / Math.Sqrt(6), 0, 0];
        double[] t = [7 / Math.Sqrt(3), 1 / Math.Sqrt(3), 9 / Math.Sqrt(3), 0];
        for (int i = 0; i < 4; i++)
        {
            Assert.Equal(a[i], data.A.Samples[i], Math.Abs(a[i]) * 1e-15);
            Assert.Equal(e[i], data.E.Samples[i], Math.Abs(e[i]) * 1e-15);
            Assert.Equal(t[i], data.T.Samples[i], Math.Abs(t[i]) * 1e-15);
        }
    }

    [Fact]
    public void Truncated_copy_of_the_h5py_file_is_rejected()
    {
        using var folder = new TempFolder();
        string path = folder.File("cut.h5");
        var bytes = File.ReadAllBytes(ReferenceFile());
        File.WriteAllBytes(path, bytes[..^100]);

        BadInputAssert.Read(path, null, $"is truncated: it has {bytes.Length - 100} bytes but its HDF5 superblock records {bytes.Length}");
    }
}
