using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

public class MassiveBlackHoleBinaryClassTests(ITestOutputHelper output)
{
    [Fact]
    public void The_class_is_registered_first_with_its_columns_simulation_and_demo_part()
    {
        // Broadband classes first: the default schedule follows this order (see SourceClassRegistry.Default).
        Assert.Equal([MassiveBlackHoleBinaryClass.Id, "extreme_mass_ratio_inspirals", "galactic_binaries", "noise"], SourceClassRegistry.Default.Ids);
        var module = SourceClassRegistry.Default.Find(MassiveBlackHoleBinaryClass.Id)!;
        Assert.Equal(MassiveBlackHoleBinaryParameters.ColumnNames, module.ParameterColumns);
        Assert.NotNull(module.Demo);
        Assert.NotNull(module.Simulation);
    }

    // Figures only: speed is not asserted (a shared machine), only that each is a positive finite rate named with its unit.
    [Fact]
    public void The_bench_suite_reports_template_and_heterodyned_likelihood_rates()
    {
        var figures = Assert.Single(new MassiveBlackHoleBinaryClass().BenchSuites).Run().ToList();
        Assert.Equal(["massive_black_hole_binary_templates_per_s", "massive_black_hole_binary_heterodyned_likelihoods_per_s",
            "massive_black_hole_binary_heterodyned_ae_likelihoods_per_s"], figures.Select(f => f.Name));
        foreach (var f in figures)
        {
            output.WriteLine($"{f.Name} = {f.Value:G4}  ({f.Description})");
            Assert.True(f.Value > 0 && double.IsFinite(f.Value), f.Name);
        }
    }
}
