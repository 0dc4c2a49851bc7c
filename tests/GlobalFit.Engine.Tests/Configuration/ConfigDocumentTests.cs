using GlobalFit.Engine.Configuration;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Configuration;

public class ConfigDocumentTests
{
    [Fact]
    public void Values_are_read_with_their_types_from_nested_and_dotted_tables()
    {
        var root = ConfigDocument.Parse("""
            seed = 7
            [a]
            x = 2.5
            n = 3
            flag = true
            s = "text"
            [a.b]
            y = 1
            c.d = 4.0
            """, "t.toml");
        var a = root.GetTable("a")!;
        Assert.Equal(7, root.GetInteger("seed", 0));
        Assert.Equal(2.5, a.GetDouble("x", 0));
        Assert.Equal(3.0, a.GetDouble("n", 0)); // integer literal accepted where a number is expected
        Assert.True(a.GetBool("flag", false));
        Assert.Equal("text", a.GetString("s", ""));
        Assert.Equal(1, a.GetTable("b")!.GetInteger("y", 0));
        Assert.Equal(4.0, a.GetTable("b")!.GetTable("c")!.GetDouble("d", 0)); // dotted keys extend the current table
    }

    [Fact]
    public void Arrays_of_tables_become_lists_in_file_order()
    {
        var root = ConfigDocument.Parse("""
            [[source]]
            f = 1.0
            [[source]]
            f = 2.0
            """, "t.toml");
        var sources = root.GetTableArray("source");
        Assert.Equal([1.0, 2.0], sources.Select(s => s.GetDouble("f", 0)));
    }

    [Fact]
    public void A_misspelt_key_is_rejected_with_its_line_column_and_a_suggestion()
    {
        var root = ConfigDocument.Parse("[observation]\ncadence_s = 5\nduraton_s = 10\n", "scenario.toml");
        var table = root.GetTable("observation")!;
        table.GetDouble("cadence_s", 1);
        var e = Assert.Throws<InvalidInputException>(() => table.RejectUnknownKeys(["cadence_s", "duration_s"]));
        Assert.Equal("scenario.toml: line 3, column 1, key 'observation.duraton_s': unknown key 'observation.duraton_s'; did you mean 'duration_s'?", e.Message);
    }

    [Fact]
    public void A_mistyped_value_names_the_key_and_what_was_expected()
    {
        var root = ConfigDocument.Parse("x = \"five\"\n", "t.toml");
        var e = Assert.Throws<InvalidInputException>(() => root.GetDouble("x", 0));
        Assert.Contains("line 1, column 1, key 'x'", e.Message);
        Assert.Contains("must be a number, got the string \"five\"", e.Message);
    }

    [Fact]
    public void A_syntax_error_reports_line_and_column()
    {
        var e = Assert.Throws<InvalidInputException>(() => ConfigDocument.Parse("a = 1\nb = = 2\n", "bad.toml"));
        Assert.StartsWith("bad.toml: line 2, column 5:", e.Message);
    }

    [Theory]
    [InlineData("data = \"\"", "empty string")]
    [InlineData("data = \"   \"", "empty string")]
    [InlineData("data = \"a\\u0000b.h5\"", "control character")]
    [InlineData("data = \"a\\nb.h5\"", "control character")]
    public void An_empty_path_or_one_with_control_characters_is_refused_naming_the_key(string line, string problem)
    {
        var root = ConfigDocument.Parse(line + "\n", "run.toml");
        var e = Assert.Throws<InvalidInputException>(() => root.GetPath("data", "", Path.GetTempPath()));
        Assert.Contains("key 'data'", e.Message, StringComparison.Ordinal);
        Assert.Contains(problem, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_relative_path_is_taken_from_the_given_folder()
    {
        var root = ConfigDocument.Parse("data = \"../d.h5\"\n", "run.toml");
        string top = Path.GetTempPath(), configs = Path.Combine(top, "configs");
        Assert.Equal(Path.Combine(top, "d.h5"), root.GetPath("data", "", configs));
        Assert.Equal(Path.Combine(configs, "run"), root.GetPath("run_folder", "run", configs));
    }

    [Fact]
    public void A_duplicate_key_is_rejected()
    {
        var e = Assert.Throws<InvalidInputException>(() => ConfigDocument.Parse("a = 1\na = 2\n", "dup.toml"));
        Assert.Contains("dup.toml: line 2", e.Message);
    }

    [Fact]
    public void A_missing_file_is_reported_by_name()
    {
        var e = Assert.Throws<InvalidInputException>(() => ConfigDocument.Load("/nonexistent/folder/x.toml"));
        Assert.Contains("x.toml", e.Message);
        Assert.Contains("not found", e.Message);
    }

    [Theory]
    [InlineData("x = -1.0", "must be a positive finite number, got -1")]
    [InlineData("x = 0", "must be a positive finite number, got 0")]
    [InlineData("x = nan", "must be a positive finite number, got NaN")]
    [InlineData("x = inf", "must be a positive finite number, got Infinity")]
    public void Non_positive_or_non_finite_values_are_rejected_where_positive_ones_are_needed(string line, string message)
    {
        var root = ConfigDocument.Parse(line, "t.toml");
        var e = Assert.Throws<InvalidInputException>(() => root.GetPositive("x", 1));
        Assert.Contains(message, e.Message);
    }

    [Fact]
    public void Written_numbers_read_back_exactly()
    {
        foreach (double v in new[] { 1e-15, 2.5e9, 3.0, 0.1, -7.25e-300 })
        {
            var root = ConfigDocument.Parse($"x = {TomlText.Number(v)}", "t.toml");
            Assert.Equal(v, root.GetDouble("x", double.NaN));
        }
    }
}
