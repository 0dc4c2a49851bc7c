using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.Tests.Catalogue;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>A fit that never hangs, never leaves a half-made run and never loses samples quietly: failed writes stop it
/// cleanly (made real by putting a folder where a file must go), an empty schedule stage is passed through, bad data is
/// found before the run folder is touched, and a resume refuses lost samples and another run's checkpoint.</summary>
public sealed class FitReliabilityTests(SharedFitData data) : IClassFixture<SharedFitData>
{
    [Fact]
    public void A_checkpoint_that_cannot_be_written_stops_the_run_and_keeps_the_previous_checkpoint()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        var progress = new Obstructing(2, () => Directory.CreateDirectory(Path.Combine(CheckpointFile.Folder(run), "latest.tmp")));
        var outcome = FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(progress, null, CancellationToken.None));

        Assert.Equal(FitOutcomeKind.WriteFailed, outcome.Kind);
        Assert.Equal(1, outcome.CheckpointIteration);
        Assert.Contains("latest.tmp", outcome.Message, StringComparison.Ordinal);
        Assert.Contains("is a folder", outcome.Message, StringComparison.Ordinal);
        Assert.Equal(1, CheckpointFile.Read(run, _ => { }).Iteration); // the good checkpoint is intact
        Assert.Contains("\"stopped (error)\"", File.ReadAllText(Path.Combine(run, "status.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void Samples_that_cannot_be_written_stop_the_run_naming_the_file()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        string samples = Path.Combine(run, SampleStore.SamplesFolderName, WorkerFileName.FromWorkerId("noise"));
        var progress = new Obstructing(1, () =>
        {
            File.Delete(samples);
            Directory.CreateDirectory(samples);
        });
        var outcome = FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(progress, null, CancellationToken.None));

        Assert.Equal(FitOutcomeKind.WriteFailed, outcome.Kind);
        Assert.Equal(1, outcome.IterationsCompleted);
        Assert.Contains(samples, outcome.Message, StringComparison.Ordinal);
        Assert.Contains("is a folder", outcome.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_band_of_exactly_one_window_leaves_the_odd_stage_empty_and_the_fit_still_completes()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        string config = folder.File("one-window.toml");
        // The band is 101 bins at Δf = 1/(30 days), exactly one window of 101 bins, so the group of odd windows is empty.
        File.WriteAllText(config, $"""
            data = "{data.DataPath}"
            run_folder = "{run}"
            iterations = 2
            [galactic_binaries]
            f_min_hz = 2.97e-3
            f_max_hz = 3.0086e-3
            window_bins = 101
            margin_bins = 16
            steps_per_update = 20
            temperatures = 2
            fstat_cells_per_bin = 1
            fstat_latitude_cells = 2
            fstat_longitude_cells = 4
            [noise]
            steps_per_update = 5
            """);
        var plan = RunPlan.Load(config);
        Assert.Contains(plan.Classes.SelectMany(c => c.Groups), g => g.Workers.IsEmpty);
        var outcome = FitRunner.Start(config, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None));
        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
    }

    [Fact]
    public void A_fit_refused_for_bad_data_leaves_no_run_behind_and_a_retry_with_good_data_starts()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        string bad = folder.File("bad.h5");
        // Sixteen 0xFF bytes in the middle of the file (the channel data fill nearly all of it) hold at least one whole
        // sample, which reads as NaN: the file's structure and summary are intact, only the full read finds the damage.
        var bytes = File.ReadAllBytes(data.DataPath);
        bytes.AsSpan(bytes.Length / 2, 16).Fill(0xFF);
        File.WriteAllBytes(bad, bytes);
        string config = folder.File("fit.toml");
        File.WriteAllText(config, $"data = \"{bad}\"\nrun_folder = \"{run}\"\niterations = 1\n[noise]\nsteps_per_update = 5\n");
        _ = RunPlan.Load(config); // the configuration and the file's summary pass: only the full read finds the damage
        Assert.Throws<Physics.Files.InvalidInputException>(() => { FitRunner.Start(config, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)); });
        Assert.False(File.Exists(Path.Combine(run, "run.toml")));

        File.WriteAllText(config, $"data = \"{data.DataPath}\"\nrun_folder = \"{run}\"\niterations = 1\n[noise]\nsteps_per_update = 5\n");
        Assert.Equal(FitOutcomeKind.Completed, FitRunner.Start(config, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)).Kind);
    }

    [Fact]
    public void A_folder_whose_fit_never_completed_an_iteration_counts_as_empty()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        Directory.CreateDirectory(run);
        File.WriteAllText(Path.Combine(run, "run.toml"), "# left by a fit that stopped before its first iteration\n");
        File.WriteAllText(Path.Combine(run, "status.json"), "{}");
        Assert.Equal(FitOutcomeKind.Completed, FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)).Kind);
    }

    [Fact]
    public void A_run_folder_that_is_a_file_is_refused_naming_the_key()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        File.WriteAllText(run, "");
        var error = Assert.Throws<Physics.Files.InvalidInputException>(() => { FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)); });
        Assert.Contains("run_folder", error.Message, StringComparison.Ordinal);
        Assert.Contains("is a file", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_resume_whose_samples_stop_short_of_the_checkpoint_is_refused_instead_of_losing_them()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run");
        using var stop = new CancellationTokenSource();
        FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(new StopAt(2, stop), null, stop.Token));
        Assert.Equal(2, CheckpointFile.Read(run, _ => { }).Iteration);
        new SampleStore(run).TruncateAfter(1); // the samples of iteration 2 are gone, its checkpoint is not
        var error = Assert.Throws<Physics.Files.InvalidInputException>(() => { FitRunner.Resume(run, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)); });
        Assert.Contains("iterations 2…2 are lost", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_latest_checkpoint_of_another_run_is_reported_and_the_previous_one_is_used()
    {
        using var folder = new TemporaryRunFolder();
        string run = folder.File("run"), other = folder.File("other");
        using (var stop = new CancellationTokenSource())
            FitRunner.Start(NoiseOnlyConfig(folder, run), new FitRunOptions(new StopAt(2, stop), null, stop.Token));
        File.WriteAllText(folder.File("other.toml"), $"data = \"{data.DataPath}\"\nrun_folder = \"{other}\"\niterations = 2\nseed = 17\ncheckpoint_every_iterations = 1\n[noise]\nsteps_per_update = 5\n");
        FitRunner.Start(folder.File("other.toml"), new FitRunOptions(new CollectingProgress(), null, CancellationToken.None));
        File.Copy(CheckpointFile.LatestPath(other), CheckpointFile.LatestPath(run), overwrite: true);

        var progress = new CollectingProgress();
        var outcome = FitRunner.Resume(run, new FitRunOptions(progress, null, CancellationToken.None));
        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
        Assert.Contains(progress.Warnings, w => w.Contains("belongs to another run", StringComparison.Ordinal));
    }

    private string NoiseOnlyConfig(TemporaryRunFolder folder, string run)
    {
        string config = folder.File("noise.toml");
        File.WriteAllText(config, $"""
            data = "{data.DataPath}"
            run_folder = "{run}"
            iterations = 4
            checkpoint_every_iterations = 1
            [noise]
            steps_per_update = 5
            """);
        return config;
    }

    // Puts an obstacle in place when an iteration is reported, before the checkpoint of that iteration is written.
    private sealed class Obstructing(long atIteration, Action obstruct) : IFitProgress
    {
        public void IterationCompleted(IterationReport report)
        {
            if (report.Iteration == atIteration) obstruct();
        }

        public void Warning(string message) { }
    }
}
