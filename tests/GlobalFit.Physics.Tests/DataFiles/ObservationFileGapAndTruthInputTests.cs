using GlobalFit.Physics.DataFiles;
using PureHDF;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

/// <summary>Bad <c>/gaps</c> tables and truth tables in files from outside. The valid tree has 16 samples from
/// t0 = 1000 s at 5 s, so the record is [1000, 1080).</summary>
public class ObservationFileGapAndTruthInputTests
{
    private static string WriteTree(TempFolder folder, H5File tree)
    {
        string path = folder.File("tables.h5");
        tree.Write(path);
        return path;
    }

    private static string WithGaps(TempFolder folder, params double[] pairs)
    {
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["gaps"] = ObservationSamples.Matrix(pairs, columns: 2);
        return WriteTree(folder, tree);
    }

    [Fact]
    public void Valid_gaps_from_a_hand_built_file_are_read()
    {
        using var folder = new TempFolder();
        var gaps = ObservationFile.Read(WithGaps(folder, 1000, 1010, 1010, 1020, 1070, 1080)).Gaps;
        Assert.Equal([new Gap(1000, 1010), new Gap(1010, 1020), new Gap(1070, 1080)], gaps);
    }

    [Theory]
    [InlineData(new[] { 1010.0, 1030, 1020, 1040 }, "gap 1 [1020, 1040) overlaps gap 0 [1010, 1030)")]
    [InlineData(new[] { 1050.0, 1060, 1010, 1020 }, "gap 1 [1010, 1020) starts before gap 0 [1050, 1060): gaps must be sorted by start")]
    [InlineData(new[] { 1010.0, 1020, 1030, 1030 }, "gap 1 [1030, 1030) does not start before it ends")]
    [InlineData(new[] { 1040.0, 1030 }, "gap 0 [1040, 1030) does not start before it ends")]
    [InlineData(new[] { 990.0, 1010 }, "gap 0 [990, 1010) is not inside the record [1000, 1080)")]
    [InlineData(new[] { 1010.0, 1020, 1075, 1080.5 }, "gap 1 [1075, 1080.5) is not inside the record [1000, 1080)")]
    [InlineData(new[] { 1010.0, double.NaN }, "gap 0 [1010, NaN) has a non-finite end point")]
    public void Bad_gap_table_is_reported_with_the_offending_gap(double[] pairs, string problem)
    {
        using var folder = new TempFolder();
        BadInputAssert.Read(WithGaps(folder, pairs), "/gaps", problem);
    }

    [Fact]
    public void Gap_table_with_three_columns_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["gaps"] = ObservationSamples.Matrix([1000, 1010, 0], columns: 3);
        BadInputAssert.Read(WriteTree(folder, tree), "/gaps", "has 3 columns; expected 2");
    }

    [Fact]
    public void Flat_gap_list_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["gaps"] = new[] { 1000.0, 1010 };
        BadInputAssert.Read(WriteTree(folder, tree), "/gaps", "has 1 dimensions; expected 2");
    }

    [Fact]
    public void Gaps_stored_as_a_group_are_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["gaps"] = new H5Group();
        BadInputAssert.Read(WriteTree(folder, tree), "/gaps", "is not a dataset");
    }

    private static H5Group TruthClass(double[] values, int columns, string[] names, string[] ids)
    {
        var dataset = ObservationSamples.Matrix(values, columns);
        dataset.Attributes["columns"] = names;
        return new H5Group { ["values"] = dataset, ["ids"] = ids };
    }

    private static string WithTruth(TempFolder folder, string classId, H5Group table)
    {
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["truth"] = new H5Group { [classId] = table };
        return WriteTree(folder, tree);
    }

    [Fact]
    public void Hand_built_truth_table_is_read()
    {
        using var folder = new TempFolder();
        var path = WithTruth(folder, "galactic_binaries", TruthClass([1, 2, 3, 4], 2, ["f0_hz", "snr"], ["a", "b"]));
        var table = ObservationFile.Read(path).FindTruth("galactic_binaries")!;
        Assert.Equal(["a", "b"], table.Ids);
        Assert.Equal(3.0, table[1, "f0_hz"]);
    }

    [Fact]
    public void Truth_table_whose_column_names_do_not_match_its_width_is_reported()
    {
        using var folder = new TempFolder();
        var path = WithTruth(folder, "galactic_binaries", TruthClass([1, 2, 3, 4], 2, ["f0_hz"], ["a", "b"]));
        BadInputAssert.Read(path, "/truth/galactic_binaries/values attribute columns", "names 1 columns but the table has 2");
    }

    [Fact]
    public void Truth_table_with_fewer_ids_than_rows_is_reported()
    {
        using var folder = new TempFolder();
        var path = WithTruth(folder, "galactic_binaries", TruthClass([1, 2, 3, 4], 2, ["f0_hz", "snr"], ["a"]));
        BadInputAssert.Read(path, "/truth/galactic_binaries/ids", "holds 1 ids but /truth/galactic_binaries/values has 2 rows");
    }

    [Fact]
    public void Truth_table_with_a_repeated_id_is_reported_with_the_row()
    {
        using var folder = new TempFolder();
        var path = WithTruth(folder, "galactic_binaries", TruthClass([1, 2, 3, 4], 2, ["f0_hz", "snr"], ["a", "a"]));
        BadInputAssert.Read(path, "/truth/galactic_binaries", "row 1 repeats id 'a'");
    }

    [Fact]
    public void Truth_table_without_column_names_is_reported()
    {
        using var folder = new TempFolder();
        var table = TruthClass([1, 2], 2, ["f0_hz", "snr"], ["a"]);
        ((H5Dataset)table["values"]).Attributes.Remove("columns");
        BadInputAssert.Read(WithTruth(folder, "galactic_binaries", table), "/truth/galactic_binaries/values attribute columns", "missing");
    }

    [Fact]
    public void Truth_class_with_a_name_that_is_not_snake_case_is_reported()
    {
        using var folder = new TempFolder();
        var path = WithTruth(folder, "Galactic Binaries", TruthClass([1], 1, ["f0_hz"], ["a"]));
        BadInputAssert.Read(path, "/truth/Galactic Binaries", "is not a snake_case class id");
    }

    [Fact]
    public void Truth_class_stored_as_a_bare_dataset_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["truth"] = new H5Group { ["galactic_binaries"] = ObservationSamples.Matrix([1, 2], 2) };
        BadInputAssert.Read(WriteTree(folder, tree), "/truth/galactic_binaries", "is not a group");
    }

    [Fact]
    public void Provenance_note_that_is_not_text_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree["provenance"] = new H5Group { Attributes = { ["seed"] = 42 } };
        BadInputAssert.Read(WriteTree(folder, tree), "/provenance attribute seed", "expected text");
    }
}
