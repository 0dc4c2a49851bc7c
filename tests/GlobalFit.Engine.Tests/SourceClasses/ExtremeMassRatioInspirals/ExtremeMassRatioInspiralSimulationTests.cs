using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

public class ExtremeMassRatioInspiralSimulationTests(ITestOutputHelper output)
{
    // A short record keeps each simulation well under a second.
    private const string Observation = """
        seed = 23
        [observation]
        duration_days = 10
        cadence_s = 20
        """;

    // Invented source: ν0 = 1e-3 Hz lies below the plunge frequency of a 1e6 Msun hole (~2e-3 Hz for a circular orbit)
    // and about 3 years before the plunge (Newtonian circular estimate, Peters 1964), so it chirps slowly over 10 days.
    private const string OneInspiral = """
        [[extreme_mass_ratio_inspirals.inspiral]]
        id = "near"
        central_mass_msun = 1e6
        compact_mass_msun = 10
        central_spin = 0.5
        orbital_frequency0_hz = 1e-3
        eccentricity0 = 0.2
        orbit_inclination_rad = 0.9
        beta_rad = 0.3
        lambda_rad = 1.2
        spin_theta_rad = 1.0
        spin_phi_rad = 2.5
        distance_mpc = 200
        phi0_rad = 0.4
        gamma0_rad = 1.1
        alpha0_rad = 2.0
        """;

    private static SimulationScenario Parse(string text) => SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(text, "scenario.toml"));

    private static Physics.DataFiles.Observation Simulate(string text) =>
        ObservationSimulator.Simulate(Parse(text), "test", new Dictionary<string, string>(), null);

    [Fact]
    public void A_listed_inspiral_is_recorded_with_its_parameters_and_an_snr_equal_to_the_injected_spectra_norm()
    {
        var withSource = Simulate(Observation + "\n" + OneInspiral);
        var without = Simulate(Observation);
        var truth = Assert.Single(withSource.Truth);
        Assert.Equal("extreme_mass_ratio_inspirals", truth.ClassId);
        Assert.Equal(["near"], truth.Ids);
        double[] given = [1e6, 10, 0.5, 1e-3, 0.2, 0.9, 0.3, 1.2, 1.0, 2.5, 200, 0.4, 1.1, 2.0];
        for (int c = 0; c < given.Length; c++) Assert.Equal(given[c], truth[0, c]);

        // Same seed, same noise: the difference of the two records is the injected signal alone. Its SNR² is
        // Σ_k 4 Δf |h̃_k|²/S(f_k) over A and E (bins above DC), computed here from the time series with the scenario's PSDs.
        int n = withSource.Data.Count;
        double dt = withSource.Data.DtSeconds, df = 1.0 / (n * dt);
        var noise = Parse(Observation).Noise.Model();
        double snr2 = 0;
        foreach (var (channel, with, bare) in new[]
                 {
                     (AetChannel.A, withSource.Data.A.Samples, without.Data.A.Samples),
                     (AetChannel.E, withSource.Data.E.Samples, without.Data.E.Samples),
                 })
        {
            var difference = new double[n];
            for (int i = 0; i < n; i++) difference[i] = with[i] - bare[i];
            var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
            FourierTransform.Forward(difference, dt, spectrum);
            for (int k = 1; k < spectrum.Length; k++)
                snr2 += 4 * df * spectrum[k].Magnitude * spectrum[k].Magnitude / noise.Psd(channel, k * df);
        }
        double snr = truth[0, "snr"];
        output.WriteLine($"truth SNR {snr:R}, independent {Math.Sqrt(snr2):R}, relative difference {Math.Abs(snr / Math.Sqrt(snr2) - 1):E2}");
        // Tolerance: only round-off of the subtraction and the FFTs separates the two (measured 2e-16 relative);
        // 1e-9 leaves a wide margin while still catching a wrong PSD, bin spacing or factor in the truth SNR.
        Assert.Equal(Math.Sqrt(snr2), snr, 1e-9 * snr);
        Assert.True(snr > 1, $"a 10 Msun inspiral at 200 Mpc should be visible in 10 days (measured SNR 20), got SNR {snr}");
        // The long-wavelength response has no T channel: T is untouched.
        Assert.Equal(without.Data.T.Samples.ToArray(), withSource.Data.T.Samples.ToArray());
    }

    [Theory]
    [InlineData("1e308")]
    [InlineData("1e30")]
    [InlineData("0")]
    public void A_plunge_time_no_orbit_reaches_is_refused_naming_the_key(string value)
    {
        string text = Observation + "\n" + OneInspiral.Replace("orbital_frequency0_hz = 1e-3", "plunge_time_s = " + value, StringComparison.Ordinal);
        var e = Assert.Throws<InvalidInputException>(() => Parse(text));
        Assert.Contains("plunge_time_s", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_latest_accepted_plunge_time_still_reads()
    {
        string text = Observation + "\n" + OneInspiral.Replace("orbital_frequency0_hz = 1e-3", "plunge_time_s = 1e10", StringComparison.Ordinal);
        Assert.Single(Parse(text).Sources);
    }

    [Fact]
    public void An_inspiral_given_by_its_plunge_time_is_recorded_with_the_orbital_frequency_that_plunges_then()
    {
        string text = Observation + "\n" + OneInspiral.Replace("orbital_frequency0_hz = 1e-3", "plunge_time_s = 5e5", StringComparison.Ordinal);
        var truth = Simulate(text).Truth[0];
        double nu0 = truth[0, "orbital_frequency0_hz"];
        var equations = ExtremeMassRatioInspiralPopulation.Equations(1e6, 10, 0.5, 0.9);
        double again = new Physics.ExtremeMassRatioInspirals.InspiralTrajectory().FrequencyForPlungeTime(equations, [0, 0, 0, 0.2, 0], 5e5);
        Assert.Equal(again, nu0, 1e-12 * again);
        Assert.InRange(nu0, 1e-4, equations.PlungeFrequency(0.2));
        Assert.Contains("plunge_time_s = 500000", Parse(text).ToToml(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_population_is_drawn_reproducibly_within_its_ranges()
    {
        const string text = Observation + "\n" + """
            [extreme_mass_ratio_inspirals.population]
            count = 4
            central_mass_min_msun = 3e5
            central_mass_max_msun = 3e6
            compact_mass_min_msun = 8
            compact_mass_max_msun = 20
            spin_min = 0.2
            spin_max = 0.7
            eccentricity_min = 0.1
            eccentricity_max = 0.3
            plunge_time_min_s = 4e5
            plunge_time_max_s = 3e7
            distance_min_mpc = 1000
            distance_max_mpc = 2000
            """;
        var first = Simulate(text).Truth[0];
        var second = Simulate(text).Truth[0];
        Assert.Equal(4, first.RowCount);
        Assert.Equal(["emri-p0001", "emri-p0002", "emri-p0003", "emri-p0004"], first.Ids);
        Assert.Equal(first.Values.ToArray(), second.Values.ToArray());
        for (int row = 0; row < first.RowCount; row++)
        {
            Assert.InRange(first[row, "central_mass_msun"], 3e5, 3e6);
            Assert.InRange(first[row, "compact_mass_msun"], 8, 20);
            Assert.InRange(first[row, "central_spin"], 0.2, 0.7);
            Assert.InRange(first[row, "eccentricity0"], 0.1, 0.3);
            Assert.InRange(first[row, "distance_mpc"], 1000, 2000);
            Assert.InRange(first[row, "orbit_inclination_rad"], 0, Math.PI);
            Assert.InRange(first[row, "beta_rad"], -Math.PI / 2, Math.PI / 2);
            Assert.InRange(first[row, "spin_theta_rad"], 0, Math.PI);
            var equations = ExtremeMassRatioInspiralPopulation.Equations(first[row, "central_mass_msun"], first[row, "compact_mass_msun"],
                first[row, "central_spin"], first[row, "orbit_inclination_rad"]);
            Assert.InRange(first[row, "orbital_frequency0_hz"], 0, equations.PlungeFrequency(first[row, "eccentricity0"]));
            Assert.True(double.IsFinite(first[row, "snr"]) && first[row, "snr"] >= 0);
        }
        var otherSeed = Simulate(text.Replace("seed = 23", "seed = 24", StringComparison.Ordinal)).Truth[0];
        Assert.NotEqual(first[0, "central_mass_msun"], otherSeed[0, "central_mass_msun"]);
    }

    [Theory]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 1e-4\n", "each inspiral needs 'central_mass_msun'")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 1e6\ncompact_mass_msun = 10\ndistance_mpc = 1\n", "exactly one of 'orbital_frequency0_hz' and 'plunge_time_s'")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 1e6\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 1e-4\nplunge_time_s = 1e6\n", "exactly one of")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 1e6\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 1e-4\neccentricity0 = 1.2\n", "key 'extreme_mass_ratio_inspirals.inspiral.eccentricity0'")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 1e6\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 0.1\n", "plunge frequency")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 10\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 1e-4\n", "must be smaller than central_mass_msun")]
    [InlineData("[[extreme_mass_ratio_inspirals.inspiral]]\ncentral_mass_msun = 1e6\ncompact_mass_msun = 10\ndistance_mpc = 1\norbital_frequency0_hz = 1e-4\nspin = 0.5\n", "unknown key 'extreme_mass_ratio_inspirals.inspiral.spin'")]
    [InlineData("[extreme_mass_ratio_inspirals.population]\ndistance_min_mpc = 2000\ndistance_max_mpc = 1000\n", "must be at least distance_min_mpc")]
    [InlineData("[extreme_mass_ratio_inspirals.population]\ncompact_mass_max_msun = 2e5\n", "must stay below central_mass_min_msun")]
    [InlineData("[extreme_mass_ratio_inspirals.population]\nspin_max = 1.5\n", "key 'extreme_mass_ratio_inspirals.population.spin_max'")]
    [InlineData("[extreme_mass_ratio_inspirals.population]\ncounts = 3\n", "did you mean 'count'?")]
    [InlineData("[extreme_mass_ratio_inspirals]\ninspirals = 3\n", "did you mean 'inspiral'?")]
    public void Invalid_sections_are_refused_naming_the_key(string section, string problem)
    {
        var e = Assert.Throws<InvalidInputException>(() => Parse(Observation + "\n" + section));
        Assert.StartsWith("scenario.toml:", e.Message, StringComparison.Ordinal);
        Assert.Contains(problem, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Resolved_section_writes_every_default_and_reads_back_to_the_same_scenario()
    {
        var scenario = Parse(Observation + "\n" + OneInspiral + "\n[extreme_mass_ratio_inspirals.population]\ncount = 2\n");
        string resolved = scenario.ToToml();
        foreach (string key in ExtremeMassRatioInspiralPopulationSettings.Keys) Assert.Contains(key + " = ", resolved, StringComparison.Ordinal);
        Assert.Equal(resolved, Parse(resolved).ToToml());
    }

    [Fact]
    public void A_run_configuration_section_without_start_rows_is_refused_naming_the_start_table()
    {
        var root = ConfigDocument.Parse("data = \"d.h5\"\n[extreme_mass_ratio_inspirals]\n", "fit.toml");
        var e = Assert.Throws<InvalidInputException>(() =>
            RunPlan.FromConfig(root, Path.GetTempPath(), new FitDataShape("d.h5", 4096, 10, 0)));
        Assert.Contains("[[extreme_mass_ratio_inspirals.start]]", e.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("not built yet", e.Message, StringComparison.Ordinal);
    }
}
