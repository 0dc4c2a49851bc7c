using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>Whole fits through <see cref="FitRunner"/>: the real actors, workers, noise model, store and checkpoints on a
/// small simulated month (two band windows), a few seconds each.</summary>
public sealed class FitRunTests(SharedFitData data) : IClassFixture<SharedFitData>
{
    [Fact]
    public void The_same_seed_gives_the_same_catalogue_bytes_with_one_and_with_two_threads()
    {
        using var folder = new TemporaryRunFolder();
        var one = Fit(folder, "one", iterations: 6, threads: 1);
        var two = Fit(folder, "two", iterations: 6, threads: 2);
        Assert.Equal(FitOutcomeKind.Completed, one.Kind);
        Assert.Equal(FitOutcomeKind.Completed, two.Kind);
        Assert.Equal(File.ReadAllBytes(folder.File("one", "catalogue.csv")), File.ReadAllBytes(folder.File("two", "catalogue.csv")));
        Assert.Equal(File.ReadAllBytes(folder.File("one", "catalogue.h5")), File.ReadAllBytes(folder.File("two", "catalogue.h5")));
    }

    [Fact]
    public void A_run_stopped_and_resumed_ends_with_the_same_catalogue_bytes_as_one_run_straight_through()
    {
        using var folder = new TemporaryRunFolder();
        Fit(folder, "straight", iterations: 6, threads: 2);

        string config = WriteConfig(folder, "stopped", iterations: 6, threads: 2);
        using var stop = new CancellationTokenSource();
        var progress = new StopAfter(3, stop);
        var first = FitRunner.Start(config, new FitRunOptions(progress, null, stop.Token));
        Assert.Equal(FitOutcomeKind.Interrupted, first.Kind);
        Assert.InRange(first.CheckpointIteration, 3, 5);
        Assert.Equal(first.IterationsCompleted, first.CheckpointIteration);

        var resumed = FitRunner.Resume(folder.File("stopped"), new FitRunOptions(new CollectingProgress(), null, CancellationToken.None));
        Assert.Equal(FitOutcomeKind.Completed, resumed.Kind);
        Assert.Equal(File.ReadAllBytes(folder.File("straight", "catalogue.csv")), File.ReadAllBytes(folder.File("stopped", "catalogue.csv")));
        Assert.Equal(File.ReadAllBytes(folder.File("straight", "catalogue.h5")), File.ReadAllBytes(folder.File("stopped", "catalogue.h5")));
    }

    [Fact]
    public void A_corrupted_latest_checkpoint_is_reported_and_the_previous_one_continues_the_run_exactly()
    {
        using var folder = new TemporaryRunFolder();
        Fit(folder, "straight", iterations: 5, threads: 2);
        string config = WriteConfig(folder, "damaged", iterations: 5, threads: 2);
        using var stop = new CancellationTokenSource();
        FitRunner.Start(config, new FitRunOptions(new StopAfter(3, stop), null, stop.Token));
        string latest = CheckpointFile.LatestPath(folder.File("damaged"));
        var bytes = File.ReadAllBytes(latest);
        bytes[^10] ^= 0x5A;
        File.WriteAllBytes(latest, bytes);

        var progress = new CollectingProgress();
        var resumed = FitRunner.Resume(folder.File("damaged"), new FitRunOptions(progress, null, CancellationToken.None));
        Assert.Equal(FitOutcomeKind.Completed, resumed.Kind);
        Assert.Contains(progress.Warnings, w => w.Contains("checksum mismatch", StringComparison.Ordinal) && w.Contains("previous", StringComparison.Ordinal));
        Assert.Equal(File.ReadAllBytes(folder.File("straight", "catalogue.csv")), File.ReadAllBytes(folder.File("damaged", "catalogue.csv")));
    }

    [Fact]
    public void A_short_fit_catalogues_every_loud_binary_and_recovers_the_instrument_levels()
    {
        using var folder = new TemporaryRunFolder();
        var outcome = Fit(folder, "run", iterations: 8, threads: 2);
        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
        var layout = new RunFolderLayout(folder.File("run"));
        var plan = RunPlan.Load(layout.ResolvedConfig);
        var rows = RunCatalogue.Build(plan, layout, _ => { }).Where(r => r.ClassId == "galactic_binaries").ToList();
        double df = plan.Shape.DfHz;
        // Two bins: over a month the f0 posterior of an SNR ≥ 20 binary is a small fraction of a bin wide, and the
        // sky/f0 degeneracy moves f0 by at most the orbital Doppler shift (1e-4 f0 ≈ 0.8 bin here).
        foreach (double f0 in SmallFitRecord.BinaryFrequenciesHz)
            Assert.Contains(rows, e => Math.Abs(e.Median[e.ParameterNames.IndexOf("f0_hz")] - f0) < 2 * df && e.Confidence >= 0.5);
        Assert.All(rows, e => Assert.Contains(SmallFitRecord.BinaryFrequenciesHz, f0 => Math.Abs(e.Median[e.ParameterNames.IndexOf("f0_hz")] - f0) < 2 * df));

        var noise = NoiseSamples.After(layout, plan.Settings.BurnIn);
        // The levels are known to ~0.1 % from ~10⁵ bins, so 3σ (σ from the stored post-burn-in samples, floored at 0.5 %
        // for the few samples a short run keeps) is a tight test; the start was 20 % away.
        NoiseSamples.AssertWithin(noise, "acceleration_asd_ae_m_s2_rthz", SmallFitRecord.InjectedAccelerationAsd);
        NoiseSamples.AssertWithin(noise, "oms_asd_ae_m_rthz", SmallFitRecord.InjectedOmsAsd);
    }

    [Fact]
    public void A_fit_refuses_a_run_folder_that_holds_another_run_and_names_the_key()
    {
        using var folder = new TemporaryRunFolder();
        Fit(folder, "taken", iterations: 1, threads: 1);
        string config = WriteConfig(folder, "taken", iterations: 1, threads: 1, name: "again.toml");
        var error = Assert.Throws<InvalidInputException>(() => FitRunner.Start(config, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None)));
        Assert.Contains("run_folder", error.Message, StringComparison.Ordinal);
        Assert.Contains("resume", error.Message, StringComparison.Ordinal);
    }

    private FitOutcome Fit(TemporaryRunFolder folder, string run, int iterations, int threads) =>
        FitRunFixture.Fit(WriteConfig(folder, run, iterations, threads)).Outcome;

    private string WriteConfig(TemporaryRunFolder folder, string run, int iterations, int threads, string? name = null)
    {
        string path = folder.File(name ?? run + ".toml");
        File.WriteAllText(path, SmallFitRecord.FitConfig(data.DataPath, folder.File(run), iterations, threads));
        return path;
    }

    /// <summary>Cancels the run once it reports iteration <paramref name="iteration"/>, as Ctrl-C would.</summary>
    private sealed class StopAfter(long iteration, CancellationTokenSource stop) : IFitProgress
    {
        public void IterationCompleted(IterationReport report)
        {
            if (report.Iteration >= iteration) stop.Cancel();
        }

        public void Warning(string message) { }
    }
}
