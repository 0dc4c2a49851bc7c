using System.Globalization;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class SensitivityCommandTests
{
    [Fact]
    public void Curve_file_holds_the_published_noise_levels()
    {
        using var folder = new TempFolder();
        string csv = folder.File("curve.csv");
        var result = CliRun.Run("sensitivity", "--out", csv, "--f-min", "1e-3", "--f-max", "1e-2", "--points", "2", "--png", folder.File("curve.png"));
        Assert.Equal(0, result.ExitCode);
        var lines = File.ReadAllLines(csv);
        Assert.Equal("f_hz,psd_a_per_hz,psd_e_per_hz,psd_t_per_hz,sky_averaged_strain_psd_per_hz,approx_strain_psd_per_hz,foreground_strain_psd_per_hz", lines[0]);
        var at1mHz = lines[1].Split(',').Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToArray();
        // Source: derived (the same check values as tests/GlobalFit.Physics.Tests/CheckValues/instrument-noise.csv and
        // robson-sensitivity.csv): S_A = 8.844449e-43 at 1 mHz for equal-arm first-generation TDI with the allocation of
        // Robson, Cornish & Liu 2019, and their instrument-only S_n = 1.634101e-38 at 1 mHz, 7 figures: 1e-6 relative.
        Assert.Equal(1e-3, at1mHz[0], 1e-15);
        Assert.Equal(8.844449e-43, at1mHz[1], 8.844449e-43 * 1e-6);
        Assert.Equal(1.634101e-38, at1mHz[5], 1.634101e-38 * 1e-6);
        Assert.Equal(0.0, at1mHz[6]); // no foreground without --foreground-fit-years
        Assert.True(new FileInfo(folder.File("curve.png")).Length > 10_000);
    }

    [Fact]
    public void Foreground_column_follows_the_published_fit_for_the_chosen_duration()
    {
        using var folder = new TempFolder();
        string csv = folder.File("curve.csv");
        Assert.Equal(0, CliRun.Run("sensitivity", "--foreground-fit-years", "4", "--out", csv, "--f-min", "1e-3", "--f-max", "2e-3", "--points", "2", "--json").ExitCode);
        var row = File.ReadAllLines(csv)[1].Split(',').Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToArray();
        // Source: derived: Robson, Cornish & Liu 2019 Eq. 14 fit for 4 yr at 1 mHz, 6.662414e-38 (formula from memory;
        // same value as tests/GlobalFit.Physics.Tests/CheckValues/galactic-confusion.csv).
        Assert.Equal(6.662414e-38, row[6], 6.662414e-38 * 1e-6);
    }
}
