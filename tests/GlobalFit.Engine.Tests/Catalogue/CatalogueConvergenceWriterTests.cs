using System.Collections.Immutable;
using System.Text.Json;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Fitting;
using PureHDF;

namespace GlobalFit.Engine.Tests.Catalogue;

public class CatalogueConvergenceWriterTests
{
    private static readonly ImmutableArray<string> Columns = ["f0_hz", "amplitude"];

    private static IReadOnlyList<CatalogueRecord> Records() =>
    [
        new CatalogueRecord("gb-0001", "galactic_binaries", 0.75, 12.5, Columns, [1e-3, 2e-22], [0.9e-3, 1e-22], [1.1e-3, 3e-22], [1e-3, 2e-22])
        {
            Convergence = new SourceConvergence([1.002, 1.25], [410, 12], ["north", "south"], [0.75, 0.25]),
        },
        new CatalogueRecord("noise", "noise", 1, double.NaN, ["level"], [1], [0.9], [1.1], [1]),
    ];

    // The convergence columns follow the summaries; a source without a report leaves its cells empty.
    [Fact]
    public void Csv_rows_carry_r_hat_ess_and_sky_mode_fractions()
    {
        var lines = CatalogueCsvWriter.Format(Records()).Split('\n');
        Assert.EndsWith("f0_hz_rhat,f0_hz_ess,amplitude_rhat,amplitude_ess,level_rhat,level_ess,sky_north,sky_south", lines[0]);
        Assert.EndsWith(",1.002,410,1.25,12,,,0.75,0.25", lines[1]);
        Assert.EndsWith(",,,,,,,,", lines[2]);
    }

    [Fact]
    public void Json_and_hdf5_carry_the_same_report()
    {
        var json = JsonDocument.Parse(CatalogueJsonWriter.Format(Records()));
        var convergence = json.RootElement.GetProperty("sources")[0].GetProperty("convergence");
        Assert.Equal(1.25, convergence.GetProperty("split_rhat").GetProperty("amplitude").GetDouble());
        Assert.Equal(410, convergence.GetProperty("ess").GetProperty("f0_hz").GetDouble());
        Assert.Equal(0.25, convergence.GetProperty("sky_modes").GetProperty("south").GetDouble());
        Assert.False(json.RootElement.GetProperty("sources")[1].TryGetProperty("convergence", out _));

        string path = Path.Combine(Path.GetTempPath(), $"convergence-{Guid.NewGuid():N}.h5");
        try
        {
            CatalogueHdf5Writer.Write(path, Records(), overwrite: false);
            using var file = H5File.OpenRead(path, CatalogueHdf5Layout.ReadOptions);
            var gb = file.Group("catalogue/galactic_binaries");
            Assert.Equal(new[,] { { 1.002, 1.25 } }, gb.Dataset(CatalogueHdf5Layout.SplitRhatDataset).Read<double[,]>());
            Assert.Equal(new[,] { { 410.0, 12.0 } }, gb.Dataset(CatalogueHdf5Layout.EssDataset).Read<double[,]>());
            var modes = gb.Dataset(CatalogueHdf5Layout.SkyModeDataset);
            Assert.Equal(["north", "south"], modes.Attribute(CatalogueHdf5Layout.ModesAttribute).Read<string[]>());
            Assert.Equal(new[,] { { 0.75, 0.25 } }, modes.Read<double[,]>());
            Assert.False(file.Group("catalogue/noise").LinkExists(CatalogueHdf5Layout.SplitRhatDataset));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void A_report_that_does_not_match_its_parameters_is_refused()
    {
        var bad = new CatalogueRecord("gb-0001", "galactic_binaries", 1, 10, Columns, [1, 2], [1, 2], [1, 2], [])
        {
            Convergence = new SourceConvergence([1.0], [10, 10], [], []),
        };
        Assert.Throws<ArgumentException>(() => CatalogueCsvWriter.Format([bad]));
    }
}
