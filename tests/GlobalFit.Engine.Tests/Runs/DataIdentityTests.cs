using System.Security.Cryptography;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>A run knows the data file it was fitted to (size and SHA-256 in <c>data.identity</c>); a resume with another
/// file is refused before anything changes, unless the user accepts the new file explicitly.</summary>
public sealed class DataIdentityTests(SharedFitData data) : IClassFixture<SharedFitData>
{
    [Fact]
    public void A_fit_records_its_data_file_as_the_layout_documents()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        FitRunner.Start(Config(folder, data.DataPath, run, iterations: 1), Options(new CollectingProgress()));

        // Read back by the documented layout (three lines), against a digest computed here through another API.
        string[] lines = File.ReadAllLines(Path.Combine(run, "data.identity"));
        Assert.Equal("globalfit data identity 1", lines[0]);
        Assert.Equal($"size_bytes {new FileInfo(data.DataPath).Length}", lines[1]);
        using var sha = SHA256.Create();
        Assert.Equal("sha256 " + Convert.ToHexStringLower(sha.ComputeHash(File.ReadAllBytes(data.DataPath))), lines[2]);
        Assert.Equal(3, lines.Length);
    }

    [Fact]
    public void A_resume_with_a_changed_data_file_is_refused_and_leaves_the_run_as_it_was()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run"), copy = CopyOfData(folder);
        StopAfterTwo(folder, copy, run);
        ChangeOneSample(copy);
        var before = Snapshot(run);

        var error = Assert.Throws<InvalidInputException>(() => { FitRunner.Resume(run, Options(new CollectingProgress())); });
        Assert.Contains(copy, error.Message, StringComparison.Ordinal);
        Assert.Contains("is not the file this run was fitted to", error.Message, StringComparison.Ordinal);
        Assert.Contains("--accept-new-data", error.Message, StringComparison.Ordinal);
        Assert.Equal(before, Snapshot(run)); // nothing in the folder changed: checkpoints, samples, identity, status
    }

    [Fact]
    public void A_resume_that_accepts_the_new_data_warns_finishes_and_records_the_new_file()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run"), copy = CopyOfData(folder);
        StopAfterTwo(folder, copy, run);
        ChangeOneSample(copy);

        var progress = new CollectingProgress();
        var outcome = FitRunner.Resume(run, Options(progress) with { AcceptNewData = true });
        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
        Assert.Contains(progress.Warnings, w => w.Contains("--accept-new-data", StringComparison.Ordinal));
        Assert.Equal(DataIdentity.Of(copy), DataIdentity.Read(new RunFolderLayout(run)));
    }

    [Fact]
    public void A_run_from_before_identities_were_recorded_resumes_with_a_warning_and_records_one()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        StopAfterTwo(folder, data.DataPath, run);
        File.Delete(Path.Combine(run, "data.identity"));

        var progress = new CollectingProgress();
        Assert.Equal(FitOutcomeKind.Completed, FitRunner.Resume(run, Options(progress)).Kind);
        Assert.Contains(progress.Warnings, w => w.Contains("no record of its data file", StringComparison.Ordinal));
        Assert.Equal(DataIdentity.Of(data.DataPath), DataIdentity.Read(new RunFolderLayout(run)));
    }

    [Theory]
    [InlineData("globalfit data identity 2\nsize_bytes 1\nsha256 00\n", "line 1")]
    [InlineData("globalfit data identity 1\nsize_bytes -1\nsha256 00\n", "line 2")]
    [InlineData("globalfit data identity 1\nsize_bytes 10\nsha256 ABC\n", "line 3")]
    [InlineData("globalfit data identity 1\n", "line 1")]
    public void A_malformed_identity_record_is_refused_naming_its_line(string text, string line)
    {
        using var folder = new TemporaryRunFolder();
        var layout = new RunFolderLayout(folder.File("run"));
        Directory.CreateDirectory(layout.Root);
        File.WriteAllText(layout.DataIdentityFile, text);
        var error = Assert.Throws<InvalidInputException>(() => DataIdentity.Read(layout));
        Assert.Contains(line, error.Message, StringComparison.Ordinal);
        Assert.Contains(layout.DataIdentityFile, error.Message, StringComparison.Ordinal);
    }

    private string CopyOfData(TemporaryRunFolder folder)
    {
        string copy = folder.File("data.h5");
        File.Copy(data.DataPath, copy);
        return copy;
    }

    // One bit of the byte in the middle of the file, which lies in the channel samples (they fill nearly all of it):
    // a lowest mantissa or exponent bit, so the sample stays finite and the file stays a valid observation.
    private static void ChangeOneSample(string path)
    {
        byte[] bytes = File.ReadAllBytes(path);
        bytes[bytes.Length / 2] ^= 1;
        File.WriteAllBytes(path, bytes);
    }

    private static void StopAfterTwo(TemporaryRunFolder folder, string dataPath, string run)
    {
        using var stop = new CancellationTokenSource();
        FitRunner.Start(Config(folder, dataPath, run, iterations: 4), new FitRunOptions(new StopAt(2, stop), null, stop.Token));
        Assert.Equal(2, CheckpointFile.Read(run, _ => { }).Iteration);
    }

    private static Dictionary<string, string> Snapshot(string run) =>
        Directory.GetFiles(run, "*", SearchOption.AllDirectories).Where(f => !f.EndsWith(".jsonl", StringComparison.Ordinal))
            .ToDictionary(f => Path.GetRelativePath(run, f), f => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(f))));

    private static FitRunOptions Options(IFitProgress progress) => new(progress, null, CancellationToken.None);

    private static string Config(TemporaryRunFolder folder, string dataPath, string run, int iterations)
    {
        string config = folder.File("noise.toml");
        File.WriteAllText(config, $"""
            data = "{dataPath}"
            run_folder = "{run}"
            iterations = {iterations}
            checkpoint_every_iterations = 1
            [noise]
            steps_per_update = 5
            """);
        return config;
    }
}
