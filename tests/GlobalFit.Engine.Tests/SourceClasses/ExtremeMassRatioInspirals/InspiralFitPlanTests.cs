using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

public class InspiralFitPlanTests
{
    private static readonly P Source = InspiralFitFixture.Source;

    [Fact]
    public void Each_start_row_gets_one_worker_over_its_template_bins_plus_the_margin()
    {
        var plan = InspiralFitFixture.Plan("margin_bins = 10", ("a", Source));
        var worker = Assert.Single(Assert.Single(plan.Groups).Workers);
        var reach = InspiralFitPlan.Generator(InspiralFitFixture.Month).TemplateBins(Source);
        Assert.Equal(new BinWindow(reach.First - 10, reach.Count + 20), worker.Bins);
        Assert.Equal("extreme_mass_ratio_inspirals/a", worker.Id);
        Assert.Equal(ExtremeMassRatioInspiralClass.Id, plan.Groups[0].Name);
        Assert.Equal(WorkerRole.Sources, worker.Role);
        Assert.False(worker.IncludesT);
    }

    [Fact]
    public void Inspirals_whose_windows_overlap_go_into_different_groups()
    {
        var plan = InspiralFitFixture.Plan("", ("a", Source), ("b", Source with { DistanceMpc = 300 }));
        Assert.Equal(["extreme_mass_ratio_inspirals.1", "extreme_mass_ratio_inspirals.2"], plan.Groups.Select(g => g.Name));
        Assert.All(plan.Groups, g => Assert.Single(g.Workers));
    }

    [Fact]
    public void The_resolved_section_reads_back_to_the_same_settings()
    {
        var plan = InspiralFitFixture.Plan("temperatures = 3\nsearch_evaluations = 7", ("a", Source));
        var writer = new ResolvedConfigWriter();
        writer.Section(ExtremeMassRatioInspiralClass.Id);
        plan.WriteResolved(writer);
        var again = InspiralFitPlan.FromConfig(ConfigDocument.Parse(writer.ToString(), "run.toml").GetTable(ExtremeMassRatioInspiralClass.Id)!, InspiralFitFixture.Month);
        Assert.Equal(plan.Settings with { Starts = [] }, again.Settings with { Starts = [] });
        var (written, read) = (plan.Settings.Starts.Single(), again.Settings.Starts.Single());
        Assert.Equal(written.Id, read.Id);
        // Numbers are written round-trip (TomlText.Number); 1e-14 relative allows for a parser that rounds in its last digit.
        Assert.All(written.Start.ToArray().Zip(read.Start.ToArray()), p => Assert.Equal(p.First, p.Second, Math.Abs(p.First) * 1e-14));
    }

    [Theory]
    [InlineData("temperatures = 0", "temperatures")]
    [InlineData("search_segments = 0", "search_segments")]
    [InlineData("steps_per_updates = 5", "steps_per_updates")]
    [InlineData("margin_bins = -1", "margin_bins")]
    public void Bad_keys_are_refused_naming_the_key(string keys, string named)
    {
        var e = Assert.Throws<InvalidInputException>(() => InspiralFitFixture.Plan(keys, ("a", Source)));
        Assert.Contains(named, e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(P.CentralMassColumn, 2e7)]
    [InlineData(P.CompactMassColumn, 500)]
    [InlineData(P.EccentricityColumn, 0.7)]
    [InlineData(P.DistanceColumn, 50)]
    [InlineData(P.OrbitalFrequencyColumn, 9e-3)]
    [InlineData(P.CentralSpinColumn, 0.995)]
    public void A_start_row_outside_the_prior_is_refused_naming_the_column(string column, double value)
    {
        string row = InspiralFitFixture.StartRow("a", Source).Replace(
            column + " = " + Source.ToArray()[P.ColumnNames.IndexOf(column)].ToString("R", System.Globalization.CultureInfo.InvariantCulture),
            column + " = " + value.ToString("R", System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal);
        var section = ConfigDocument.Parse("[extreme_mass_ratio_inspirals]\n" + row, "fit.toml").GetTable("extreme_mass_ratio_inspirals")!;
        var e = Assert.Throws<InvalidInputException>(() => InspiralFitPlan.FromConfig(section, InspiralFitFixture.Month));
        Assert.Contains(column, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_start_row_missing_a_column_or_repeating_an_id_is_refused()
    {
        string row = string.Join('\n', InspiralFitFixture.StartRow("a", Source).Split('\n').Where(l => !l.StartsWith(P.Gamma0Column, StringComparison.Ordinal)));
        var missing = Assert.Throws<InvalidInputException>(() => InspiralFitPlan.FromConfig(
            ConfigDocument.Parse("[extreme_mass_ratio_inspirals]\n" + row, "fit.toml").GetTable("extreme_mass_ratio_inspirals")!, InspiralFitFixture.Month));
        Assert.Contains(P.Gamma0Column, missing.Message, StringComparison.Ordinal);
        var twice = Assert.Throws<InvalidInputException>(() => InspiralFitFixture.Plan("", ("a", Source), ("a", Source)));
        Assert.Contains("used twice", twice.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_worker_id_not_in_the_plan_is_refused()
    {
        var plan = InspiralFitFixture.Plan("", ("a", Source));
        Assert.Throws<ArgumentException>(() => plan.CreateWorker("extreme_mass_ratio_inspirals/b", 1));
    }
}
