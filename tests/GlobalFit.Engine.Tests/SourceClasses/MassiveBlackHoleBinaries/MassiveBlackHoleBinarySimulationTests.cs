using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

public class MassiveBlackHoleBinarySimulationTests(ITestOutputHelper output)
{
    // Ten days at 10 s: 86,400 samples per channel, which simulates in well under a second.
    private const string Observation = """
        seed = 11
        [observation]
        duration_days = 10
        cadence_s = 10
        """;

    // Detector-frame total mass ≈ 2.5e6 M_sun, so the cut-off 0.2/M ≈ 0.016 Hz stays well below the 0.05 Hz Nyquist
    // frequency; it merges on day 6 of the 10.
    private static string Binary(double tcS, string id = "loud") => $"""
        [[massive_black_hole_binaries.binary]]
        id = "{id}"
        chirp_mass_msun = 1e6
        mass_ratio = 2
        spin1 = 0.5
        spin2 = -0.3
        tc_s = {tcS}
        distance_mpc = 20000
        beta_rad = 0.4
        lambda_rad = 2.0
        iota_rad = 0.7
        psi_rad = 0.3
        phi_ref_rad = 1.1
        """;

    private static SimulationScenario Parse(string text) => SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(text, "scenario.toml"));

    private static Physics.DataFiles.Observation Simulate(string text) =>
        ObservationSimulator.Simulate(Parse(text), "test", new Dictionary<string, string>(), null);

    // The same seed gives the same noise, so the difference of the data with and without the binary is exactly the
    // injected signal. SNR² = Σ_c 4 Δf Σ_k |d̃_k|²/S_c(f_k) over bins 1 … N/2 − 1 (the signal is zero at 0 and at Nyquist).
    private static double IndependentSnr(Physics.DataFiles.Observation with, Physics.DataFiles.Observation without, AetNoiseModel noise)
    {
        int n = with.Data.Count;
        double dt = with.Data.DtSeconds, df = 1.0 / (n * dt);
        var difference = new double[n];
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        double total = 0;
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            for (int i = 0; i < n; i++) difference[i] = with.Data.Channels[c].Samples[i] - without.Data.Channels[c].Samples[i];
            FourierTransform.Forward(difference, dt, spectrum);
            for (int k = 1; k < spectrum.Length - 1; k++)
                total += 4 * df * (spectrum[k].Real * spectrum[k].Real + spectrum[k].Imaginary * spectrum[k].Imaginary) / noise.Psd(channels[c], k * df);
        }
        return Math.Sqrt(total);
    }

    [Fact]
    public void A_listed_binary_is_injected_and_its_truth_row_holds_its_parameters_and_optimal_snr()
    {
        var with = Simulate(Observation + "\n" + Binary(6 * 86_400.0));
        var without = Simulate(Observation);
        var truth = Assert.Single(with.Truth);
        Assert.Equal(MassiveBlackHoleBinaryClass.Id, truth.ClassId);
        Assert.Equal(["loud"], truth.Ids);
        double[] given = [1e6, 2, 0.5, -0.3, 6 * 86_400.0, 20000, 0.4, 2.0, 0.7, 0.3, 1.1];
        for (int i = 0; i < given.Length; i++)
            Assert.Equal(given[i], truth[0, Physics.MassiveBlackHoleBinaries.MassiveBlackHoleBinaryParameters.ColumnNames[i]]);
        // Total mass 𝓜 η^(−3/5) with η = 2/9 (q = 2): derived here by hand, 1e6 × (2/9)^(−0.6).
        Assert.Equal(1e6 * Math.Pow(2.0 / 9.0, -0.6), truth[0, "total_mass_msun"], 1e-6);
        // Redshift of 20 Gpc in the flat ΛCDM of Aghanim et al. 2020 (A&A 641, A6), the cosmology the module documents;
        // the inversion itself is tested in Physics. About 2.3 (from memory), so the range catches a wrong cosmology.
        Assert.Equal(Physics.Cosmology.FlatLambdaCdm.Planck2018.Redshift(20000), truth[0, "redshift"]);
        Assert.InRange(truth[0, "redshift"], 2.0, 2.6);

        double snr = truth[0, "snr"];
        double independent = IndependentSnr(with, without, Parse(Observation).Noise.Model());
        // Two FFTs of round-off (~1e-12 relative) separate the two numbers; 1e-8 leaves ample room.
        output.WriteLine($"truth SNR {snr:R}, independent {independent:R}, relative difference {Math.Abs(snr - independent) / snr:E2}");
        Assert.Equal(independent, snr, 1e-8 * snr);
        Assert.True(snr > 100, $"a 1e6 M_sun chirp-mass merger at 20 Gpc inside the record should be loud, got SNR {snr}");
    }

    [Fact]
    public void A_binary_that_merges_before_the_data_start_injects_nothing()
    {
        var with = Simulate(Observation + "\n" + Binary(-86_400.0));
        var without = Simulate(Observation);
        Assert.Equal(0.0, with.Truth[0][0, "snr"]);
        Assert.Equal(without.Data.A.Samples.ToArray(), with.Data.A.Samples.ToArray());
    }

    [Fact]
    public void A_binary_that_merges_after_the_end_injects_its_inspiral_up_to_the_end_only()
    {
        var noise = Parse(Observation).Noise.Model();
        var without = Simulate(Observation);
        var late = Simulate(Observation + "\n" + Binary(12 * 86_400.0));
        var inside = Simulate(Observation + "\n" + Binary(6 * 86_400.0));
        double lateSnr = late.Truth[0][0, "snr"];
        Assert.Equal(IndependentSnr(late, without, noise), lateSnr, 1e-8 * lateSnr);
        output.WriteLine($"SNR merging after the end {lateSnr:R}, inside {inside.Truth[0][0, "snr"]:R}");
        Assert.InRange(lateSnr, 1e-3, 0.5 * inside.Truth[0][0, "snr"]);
    }

    [Fact]
    public void Populations_are_the_same_for_a_seed_differ_between_seeds_and_respect_their_ranges()
    {
        const string population = """
            [massive_black_hole_binaries.population]
            count = 40
            chirp_mass_min_msun = 2e5
            chirp_mass_max_msun = 3e6
            mass_ratio_min = 1.5
            mass_ratio_max = 6
            spin_min = -0.5
            spin_max = 0.8
            redshift_min = 2
            redshift_max = 4
            merger_start_s = 100000
            merger_end_s = 500000
            """;
        var a = Draw("seed = 5\n" + Observation[Observation.IndexOf('[', StringComparison.Ordinal)..] + "\n" + population);
        var b = Draw("seed = 5\n" + Observation[Observation.IndexOf('[', StringComparison.Ordinal)..] + "\n" + population);
        var c = Draw("seed = 6\n" + Observation[Observation.IndexOf('[', StringComparison.Ordinal)..] + "\n" + population);
        Assert.Equal(a.Values.ToArray(), b.Values.ToArray());
        Assert.NotEqual(a.Values.ToArray(), c.Values.ToArray());
        Assert.Equal(40, a.RowCount);
        for (int row = 0; row < a.RowCount; row++)
        {
            Assert.InRange(a[row, "chirp_mass_msun"], 2e5, 3e6);
            Assert.InRange(a[row, "mass_ratio"], 1.5, 6);
            Assert.InRange(a[row, "spin1"], -0.5, 0.8);
            Assert.InRange(a[row, "spin2"], -0.5, 0.8);
            Assert.InRange(a[row, "tc_s"], 100000, 500000);
            // Redshift comes back from the distance through the cosmology's inversion; 1e-6 covers its tolerance.
            Assert.InRange(a[row, "redshift"], 2 - 1e-6, 4 + 1e-6);
            Assert.InRange(a[row, "beta_rad"], -Math.PI / 2, Math.PI / 2);
            Assert.InRange(a[row, "iota_rad"], 0, Math.PI);
            Assert.True(a[row, "snr"] >= 0);
        }
    }

    private static Physics.DataFiles.TruthTable Draw(string text)
    {
        var scenario = Parse(text);
        int bins = FourierTransform.OneSidedLength(scenario.Observation.SampleCount);
        var injection = Assert.Single(scenario.Sources);
        return injection.Inject(new InjectionContext(scenario.Observation, scenario.Noise.Model(), scenario.Seed), new Complex[bins], new Complex[bins], new Complex[bins]);
    }

    [Fact]
    public void The_resolved_scenario_writes_every_default_and_reads_back_the_same()
    {
        var s = Parse(Observation + "\n[massive_black_hole_binaries.population]\n\n" + """
            [[massive_black_hole_binaries.binary]]
            chirp_mass_msun = 1e6
            tc_s = 1000
            distance_mpc = 5000
            """);
        string toml = s.ToToml();
        foreach (string key in MassiveBlackHoleBinaryPopulationSettings.Keys) Assert.Contains(key + " = ", toml, StringComparison.Ordinal);
        foreach (string key in Physics.MassiveBlackHoleBinaries.MassiveBlackHoleBinaryParameters.ColumnNames) Assert.Contains(key + " = ", toml, StringComparison.Ordinal);
        Assert.Contains("id = \"mbhb-e0001\"", toml, StringComparison.Ordinal);
        Assert.Contains("merger_end_s = 864000", toml, StringComparison.Ordinal);
        Assert.Equal(toml, Parse(toml).ToToml());
    }
}
