using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Files;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The blind search: its keys, its workers, its empty result on noise and its determinism.</summary>
public class InspiralBlindSearchTests
{
    private static readonly ExtremeMassRatioInspiralParameters Source = InspiralFitFixture.Source;


    private static InspiralFitPlan BlindPlan(string keys) =>
        InspiralFitPlan.FromConfig(InspiralFitFixture.Section("count = 1\n" + InspiralFitFixture.SearchBoxKeys + "\n" + keys), InspiralFitFixture.Month);

    [Fact]
    public void Count_beyond_the_start_rows_adds_blind_workers_over_the_bins_the_box_reaches()
    {
        var plan = InspiralFitPlan.FromConfig(InspiralFitFixture.Section("count = 3\n" + InspiralFitFixture.SearchBoxKeys, ("a", Source)), InspiralFitFixture.Month);
        var workers = plan.Groups.SelectMany(g => g.Workers).ToList();
        Assert.Equal(["extreme_mass_ratio_inspirals/a", "extreme_mass_ratio_inspirals/search-1", "extreme_mass_ratio_inspirals/search-2"],
            workers.Select(w => w.Id).Order(StringComparer.Ordinal));
        Assert.Equal(2, plan.Settings.BlindWorkers);
        // The blind window holds the source's whole template (its parameters lie inside the box) and the margin.
        var generator = InspiralPlanGenerator();
        var reach = generator.TemplateBins(Source);
        var blind = workers.Single(w => w.Id.EndsWith("search-1", StringComparison.Ordinal)).Bins;
        Assert.True(blind.First <= reach.First - 32 && blind.End >= reach.End + 32, $"blind window {blind} misses the source's {reach}");
    }

    [Theory]
    [InlineData("count = 0", "count")]
    [InlineData("count = 2\nsearch_central_mass_min_msun = 7e5\nsearch_central_mass_max_msun = 6e5", "search_central_mass_min_msun")]
    [InlineData("count = 2\nsearch_eccentricity_max = 0.7", "search_eccentricity_max")]
    [InlineData("count = 2\nsearch_blind_segments = 4", "search_blind_segments")]
    [InlineData("count = 2\ndetection_significance = -1", "detection_significance")]
    [InlineData("count = 2\nsearch_orbital_frequency_max_hz = 1", "search_orbital_frequency_max_hz")]
    public void Bad_search_keys_are_refused_naming_the_key(string keys, string named)
    {
        // count below the one start row; a minimum above its maximum; bounds outside the prior; fewer blind segments than
        // the start search's 8; a negative threshold.
        var section = InspiralFitFixture.Section(keys, ("a", Source));
        var e = Assert.Throws<InvalidInputException>(() => InspiralFitPlan.FromConfig(section, InspiralFitFixture.Month));
        Assert.Contains(named, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_resolved_section_of_a_blind_plan_reads_back_to_the_same_settings()
    {
        var plan = BlindPlan("search_draws = 50\nsearch_chains = 3\ndetection_significance = 9");
        var writer = new ResolvedConfigWriter();
        writer.Section(ExtremeMassRatioInspiralClass.Id);
        plan.WriteResolved(writer);
        var again = InspiralFitPlan.FromConfig(ConfigDocument.Parse(writer.ToString(), "run.toml").GetTable(ExtremeMassRatioInspiralClass.Id)!, InspiralFitFixture.Month);
        Assert.Equal(plan.Settings, again.Settings);
    }

    [Fact]
    public void A_blind_worker_on_noise_alone_reports_no_source_and_stops_searching_after_search_updates()
    {
        var plan = BlindPlan("search_draws = 40\nsearch_chains = 2\nsearch_chain_steps = 20\nsearch_updates = 1");
        var descriptor = plan.Groups[0].Workers[0];
        var residual = InspiralFitFixture.Residual(descriptor.Bins, Source with { DistanceMpc = 1e9 }, 11);
        var worker = (InspiralWorker)plan.CreateWorker(descriptor.Id, 3);
        var first = worker.Update(residual, 5);
        Assert.Equal(0, first.Samples.SampleCount);
        Assert.All(first.Template!.A, v => Assert.Equal(Complex.Zero, v));
        double significance = worker.State.BlindSignificance;
        Assert.True(significance < plan.Settings.DetectionSignificance, $"noise gave significance {significance}");
        // The second update no longer searches: the significance stays that of the first.
        var restored = (InspiralWorker)plan.RestoreWorker(descriptor.Id, worker.SaveState());
        var second = restored.Update(residual, 5);
        Assert.Equal(0, second.Samples.SampleCount);
        Assert.Equal(significance, restored.State.BlindSignificance);
        Assert.Null(restored.State.Sampler);
        // The catalogue of an empty worker has no row.
        var catalogue = plan.CreateCatalogue(new DefaultNoise(InspiralFitFixture.Month.DfHz), 0, 0.5);
        catalogue.Add(first.Samples with { Iteration = 1 });
        catalogue.Add(second.Samples with { Iteration = 2 });
        Assert.Empty(catalogue.Build());
    }

    [Fact]
    public void The_search_is_deterministic_for_the_same_stream_and_stays_in_its_box()
    {
        var box = InspiralFitFixture.SearchBox;
        var generator = InspiralPlanGenerator();
        var window = box.Reach(generator);
        var residual = InspiralFitFixture.Residual(window, Source, 5);
        var settings = new InspiralBlindSearchSettings(Draws: 30, Chains: 2, ChainSteps: 15, Segments: 16);
        InspiralBlindSearchResult Run()
        {
            var random = RandomStream.ForPath(9, 1, 2);
            return InspiralBlindSearch.Run(generator, window, residual.Spectra.A, residual.Spectra.E, residual.InverseA, residual.InverseE, box, settings, 8, ref random);
        }
        var (one, two) = (Run(), Run());
        Assert.Equal(one, two);
        Assert.Equal(8, one.Segments);
        // 30 draws and 2 chains × 15 steps at each of 16 and 8 segments, plus 2 re-scorings at the second stage.
        Assert.Equal(30 + 2 * 15 * 2 + 2, one.Evaluations);
        var p = one.Best;
        Assert.InRange(p.CentralMassMsun, 4e5, 6e5);
        Assert.InRange(p.CompactMassMsun, 8, 12);
        Assert.InRange(p.OrbitalFrequency0Hz, 1.15e-3, 1.25e-3);
        Assert.InRange(p.Eccentricity0, 0.1, 0.2);
    }

    [Fact]
    public void Bad_arguments_of_the_search_are_refused()
    {
        var box = InspiralFitFixture.SearchBox;
        var generator = InspiralPlanGenerator();
        var window = new BinWindow(1, 4);
        var random = RandomStream.ForPath(1, 1, 1);
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => InspiralBlindSearch.Run(generator, window, new Complex[4], new Complex[4],
            new double[4], new double[4], box, new InspiralBlindSearchSettings(Segments: 8), 16, ref random));
        Assert.Equal("lastSegments", e.ParamName);
    }

    private static ExtremeMassRatioInspiralTemplateGenerator InspiralPlanGenerator() => InspiralFitPlan.Generator(InspiralFitFixture.Month);

    private sealed class DefaultNoise(double dfHz) : IPsdSource
    {
        public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
        {
            for (int k = 0; k < psd.Length; k++) psd[k] = InspiralFitFixture.Noise.Psd(channel, (bins.First + k) * dfHz);
        }
    }
}
