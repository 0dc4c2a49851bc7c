using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class DemoCommandTests
{
    [Fact]
    public void Demo_runs_twice_in_its_own_folder_and_refuses_a_foreign_one()
    {
        using var folder = new TempFolder();
        string demo = folder.File("demo");
        var first = CliRun.Run("demo", "--out", demo);
        Assert.Equal(0, first.ExitCode);
        Assert.Contains("mean estimate/model", first.Out);
        Assert.True(File.Exists(Path.Combine(demo, "data.h5")));
        Assert.True(File.Exists(Path.Combine(demo, "noise.png")));
        Assert.Equal(0, CliRun.Run("demo", "--out", demo).ExitCode);

        string foreign = folder.File("mine");
        Directory.CreateDirectory(foreign);
        File.WriteAllText(Path.Combine(foreign, "thesis.tex"), "do not touch");
        var refused = CliRun.Run("demo", "--out", foreign);
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains("was not made by the demo", refused.Error);
        Assert.Single(Directory.GetFiles(foreign));
    }
}
