using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Samples;
using GlobalFit.Physics.Files;
using PureHDF;

namespace GlobalFit.Engine.Tests.Catalogue;

public class CatalogueWriterTests
{
    private static readonly ImmutableArray<string> GbColumns = ["f0_hz", "amplitude"];

    private static IReadOnlyList<CatalogueRecord> Records() =>
    [
        new("gb-0001", "galactic_binaries", 0.75, 12.5, GbColumns, [1e-3, 2e-22], [0.9e-3, 1e-22], [1.1e-3, 3e-22],
            [0.9e-3, 1e-22, 1e-3, 2e-22, 1.1e-3, 3e-22]),
        new("gb-0002", "galactic_binaries", 1.0, double.NaN, GbColumns, [2e-3, 5e-23], [2e-3, 5e-23], [2e-3, 5e-23],
            [2e-3, 5e-23]),
        new("mbh-0001", "massive_black_hole_binaries", 0.5, 300, ["mchirp_msun"], [1e6], [0.9e6], [1.2e6], [1e6, 0.9e6]),
    ];

    [Fact]
    public void Csv_has_one_row_per_source_and_median_lo_hi_columns_per_parameter()
    {
        var lines = CatalogueCsvWriter.Format(Records()).Split('\n');

        Assert.Equal("id,class,confidence,snr,f0_hz,f0_hz_lo,f0_hz_hi,amplitude,amplitude_lo,amplitude_hi,mchirp_msun,mchirp_msun_lo,mchirp_msun_hi", lines[0]);
        Assert.Equal("gb-0001,galactic_binaries,0.75,12.5,0.001,0.0009,0.0011,2e-22,1e-22,3e-22,,,", lines[1]);
        Assert.Equal("NaN", lines[2].Split(',')[3]);
        Assert.Equal("mbh-0001,massive_black_hole_binaries,0.5,300,,,,,,,1000000,900000,1200000", lines[3]);
        Assert.Equal("", lines[4]);   // the file ends with a line feed
        Assert.Equal(5, lines.Length);
        Assert.Equal(Records()[0].Upper[1], double.Parse(lines[1].Split(',')[9], CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Hdf5_catalogue_reads_back_sources_summaries_and_samples()
    {
        using var run = new TemporaryRunFolder();
        string path = run.File("catalogue.h5");
        CatalogueHdf5Writer.Write(path, Records(), overwrite: false);

        using var file = H5File.OpenRead(path, CatalogueHdf5Layout.ReadOptions);
        Assert.Equal(2, file.Attribute("format_version").Read<int>());
        var gb = file.Group("catalogue/galactic_binaries");
        Assert.Equal(["f0_hz", "amplitude"], gb.Attribute("columns").Read<string[]>());
        var rows = gb.Dataset("sources").Read<CatalogueSourceRow[]>();
        Assert.Equal(["gb-0001", "gb-0002"], rows.Select(e => e.Id));
        Assert.Equal([0.75, 1.0], rows.Select(e => e.Confidence));
        Assert.True(double.IsNaN(rows[1].Snr));
        Assert.Equal([(0L, 3L), (3L, 1L)], rows.Select(e => (e.FirstSample, e.SampleCount)));
        Assert.Equal(new[,] { { 1e-3, 2e-22 }, { 2e-3, 5e-23 } }, gb.Dataset("median").Read<double[,]>());
        Assert.Equal(new[,] { { 1.1e-3, 3e-22 }, { 2e-3, 5e-23 } }, gb.Dataset("upper").Read<double[,]>());
        Assert.Equal(new[,] { { 0.9e-3, 1e-22 }, { 1e-3, 2e-22 }, { 1.1e-3, 3e-22 }, { 2e-3, 5e-23 } }, gb.Dataset("samples").Read<double[,]>());
        Assert.Equal([0L, 0L, 0L, 1L], gb.Dataset("sample_source").Read<long[]>());
        var mbh = file.Group("catalogue/massive_black_hole_binaries");
        Assert.Equal(new[,] { { 1e6 }, { 0.9e6 } }, mbh.Dataset("samples").Read<double[,]>());
    }

    [Fact]
    public void Json_catalogue_holds_sources_with_named_summaries_and_sample_rows()
    {
        using var run = new TemporaryRunFolder();
        string path = run.File("catalogue.json");
        CatalogueJsonWriter.Write(path, Records(), overwrite: false);

        using var json = JsonDocument.Parse(File.ReadAllText(path));
        Assert.Equal(2, json.RootElement.GetProperty("format_version").GetInt32());
        var first = json.RootElement.GetProperty("sources")[0];
        Assert.Equal("gb-0001", first.GetProperty("id").GetString());
        Assert.Equal(1.1e-3, first.GetProperty("upper").GetProperty("f0_hz").GetDouble());
        Assert.Equal(3, first.GetProperty("samples").GetArrayLength());
        Assert.Equal(3e-22, first.GetProperty("samples")[2][1].GetDouble());
        Assert.Equal("NaN", json.RootElement.GetProperty("sources")[1].GetProperty("snr").GetString());
    }

    [Fact]
    public void Writers_refuse_to_replace_an_existing_file_unless_asked()
    {
        using var run = new TemporaryRunFolder();
        var writers = new (string Name, Action<string, bool> Write)[]
        {
            ("catalogue.csv", (p, o) => CatalogueCsvWriter.Write(p, Records(), o)),
            ("catalogue.json", (p, o) => CatalogueJsonWriter.Write(p, Records(), o)),
            ("catalogue.h5", (p, o) => CatalogueHdf5Writer.Write(p, Records(), o)),
        };
        foreach (var (name, write) in writers)
        {
            string path = run.File(name);
            File.WriteAllText(path, "earlier");
            var error = Assert.Throws<InvalidInputException>(() => write(path, false));
            Assert.Equal(path, error.InputSource);
            Assert.Equal("earlier", File.ReadAllText(path));
            write(path, true);
            Assert.NotEqual("earlier", File.ReadAllText(path));
        }
    }

    [Fact]
    public void Records_whose_summaries_do_not_match_their_parameters_are_refused_before_writing()
    {
        using var run = new TemporaryRunFolder();
        var bad = Records()[0] with { Median = [1.0] };
        Assert.Throws<ArgumentException>(() => CatalogueHdf5Writer.Write(run.File("c.h5"), [bad], overwrite: false));
        var mixed = Records()[2] with { ClassId = "galactic_binaries", Id = "gb-0003" };
        Assert.Throws<ArgumentException>(() => CatalogueCsvWriter.Write(run.File("c.csv"), [Records()[0], mixed], overwrite: false));
        Assert.Empty(Directory.EnumerateFiles(run.Path));
    }

    [Fact]
    public void A_class_whose_sources_hold_no_samples_still_writes()
    {
        using var run = new TemporaryRunFolder();
        string path = run.File("empty.h5");
        CatalogueHdf5Writer.Write(path, [Records()[0] with { Samples = [] }], overwrite: false);
        using var file = H5File.OpenRead(path, CatalogueHdf5Layout.ReadOptions);
        Assert.Equal(0L, file.Group("catalogue/galactic_binaries").Dataset("sources").Read<CatalogueSourceRow[]>()[0].SampleCount);
    }
}
