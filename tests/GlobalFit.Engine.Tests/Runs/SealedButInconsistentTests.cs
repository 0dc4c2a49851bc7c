using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>Files whose checksums are right but whose contents do not hold together (written by a damaged program or
/// sealed by hand) are refused as bad input naming the file, never read into a crash.</summary>
public sealed class SealedButInconsistentTests(SharedFitData data) : IClassFixture<SharedFitData>
{
    [Fact]
    public void A_resume_from_a_checkpoint_missing_a_worker_is_refused_naming_the_checkpoint()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        StopAfterTwo(folder, run);
        var checkpoint = CheckpointFile.Read(run, _ => { });
        CheckpointFile.Write(run, checkpoint with { Workers = checkpoint.Workers.RemoveAt(0) }); // sealed with a true checksum

        var error = Assert.Throws<InvalidInputException>(() => { FitRunner.Resume(run, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)); });
        Assert.Contains(CheckpointFile.LatestPath(run), error.Message, StringComparison.Ordinal);
        Assert.Contains("do not match the run's", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_sample_record_with_a_true_checksum_but_values_that_do_not_fit_its_sources_is_refused()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        Directory.CreateDirectory(run);
        var store = new SampleStore(run);
        store.Append([new SampleBlock("noise", "noise", 1, ["level"], [1, 1], [0.5, 0.6], [-1, -2])]);
        // Replace the record by one whose three values cannot belong to two samples of one source of one parameter.
        string file = Path.Combine(store.SamplesFolder, WorkerFileName.FromWorkerId("noise"));
        byte[] record = SampleRecordFormat.Encode(new SampleBlock("noise", "noise", 1, ["level"], [1, 1], [0.5, 0.6, 0.7], [-1, -2]));
        File.WriteAllBytes(file, record);
        File.WriteAllText(Path.Combine(store.SamplesFolder, CommitManifest.FileName),
            $"globalfit chain commit 1\niteration 1\n{WorkerFileName.FromWorkerId("noise")} {record.Length}\n");

        var error = Assert.Throws<InvalidInputException>(() => store.ReadAll().ToList());
        Assert.Contains(file, error.Message, StringComparison.Ordinal);
        Assert.Contains("the record is inconsistent", error.Message, StringComparison.Ordinal);
    }

    private void StopAfterTwo(TemporaryRunFolder folder, string run)
    {
        string config = folder.File("noise.toml");
        File.WriteAllText(config, $"data = \"{data.DataPath}\"\nrun_folder = \"{run}\"\niterations = 4\ncheckpoint_every_iterations = 1\n[noise]\nsteps_per_update = 5\n");
        using var stop = new CancellationTokenSource();
        FitRunner.Start(config, new FitRunOptions(new StopAt(2, stop), null, stop.Token));
    }
}
