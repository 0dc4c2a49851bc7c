using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class InspectInspiralTests
{
    // Ten days at 20 s with one invented inspiral: simulates in well under a second.
    private const string Scenario = """
        name = "ten days with an inspiral"
        seed = 31
        [observation]
        duration_days = 10
        cadence_s = 20
        [[extreme_mass_ratio_inspirals.inspiral]]
        id = "near"
        central_mass_msun = 1e6
        compact_mass_msun = 10
        orbital_frequency0_hz = 1e-3
        eccentricity0 = 0.2
        orbit_inclination_rad = 0.9
        distance_mpc = 200
        """;

    [Fact]
    public void Inspect_json_lists_a_simulated_inspiral_with_its_parameters_and_snr()
    {
        using var folder = new TempFolder();
        string data = folder.File("d.h5");
        var simulate = CliRun.Run("simulate", folder.Write("s.toml", Scenario), "--out", data);
        Assert.Equal(0, simulate.ExitCode);
        var inspect = CliRun.Run("inspect", data, "--json");
        Assert.Equal(0, inspect.ExitCode);
        using var json = JsonDocument.Parse(inspect.Out);
        var injected = Assert.Single(json.RootElement.GetProperty("injected").EnumerateArray());
        Assert.Equal("extreme_mass_ratio_inspirals", injected.GetProperty("class").GetString());
        Assert.Equal(1, injected.GetProperty("count").GetInt32());
        var source = Assert.Single(injected.GetProperty("sources").EnumerateArray());
        Assert.Equal("near", source.GetProperty("id").GetString());
        Assert.Equal(1e6, source.GetProperty("central_mass_msun").GetDouble());
        Assert.Equal(1e-3, source.GetProperty("orbital_frequency0_hz").GetDouble());
        Assert.True(source.GetProperty("snr").GetDouble() > 0);
    }
}
