using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>A scenario section that cannot be simulated is refused, naming the key and its line.</summary>
public class MassiveBlackHoleBinaryScenarioErrorTests
{
    private const string Observation = "[observation]\nduration_days = 10\ncadence_s = 10\n";

    private const string Listed = "[[massive_black_hole_binaries.binary]]\nchirp_mass_msun = 1e6\ntc_s = 1000\ndistance_mpc = 5000\n";

    private static InvalidInputException Refused(string section) =>
        Assert.Throws<InvalidInputException>(() => SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(Observation + section, "scenario.toml")));

    [Theory]
    [InlineData(Listed + "spin1 = 1.5\n", "spin1")]
    [InlineData(Listed + "mass_ratio = 0.5\n", "mass_ratio")]
    [InlineData(Listed + "beta_rad = 2\n", "beta_rad")]
    [InlineData(Listed + "mass = 3\n", "mass")]
    [InlineData("[[massive_black_hole_binaries.binary]]\ntc_s = 1000\ndistance_mpc = 5000\n", "chirp_mass_msun")]
    [InlineData("[[massive_black_hole_binaries.binary]]\nchirp_mass_msun = 1e6\ntc_s = 1000\ndistance_mpc = -5\n", "distance_mpc")]
    [InlineData("[massive_black_hole_binaries.population]\ncount = -1\n", "count")]
    [InlineData("[massive_black_hole_binaries.population]\nchirp_mass_min_msun = 1e6\nchirp_mass_max_msun = 1e5\n", "chirp_mass_max_msun")]
    [InlineData("[massive_black_hole_binaries.population]\nmass_ratio_max = 50\n", "mass_ratio_max")]
    [InlineData("[massive_black_hole_binaries.population]\nredshift_min = 3\nredshift_max = 2\n", "redshift_max")]
    [InlineData("[massive_black_hole_binaries.population]\nmerger_start_s = 100\nmerger_end_s = 50\n", "merger_end_s")]
    [InlineData("[massive_black_hole_binaries.population]\nspin_maximum = 0.5\n", "spin_maximum")]
    [InlineData("[massive_black_hole_binaries]\nbinaries = 3\n", "binaries")]
    public void A_bad_key_or_value_is_refused_naming_the_key_and_its_line(string section, string key)
    {
        var error = Refused(section);
        Assert.Contains(key, error.Message, StringComparison.Ordinal);
        Assert.Contains("line ", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_id_used_twice_is_refused()
    {
        var error = Refused("[[massive_black_hole_binaries.binary]]\nid = \"x\"\n" + Listed[Listed.IndexOf('\n', StringComparison.Ordinal)..]
            + "[[massive_black_hole_binaries.binary]]\nid = \"x\"\n" + Listed[Listed.IndexOf('\n', StringComparison.Ordinal)..]);
        Assert.Contains("used twice", error.Message, StringComparison.Ordinal);
    }
}
