using GlobalFit.Cli.Tests.Support;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Tests.Shared;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>Every HDF5 file the program writes, read back through the HDF5 C library's <c>h5dump</c> (not the library
/// that wrote it), holds exactly the groups, datasets, attributes and compound members its layout document
/// describes, so document and files cannot drift apart.</summary>
public class FileLayoutTests
{
    private static LayoutDocument Document(string relative, string heading) =>
        LayoutDocument.Parse(File.ReadAllText(RepositoryFiles.PathOf(relative)), heading);

    private static void AssertMatches(LayoutDocument document, string path)
    {
        var names = Hdf5Structure.Read(path);
        Assert.True(names.Count > 3, $"h5dump found almost nothing in {path}: {string.Join(", ", names)}");
        Assert.Empty(document.Undocumented(names));
        Assert.Empty(document.Missing(names));
    }

    [Fact]
    public void Observation_files_written_by_simulate_and_with_gaps_hold_exactly_the_documented_names()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        var document = Document("src/GlobalFit.Physics/DataFiles/LAYOUT.md", "Tree");
        AssertMatches(document, data);

        // simulate writes no gaps; the optional /gaps dataset is checked on a copy that has one
        var read = ObservationFile.Read(data);
        string gapped = folder.File("gapped.h5");
        ObservationFile.Write(new Observation(read.Data, new GapList([new Gap(100, 200)]), read.Truth, read.Provenance), gapped, overwrite: false);
        var names = Hdf5Structure.Read(gapped);
        Assert.Contains("/gaps", names);
        Assert.Contains("/gaps@columns", names);
        Assert.Empty(document.Undocumented(names));
    }

    [Fact]
    public void Catalogue_files_of_a_fit_and_of_the_catalogue_command_hold_exactly_the_documented_names()
    {
        using var folder = new TempFolder();
        string data = folder.File("data.h5"), run = folder.File("run");
        Assert.Equal(0, CliRun.Run("simulate", folder.Write("scenario.toml", SmallFitRecord.Scenario), "--out", data).ExitCode);
        var fit = CliRun.Run("fit", folder.Write("fit.toml", SmallFitRecord.FitConfig(data, run, iterations: 2, threads: 1, stepsPerUpdate: 20)));
        Assert.True(fit.ExitCode == 0, fit.Error);
        var document = Document("src/GlobalFit.Engine/Catalogue/LAYOUT.md", "`catalogue.h5`");
        AssertMatches(document, Path.Combine(run, "catalogue.h5"));

        string exported = folder.File("exported.h5");
        Assert.Equal(0, CliRun.Run("catalogue", run, "--format", "h5", "--out", exported).ExitCode);
        AssertMatches(document, exported);
    }

    [Theory]
    // A shortened h5dump -H output of a catalogue file (HDF5 1.10.8 spelling), with the compound written as the
    // issue found it (C# field names); the parser must report exactly these names.
    [InlineData("""
        HDF5 "c.h5" {
        GROUP "/" {
           ATTRIBUTE "format_version" {
              DATATYPE  H5T_STD_I32LE
              DATASPACE  SCALAR
           }
           GROUP "catalogue" {
              GROUP "galactic_binaries" {
                 DATASET "sources" {
                    DATATYPE  H5T_COMPOUND {
                       H5T_STRING {
                          STRSIZE H5T_VARIABLE;
                          CTYPE H5T_C_S1;
                       } "Id";
                       H5T_IEEE_F64LE "Confidence";
                    }
                    DATASPACE  SIMPLE { ( 2 ) / ( 2 ) }
                 }
              }
           }
        }
        }
        """, "/,/@format_version,/catalogue,/catalogue/galactic_binaries,/catalogue/galactic_binaries/sources,/catalogue/galactic_binaries/sources#Confidence,/catalogue/galactic_binaries/sources#Id")]
    public void The_h5dump_reader_reports_groups_datasets_attributes_and_compound_members(string header, string expected)
    {
        Assert.Equal(expected.Split(','), Hdf5Structure.Parse(header));
    }

    [Fact]
    public void A_compound_member_that_the_document_does_not_name_is_reported()
    {
        var document = Document("src/GlobalFit.Engine/Catalogue/LAYOUT.md", "`catalogue.h5`");
        var names = new[] { "/", "/@format_version", "/catalogue", "/catalogue/galactic_binaries", "/catalogue/galactic_binaries/sources#Id" };
        Assert.Contains("/catalogue/galactic_binaries/sources#Id", document.Undocumented(names));
    }
}
