using System.Text.RegularExpressions;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>The examples users copy from (configs/ and README) must stay valid.</summary>
public class DocumentedExamplesTests
{
    public static TheoryData<string> ScenarioFiles()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(RepositoryFiles.PathOf("configs"), "scenario-*.toml").Order())
            data.Add(Path.GetFileName(file));
        return data;
    }

    [Theory]
    [MemberData(nameof(ScenarioFiles))]
    public void Every_shipped_scenario_is_valid(string file)
    {
        var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Load(RepositoryFiles.PathOf(Path.Combine("configs", file))));
        Assert.True(scenario.Observation.SampleCount > 0);
    }

    [Fact]
    public void The_scenario_shown_in_the_readme_is_valid_and_matches_the_shipped_example()
    {
        string readme = File.ReadAllText(RepositoryFiles.PathOf("README.md"));
        var block = Regex.Match(readme, "```toml\n(?<body>name = .*?)```", RegexOptions.Singleline);
        Assert.True(block.Success, "README has no TOML example");
        var fromReadme = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(block.Groups["body"].Value, "README.md"));
        var shipped = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Load(RepositoryFiles.PathOf("configs/scenario-noise-month.toml")));
        Assert.Equal(shipped.ToToml(), fromReadme.ToToml());
    }

    [Fact]
    public void The_source_section_shown_in_the_readme_is_valid()
    {
        string readme = File.ReadAllText(RepositoryFiles.PathOf("README.md"));
        var block = Regex.Match(readme, "```toml\n(?<body>\\[galactic_binaries.*?)```", RegexOptions.Singleline);
        Assert.True(block.Success, "README has no galactic-binary example");
        var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse("[observation]\nduration_days = 2\n" + block.Groups["body"].Value, "README.md"));
        Assert.Single(scenario.Sources);
    }

    [Fact]
    public void The_inspiral_fit_section_shown_in_the_readme_is_valid_and_shows_every_key()
    {
        string readme = File.ReadAllText(RepositoryFiles.PathOf("README.md"));
        var block = Regex.Match(readme, "```toml\n(?<body>\\[extreme_mass_ratio_inspirals\\].*?)```", RegexOptions.Singleline);
        Assert.True(block.Success, "README has no inspiral fit example");
        var root = ConfigDocument.Parse(block.Groups["body"].Value, "README.md");
        var module = SourceClassRegistry.Default.Find("extreme_mass_ratio_inspirals")!;
        var plan = module.PlanFit(root.GetTable("extreme_mass_ratio_inspirals")!, new FitDataShape("month.h5", 259_200, 10, 0));
        Assert.Single(plan.Groups.SelectMany(g => g.Workers));
        var writer = new ResolvedConfigWriter();
        plan.WriteResolved(writer);
        foreach (var line in writer.ToString().Split('\n').Where(l => l.Contains(" = ", StringComparison.Ordinal)))
            Assert.Contains(line[..line.IndexOf(" = ", StringComparison.Ordinal)] + " = ", block.Groups["body"].Value, StringComparison.Ordinal);
    }

    public static TheoryData<string> FitConfigFiles()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(RepositoryFiles.PathOf("configs"), "fit-*.toml").Order())
            data.Add(Path.GetFileName(file));
        return data;
    }

    // The data files the examples name are made by the commands in their comments, not shipped; each is checked
    // against the shape of that data: a year at 5 s for the multi-day example, a month at 5 s for the others.
    [Theory]
    [MemberData(nameof(FitConfigFiles))]
    public void Every_shipped_run_configuration_is_valid_for_the_data_it_names(string file)
    {
        string path = RepositoryFiles.PathOf(Path.Combine("configs", file));
        var shape = file.Contains("year", StringComparison.Ordinal)
            ? new FitDataShape("year", 6_311_520, 5.0, 0.0)
            : new FitDataShape("month", 518_400, 5.0, 0.0);
        var plan = RunPlan.FromConfig(ConfigDocument.Load(path), Path.GetDirectoryName(path)!, shape);
        Assert.True(plan.Settings.Iterations > plan.Settings.BurnIn);
    }

    [Fact]
    public void The_run_configuration_shown_in_the_readme_is_valid()
    {
        string readme = File.ReadAllText(RepositoryFiles.PathOf("README.md"));
        var block = Regex.Match(readme, "```toml\n(?<body>data = .*?)```", RegexOptions.Singleline);
        Assert.True(block.Success, "README has no run-configuration example");
        var plan = RunPlan.FromConfig(ConfigDocument.Parse(block.Groups["body"].Value, "README.md"), "/", new FitDataShape("month", 518_400, 5.0, 0.0));
        Assert.Equal(3, plan.Schedule.Stages.Length);
    }

    [Fact]
    public void Readme_test_command_is_what_ci_runs()
    {
        string readme = File.ReadAllText(RepositoryFiles.PathOf("README.md"));
        string ci = File.ReadAllText(RepositoryFiles.PathOf(".ci/run"));
        Assert.Contains("dotnet test globalfit.sln -c Release --filter \"Category!=Long\"", readme);
        Assert.Contains("dotnet test globalfit.sln -c Release --no-build --filter \"Category!=Long\"", ci);
    }
}
