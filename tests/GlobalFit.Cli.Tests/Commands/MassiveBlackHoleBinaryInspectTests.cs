using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class MassiveBlackHoleBinaryInspectTests
{
    // Two days at 10 s with one merger in the middle of the record.
    private const string Scenario = """
        seed = 3
        [observation]
        duration_days = 2
        cadence_s = 10
        [[massive_black_hole_binaries.binary]]
        id = "merger-1"
        chirp_mass_msun = 1e6
        mass_ratio = 2
        tc_s = 86400
        distance_mpc = 20000
        """;

    [Fact]
    public void Inspect_lists_the_injected_massive_black_hole_binaries_with_their_truth()
    {
        using var folder = new TempFolder();
        string data = folder.File("d.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("s.toml", Scenario), "--out", data).ExitCode);
        var inspect = CliRun.Run("inspect", data, "--json");
        Assert.Equal(0, inspect.ExitCode);
        using var json = JsonDocument.Parse(inspect.Out);
        var injected = Assert.Single(json.RootElement.GetProperty("injected").EnumerateArray());
        Assert.Equal("massive_black_hole_binaries", injected.GetProperty("class").GetString());
        Assert.Equal(1, injected.GetProperty("count").GetInt32());
        var source = Assert.Single(injected.GetProperty("sources").EnumerateArray());
        Assert.Equal("merger-1", source.GetProperty("id").GetString());
        Assert.Equal(1e6, source.GetProperty("chirp_mass_msun").GetDouble());
        Assert.Equal(86400, source.GetProperty("tc_s").GetDouble());
        Assert.True(source.GetProperty("snr").GetDouble() > 10);
        Assert.True(source.GetProperty("redshift").GetDouble() > 0);
    }
}
