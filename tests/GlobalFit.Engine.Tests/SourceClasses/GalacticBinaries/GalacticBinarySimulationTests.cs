using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinarySimulationTests
{
    private const string Observation = """
        seed = 11
        [observation]
        duration_days = 8
        cadence_s = 10
        """;

    private const string OneBinary = """
        [[galactic_binaries.binary]]
        id = "loud"
        f0_hz = 3.1e-3
        fdot_hz_s = 1e-16
        amplitude = 2e-22
        beta_rad = 0.4
        lambda_rad = 2.0
        iota_rad = 0.7
        psi_rad = 0.3
        phi0_rad = 1.1
        """;

    private static SimulationScenario Parse(string text) => SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(text, "scenario.toml"));

    private static Physics.DataFiles.Observation Simulate(string text) =>
        ObservationSimulator.Simulate(Parse(text), "test", new Dictionary<string, string>(), null);

    // With the same seed the noise is identical, so the difference of the two data sets is exactly the injected
    // signal; its spectrum must equal the fast template (overlap 1 to round-off of two FFTs, ~1e-12).
    [Fact]
    public void An_explicit_binary_adds_exactly_its_template_to_the_noise()
    {
        var withSource = Simulate(Observation + "\n" + OneBinary);
        var without = Simulate(Observation);
        var truth = Assert.Single(withSource.Truth);
        Assert.Equal("galactic_binaries", truth.ClassId);
        Assert.Equal(["loud"], truth.Ids);
        Assert.Equal(3.1e-3, truth[0, "f0_hz"]);

        int n = withSource.Data.Count;
        double dt = withSource.Data.DtSeconds;
        var difference = new double[n];
        for (int i = 0; i < n; i++) difference[i] = withSource.Data.A.Samples[i] - without.Data.A.Samples[i];
        var spectrum = new Complex[FourierTransform.OneSidedLength(n)];
        FourierTransform.Forward(difference, dt, spectrum);

        var generator = new GalacticBinaryTemplateGenerator(n * dt, dt);
        var source = new GalacticBinaryParameters(3.1e-3, 1e-16, 2e-22, 0.4, 2.0, 0.7, 0.3, 1.1);
        var template = new Complex[spectrum.Length];
        generator.AddResponse(source, new BinWindow(0, spectrum.Length), template, new Complex[spectrum.Length], new Complex[spectrum.Length]);
        var w = new[] { Enumerable.Repeat(1.0, spectrum.Length).ToArray() };
        Assert.Equal(1.0, Match.Overlap([spectrum], [template], w, 1.0 / (n * dt)), 1e-9);
        double ratio = InnerProduct.SquaredNorm(spectrum, w[0], 1) / InnerProduct.SquaredNorm(template, w[0], 1);
        Assert.Equal(1.0, ratio, 1e-9);
    }

    [Fact]
    public void Truth_table_records_each_binary_with_its_optimal_snr()
    {
        var observation = Simulate(Observation + "\n" + OneBinary);
        var truth = observation.Truth[0];
        double snr = truth[0, "snr"];
        var generator = new GalacticBinaryTemplateGenerator(observation.Data.Count * 10.0, 10.0);
        var noise = Parse(Observation).Noise.Model();
        var source = new GalacticBinaryParameters(3.1e-3, 1e-16, 2e-22, 0.4, 2.0, 0.7, 0.3, 1.1);
        Assert.Equal(GalacticBinarySnr.Optimal(generator, source, noise), snr, 1e-12 * snr);
        Assert.True(snr > 5, $"a 2e-22 binary at 3 mHz over 8 days should be loud, got SNR {snr}");
    }

    [Fact]
    public void A_population_is_drawn_reproducibly_within_its_band_with_unique_ids()
    {
        const string text = Observation + "\n" + """
            [galactic_binaries.population]
            count = 300
            f_min_hz = 1e-3
            f_max_hz = 4e-3
            """;
        var first = Simulate(text).Truth[0];
        var second = Simulate(text).Truth[0];
        Assert.Equal(300, first.RowCount);
        Assert.Equal(300, first.Ids.Distinct().Count());
        Assert.Equal(first.Values.ToArray(), second.Values.ToArray());
        for (int row = 0; row < first.RowCount; row++)
        {
            Assert.InRange(first[row, "f0_hz"], 1e-3, 4e-3);
            Assert.True(first[row, "fdot_hz_s"] > 0, "quadrupole evolution makes every drawn binary chirp up");
            Assert.True(double.IsFinite(first[row, "snr"]) && first[row, "snr"] >= 0);
        }
    }

    [Theory]
    [InlineData("[[galactic_binaries.binary]]\nf0_hz = 1e-3\n", "each binary needs 'amplitude'")]
    [InlineData("[[galactic_binaries.binary]]\nf0_hz = 0.049\namplitude = 1e-22\n", "Nyquist")]
    [InlineData("[[galactic_binaries.binary]]\nf0_hz = 1e-3\namplitude = 1e-22\nbeta_rad = 2.0\n", "key 'galactic_binaries.binary.beta_rad'")]
    [InlineData("[[galactic_binaries.binary]]\nf0_hz = 1e-3\namplitude = 1e-22\nfreq = 2\n", "unknown key 'galactic_binaries.binary.freq'")]
    [InlineData("[galactic_binaries.population]\nf_min_hz = 2e-3\nf_max_hz = 1e-3\n", "must exceed f_min_hz")]
    [InlineData("[galactic_binaries]\nbinaries = 3\n", "did you mean 'binary'?")]
    [InlineData("[galactic_binarys.population]\ncount = 3\n", "did you mean 'galactic_binaries'?")]
    public void Invalid_source_sections_are_rejected_naming_the_key(string section, string problem)
    {
        var e = Assert.Throws<InvalidInputException>(() => Parse(Observation + "\n" + section));
        Assert.StartsWith("scenario.toml:", e.Message);
        Assert.Contains(problem, e.Message);
    }

    [Fact]
    public void Resolved_source_sections_read_back_to_the_same_scenario()
    {
        var scenario = Parse(Observation + "\n" + OneBinary + "\n[galactic_binaries.population]\ncount = 5\n");
        Assert.Equal(scenario.ToToml(), Parse(scenario.ToToml()).ToToml());
    }
}
