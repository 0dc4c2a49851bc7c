using GlobalFit.Cli.Tests.Support;
using PureHDF;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary><c>inspect</c> on files that are HDF5 but not valid observations: exit 2 and a message naming the
/// file and the dataset or sample (the full catalogue of cases is tested in GlobalFit.Physics.Tests/DataFiles).</summary>
public class InspectBadFileTests
{
    private static string Write(TempFolder folder, string name, double[] a, double[] e, double[] t, bool withVersion = true)
    {
        var file = new H5File
        {
            ["tdi"] = new H5Group
            {
                Attributes = { ["t0_s"] = 0.0, ["dt_s"] = 5.0, ["units"] = "fractional frequency", ["channels"] = "AET" },
                ["A"] = a,
                ["E"] = e,
                ["T"] = t,
            },
        };
        if (withVersion)
        {
            file.Attributes["format_version"] = 2;
            file.Attributes["created_utc"] = "2026-12-01T00:00:00Z";
            file.Attributes["generator"] = "test";
        }
        string path = folder.File(name);
        file.Write(path);
        return path;
    }

    [Fact]
    public void A_nan_sample_is_reported_with_its_channel_and_index()
    {
        using var folder = new TempFolder();
        var e = new double[64];
        e[37] = double.NaN;
        var result = CliRun.Run("inspect", Write(folder, "nan.h5", new double[64], e, new double[64]));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("nan.h5", result.Error);
        Assert.Contains("/tdi/E", result.Error);
        Assert.Contains("sample 37", result.Error);
    }

    [Fact]
    public void Channels_of_different_lengths_are_reported()
    {
        using var folder = new TempFolder();
        var result = CliRun.Run("inspect", Write(folder, "ragged.h5", new double[64], new double[64], new double[63]));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("ragged.h5", result.Error);
        Assert.Contains("63", result.Error);
    }

    [Fact]
    public void A_foreign_hdf5_file_is_refused()
    {
        using var folder = new TempFolder();
        var result = CliRun.Run("inspect", Write(folder, "foreign.h5", new double[64], new double[64], new double[64], withVersion: false));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("foreign.h5", result.Error);
        Assert.Contains("format_version", result.Error);
    }
}
