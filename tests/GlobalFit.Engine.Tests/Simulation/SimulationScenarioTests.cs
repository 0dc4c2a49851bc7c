using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Simulation;

public class SimulationScenarioTests
{
    private static SimulationScenario Parse(string text) => SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(text, "scenario.toml"));

    [Fact]
    public void Defaults_fill_every_unspecified_setting()
    {
        var s = Parse("[observation]\nduration_days = 2\n");
        Assert.Equal(2 * 86400.0, s.Observation.DurationS);
        Assert.Equal(5.0, s.Observation.CadenceS);
        Assert.Equal(NoiseSettings.Default, s.Noise);
        Assert.Equal(34560, s.Observation.SampleCount);
    }

    [Fact]
    public void Resolved_scenario_written_as_toml_reads_back_to_the_same_scenario()
    {
        var s = Parse("""
            name = "two quiet days"
            seed = 99
            [observation]
            duration_s = 172800
            cadence_s = 10
            [noise]
            oms_asd = 1e-11
            [noise.foreground]
            fit_years = 4
            amplitude = 0.5
            """);
        Assert.Equal(s.ToToml(), Parse(s.ToToml()).ToToml());
        Assert.Equal(s.Observation, Parse(s.ToToml()).Observation);
        Assert.Equal(s.Noise, Parse(s.ToToml()).Noise);
    }

    [Theory]
    [InlineData("[observation]\nduration_s = -5\n", "line 2, column 1, key 'observation.duration_s'", "positive")]
    [InlineData("[observation]\nduration_s = 100\ncadence_s = 0\n", "key 'observation.cadence_s'", "positive")]
    [InlineData("[observation]\nduration_s = 100\ncadence_s = 10\n", "key 'observation.cadence_s'", "gives 10 points per channel; at least 16")]
    // 6e17 s at 0.1 s: 6e18 points, said with a two-digit exponent (not .NET's 6.000E+018), before the 20-year check.
    [InlineData("[observation]\nduration_s = 6e17\ncadence_s = 0.1\n", "key 'observation.duration_s'", "gives 6e+18 points per channel, more than")]
    [InlineData("[observation]\nduration_s = 1e6\nduration_days = 3\n", "duration_days", "not both")]
    [InlineData("[observation]\ncadence_s = 5\n", null, "'duration_s' (or 'duration_days') is missing")]
    [InlineData("[observation]\nduration_days = 3\n[noise.foreground]\nfit_years = 3\n", "key 'noise.foreground.fit_years'", "0.5, 1, 2 and 4")]
    [InlineData("[observation]\nduration_days = 3\n[noise]\noms_asd = 1e-11\nacc_asd = 3e-15\n", "line 5, column 1, key 'noise.acc_asd'", "unknown key")]
    [InlineData("sede = 3\n[observation]\nduration_days = 3\n", "key 'sede'", "did you mean 'seed'?")]
    [InlineData("seed = -3\n[observation]\nduration_days = 3\n", "key 'seed'", "integer in [0,")]
    [InlineData("name = \"x\"\n", null, "[observation] table is required")]
    [InlineData("[observation]\nduration_days = 7000\ncadence_s = 0.1\n", "key 'observation.duration_days'", "more than this build handles")]
    [InlineData("[observation]\nduration_days = 8000\n", "key 'observation.duration_days'", "beyond 20 years")]
    // 4.99e8 samples need about 93 GiB at the measured 200 bytes per sample: more than any test machine here has
    // (this one has 24 GiB; CI machines are of the same class).
    [InlineData("[observation]\nduration_s = 4.99e8\ncadence_s = 1\n", "key 'observation.duration_s'", "GiB to simulate")]
    public void Invalid_scenarios_are_rejected_naming_the_key(string text, string? where, string problem)
    {
        var e = Assert.Throws<InvalidInputException>(() => Parse(text));
        Assert.StartsWith("scenario.toml:", e.Message);
        if (where is not null) Assert.Contains(where, e.Message);
        Assert.Contains(problem, e.Message);
    }
}
