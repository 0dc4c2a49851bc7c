using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

public class ObservationFileWriteSafetyTests
{
    [Fact]
    public void Existing_file_is_refused_without_overwrite_and_left_byte_identical()
    {
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        ObservationFile.Write(ObservationSamples.Observation(count: 32), path, overwrite: false);
        var before = File.ReadAllBytes(path);

        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Write(ObservationSamples.Observation(count: 64), path, overwrite: false));

        Assert.Equal(path, error.InputSource);
        Assert.Contains("already exists", error.Problem);
        Assert.Equal(before, File.ReadAllBytes(path));
        Assert.Equal(["obs.h5"], folder.Entries());
    }

    [Fact]
    public void Existing_file_is_replaced_with_overwrite()
    {
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        ObservationFile.Write(ObservationSamples.Observation(count: 32), path, overwrite: false);

        ObservationFile.Write(ObservationSamples.Observation(count: 64), path, overwrite: true);

        Assert.Equal(64, ObservationFile.Read(path).Data.Count);
        Assert.Equal(["obs.h5"], folder.Entries());
    }

    [Fact]
    public void Failed_replace_leaves_no_temporary_file_behind()
    {
        // A folder in the way of the destination: the content is written to the temporary file, then the
        // rename over the folder fails, so this exercises clean-up after a complete write.
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        Directory.CreateDirectory(path);

        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Write(ObservationSamples.Observation(), path, overwrite: true));

        Assert.Equal(path, error.InputSource);
        Assert.Contains("cannot be written", error.Problem);
        Assert.Equal(["obs.h5"], folder.Entries());
        Assert.True(Directory.Exists(path));
    }

    [Fact]
    public void Folder_in_the_way_is_refused_without_overwrite()
    {
        using var folder = new TempFolder();
        string path = folder.File("obs.h5");
        Directory.CreateDirectory(path);

        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Write(ObservationSamples.Observation(), path, overwrite: false));

        Assert.Contains("already exists", error.Problem);
        Assert.Equal(["obs.h5"], folder.Entries());
    }

    [Fact]
    public void Destination_in_a_missing_folder_is_reported_with_the_path()
    {
        using var folder = new TempFolder();
        string path = Path.Combine(folder.Path, "no-such-folder", "obs.h5");

        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Write(ObservationSamples.Observation(), path, overwrite: false));

        Assert.Equal(path, error.InputSource);
        Assert.StartsWith(path + ": ", error.Message);
        Assert.Contains("does not exist", error.Problem);
        Assert.Empty(folder.Entries());
    }

    [Fact]
    public void Destination_the_file_system_refuses_is_reported_with_the_path()
    {
        // Tests run as root on CI images, so permission bits cannot make a folder unwritable; /proc refuses new
        // files to everyone. Elsewhere this behaviour is covered by the missing-folder case above.
        if (!OperatingSystem.IsLinux() || !Directory.Exists("/proc/self")) return;
        const string path = "/proc/globalfit-observation-test.h5";

        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Write(ObservationSamples.Observation(), path, overwrite: false));

        Assert.Equal(path, error.InputSource);
        Assert.Contains("cannot be written", error.Problem);
        Assert.False(File.Exists(path));
    }

    [Fact]
    public void Successful_write_leaves_only_the_destination()
    {
        using var folder = new TempFolder();
        ObservationFile.Write(ObservationSamples.Observation(), folder.File("a.h5"), overwrite: false);
        ObservationFile.Write(ObservationSamples.Observation(), folder.File("b.h5"), overwrite: false);
        Assert.Equal(["a.h5", "b.h5"], folder.Entries());
    }
}
