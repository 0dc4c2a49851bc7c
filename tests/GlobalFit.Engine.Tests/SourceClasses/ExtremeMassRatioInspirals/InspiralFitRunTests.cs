using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Engine.Tests.Runs;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Inspiral fits through the real runner (actors, residual book, store, checkpoints) on ten simulated days
/// holding one inspiral.</summary>
public sealed class InspiralFitRunTests : IDisposable
{
    // The fixture's source at 120 Mpc: SNR ≈ 47 over ten days of the default noise.
    private const string Scenario = """
        name = "one inspiral"
        seed = 31
        [observation]
        duration_days = 10
        cadence_s = 20
        [[extreme_mass_ratio_inspirals.inspiral]]
        id = "one"
        central_mass_msun = 5e5
        compact_mass_msun = 10
        central_spin = 0.6
        orbital_frequency0_hz = 1.2e-3
        eccentricity0 = 0.15
        orbit_inclination_rad = 0.8
        beta_rad = 0.4
        lambda_rad = 2.0
        spin_theta_rad = 1.2
        spin_phi_rad = 0.7
        distance_mpc = 120
        phi0_rad = 1.0
        gamma0_rad = 0.5
        alpha0_rad = 2.5
        """;

    private readonly TemporaryRunFolder _folder = new();
    private readonly string _data;

    public InspiralFitRunTests()
    {
        _data = _folder.File("one.h5");
        FitRunFixture.Simulate(Scenario, _data);
    }

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void One_and_two_threads_and_a_stopped_and_resumed_run_give_the_same_catalogue_bytes()
    {
        Assert.Equal(FitOutcomeKind.Completed, FitRunFixture.Fit(Config("one", threads: 1)).Outcome.Kind);
        Assert.Equal(FitOutcomeKind.Completed, FitRunFixture.Fit(Config("two", threads: 2)).Outcome.Kind);
        Assert.Equal(File.ReadAllBytes(_folder.File("one", "catalogue.csv")), File.ReadAllBytes(_folder.File("two", "catalogue.csv")));
        Assert.Equal(File.ReadAllBytes(_folder.File("one", "catalogue.h5")), File.ReadAllBytes(_folder.File("two", "catalogue.h5")));

        using var stop = new CancellationTokenSource();
        var first = FitRunner.Start(Config("stopped", threads: 2), new FitRunOptions(new StopAfter(2, stop), null, stop.Token));
        Assert.Equal(FitOutcomeKind.Interrupted, first.Kind);
        var resumed = FitRunner.Resume(_folder.File("stopped"), new FitRunOptions(new CollectingProgress(), null, CancellationToken.None));
        Assert.Equal(FitOutcomeKind.Completed, resumed.Kind);
        Assert.Equal(File.ReadAllBytes(_folder.File("two", "catalogue.csv")), File.ReadAllBytes(_folder.File("stopped", "catalogue.csv")));
        Assert.Equal(File.ReadAllBytes(_folder.File("two", "catalogue.h5")), File.ReadAllBytes(_folder.File("stopped", "catalogue.h5")));

        string csv = File.ReadAllText(_folder.File("one", "catalogue.csv"));
        Assert.Contains("emri-0001", csv, StringComparison.Ordinal);
        Assert.Contains("extreme_mass_ratio_inspirals", csv, StringComparison.Ordinal);
    }

    [Fact]
    public void A_blind_worker_that_finds_nothing_leaves_no_catalogue_row_and_the_run_completes()
    {
        // The threshold is set out of reach, so the blind worker (over a box around the source, whose window overlaps the
        // start row's) stays empty whatever its tiny search finds: zero templates and sample blocks without samples go
        // through the runner, the store, the checkpoints and the catalogue.
        const string Blind = """
            count = 2
            search_draws = 10
            search_chains = 1
            search_chain_steps = 3
            search_updates = 1
            detection_significance = 1e6
            search_central_mass_min_msun = 4e5
            search_central_mass_max_msun = 6e5
            search_orbital_frequency_min_hz = 1.15e-3
            search_orbital_frequency_max_hz = 1.25e-3
            search_eccentricity_max = 0.2
            """;
        Assert.Equal(FitOutcomeKind.Completed, FitRunFixture.Fit(Config("blind", threads: 2, Blind)).Outcome.Kind);
        string csv = File.ReadAllText(_folder.File("blind", "catalogue.csv"));
        Assert.Contains("emri-0001", csv, StringComparison.Ordinal);
        Assert.DoesNotContain("emri-0002", csv, StringComparison.Ordinal);
    }

    private string Config(string run, int threads, string extraKeys = "")
    {
        string path = _folder.File(run + ".toml");
        File.WriteAllText(path, $"""
            data = "{_data}"
            run_folder = "{_folder.File(run)}"
            seed = 12
            iterations = 4
            burn_in = 1
            checkpoint_every_iterations = 1
            threads = {threads}
            [extreme_mass_ratio_inspirals]
            steps_per_update = 15
            temperatures = 2
            search_evaluations = 30
            {extraKeys}
            [[extreme_mass_ratio_inspirals.start]]
            id = "one"
            central_mass_msun = 5e5
            compact_mass_msun = 10
            central_spin = 0.6
            orbital_frequency0_hz = 1.2e-3
            eccentricity0 = 0.15
            orbit_inclination_rad = 0.8
            beta_rad = 0.4
            lambda_rad = 2.0
            spin_theta_rad = 1.2
            spin_phi_rad = 0.7
            distance_mpc = 120
            phi0_rad = 1.0
            gamma0_rad = 0.5
            alpha0_rad = 2.5
            [noise]
            steps_per_update = 10
            """);
        return path;
    }

    // Cancels the run once it reports the given iteration, as Ctrl-C would.
    private sealed class StopAfter(long iteration, CancellationTokenSource stop) : IFitProgress
    {
        public void IterationCompleted(IterationReport report)
        {
            if (report.Iteration >= iteration) stop.Cancel();
        }

        public void Warning(string message) { }
    }
}
