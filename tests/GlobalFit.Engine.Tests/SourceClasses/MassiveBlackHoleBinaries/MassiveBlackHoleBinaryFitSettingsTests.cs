using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The <c>[massive_black_hole_binaries]</c> section of a run configuration: defaults, the plan it gives, and the
/// errors that name the key.</summary>
public class MassiveBlackHoleBinaryFitSettingsTests
{
    // A month at 5 s: Nyquist 0.1 Hz.
    private static readonly FitDataShape Shape = new("data.h5", 518_400, 5.0, 100.0);

    private static IFitSourceClassPlan Plan(string body) =>
        new MassiveBlackHoleBinaryClass().PlanFit(ConfigDocument.Parse("[massive_black_hole_binaries]\n" + body, "fit.toml").GetTable("massive_black_hole_binaries")!, Shape);

    private static InvalidInputException Refused(string body) => Assert.Throws<InvalidInputException>(() => Plan(body));

    [Fact]
    public void An_empty_section_plans_one_binary_over_the_record_with_the_documented_defaults()
    {
        var plan = Plan("");
        var group = Assert.Single(plan.Groups);
        Assert.Equal("massive_black_hole_binaries.01", group.Name);
        var worker = Assert.Single(group.Workers);
        Assert.Equal("massive_black_hole_binaries/01", worker.Id);
        Assert.Equal(WorkerRole.Sources, worker.Role);
        Assert.False(worker.IncludesT);
        // 1e-4 Hz and 0.05 Hz on the grid of Δf = 1/(518 400 × 5 s): bins 260 … 129 600.
        Assert.Equal(260, worker.Bins.First);
        Assert.Equal(129_600, worker.Bins.First + worker.Bins.Count - 1);
        var writer = new ResolvedConfigWriter();
        plan.WriteResolved(writer);
        string text = writer.ToString();
        Assert.Contains("tc_min_s = 100", text, StringComparison.Ordinal);
        Assert.Contains("tc_max_s = 2592100", text, StringComparison.Ordinal);
        Assert.Contains("steps_per_update = 400", text, StringComparison.Ordinal);
        foreach (string key in MassiveBlackHoleBinaryFitSettings.Keys) Assert.Contains(key + " = ", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Each_binary_gets_its_own_group_because_all_share_the_window()
    {
        var plan = Plan("count = 3\n");
        Assert.Equal(["massive_black_hole_binaries.01", "massive_black_hole_binaries.02", "massive_black_hole_binaries.03"], plan.Groups.Select(g => g.Name));
        Assert.Equal(["massive_black_hole_binaries/01", "massive_black_hole_binaries/02", "massive_black_hole_binaries/03"], plan.Groups.Select(g => Assert.Single(g.Workers).Id));
        Assert.Throws<ArgumentException>(() => plan.CreateWorker("massive_black_hole_binaries/04", 1));
        Assert.Throws<ArgumentException>(() => plan.CreateWorker("massive_black_hole_binaries/1", 1));
    }

    [Theory]
    [InlineData("f_max_hz = 0.2\n", "f_max_hz", "Nyquist")]
    [InlineData("f_min_hz = 0.03\nf_max_hz = 0.02\n", "f_max_hz", "f_min_hz")]
    [InlineData("chirp_mass_min_msun = 1e6\nchirp_mass_max_msun = 1e5\n", "chirp_mass_max_msun", "chirp_mass_min_msun")]
    [InlineData("mass_ratio_max = 30\n", "mass_ratio_max", "")]
    [InlineData("distance_max_mpc = 5\n", "distance_max_mpc", "distance_min_mpc")]
    [InlineData("tc_min_s = 0\ntc_max_s = 1e7\n", "tc_max_s", "record")]
    [InlineData("count = 0\n", "count", "")]
    [InlineData("temperatures = 0\n", "temperatures", "")]
    [InlineData("spin_max = 1.5\n", "spin_max", "")]
    [InlineData("stepz = 4\n", "stepz", "")]
    public void A_bad_key_is_refused_naming_the_key(string body, string key, string mention)
    {
        var error = Refused(body);
        Assert.Contains("massive_black_hole_binaries." + key, error.Message, StringComparison.Ordinal);
        Assert.Contains(mention, error.Message, StringComparison.Ordinal);
    }
}
