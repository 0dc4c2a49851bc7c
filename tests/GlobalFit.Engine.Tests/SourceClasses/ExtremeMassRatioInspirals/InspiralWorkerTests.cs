using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using Xunit.Abstractions;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

public class InspiralWorkerTests(ITestOutputHelper output)
{
    private static readonly P Source = InspiralFitFixture.Source;

    [Fact]
    public void A_restored_worker_continues_bit_for_bit()
    {
        var plan = InspiralFitFixture.Plan("search_evaluations = 20\ntemperatures = 2", ("a", Source));
        var descriptor = plan.Groups[0].Workers[0];
        var residual = InspiralFitFixture.Residual(descriptor.Bins, Source, 5);
        var straight = plan.CreateWorker(descriptor.Id, 42);
        straight.Update(residual, 5);
        var expected = straight.Update(residual, 5);

        var first = plan.CreateWorker(descriptor.Id, 42);
        first.Update(residual, 5);
        var restored = plan.RestoreWorker(descriptor.Id, first.SaveState());
        var actual = restored.Update(residual, 5);

        Assert.Equal(expected.Samples.Values, actual.Samples.Values);
        Assert.Equal(expected.Samples.LogLikelihoods, actual.Samples.LogLikelihoods);
        Assert.Equal(expected.Template!.A, actual.Template!.A);
        Assert.Equal(straight.SaveState(), restored.SaveState());
        // A restored worker serves the template of its saved state before its next update.
        Assert.Equal(first.CurrentTemplate()!.A, plan.RestoreWorker(descriptor.Id, first.SaveState()).CurrentTemplate()!.A);
    }

    [Fact]
    public void An_update_returns_the_template_over_its_window_and_one_sample_per_step_in_the_parameter_columns()
    {
        var plan = InspiralFitFixture.Plan("search_evaluations = 0\ntemperatures = 2", ("a", Source));
        var descriptor = plan.Groups[0].Workers[0];
        var worker = plan.CreateWorker(descriptor.Id, 1);
        Assert.All(worker.CurrentTemplate()!.A, v => Assert.Equal(0.0, v.Magnitude));
        var update = worker.Update(InspiralFitFixture.Residual(descriptor.Bins, Source, null), 7);
        Assert.Equal(descriptor.Bins, update.Template!.Bins);
        Assert.Null(update.Template.T);
        Assert.Equal(7, update.Samples.SampleCount);
        Assert.Equal(P.ColumnNames, update.Samples.ParameterNames);
        Assert.Equal(7 * 14, update.Samples.Values.Length);
        Assert.Equal(ExtremeMassRatioInspiralClass.Id, update.Samples.ClassId);
        Assert.Equal(1, update.Statistics.SourceCount);
        Assert.Empty(worker.TakeHandovers());
        Assert.Throws<ArgumentException>(() => worker.Update(InspiralFitFixture.Residual(new(descriptor.Bins.First + 1, descriptor.Bins.Count), Source, null), 1));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(150)]
    public void The_sampler_brings_a_start_row_some_widths_off_to_the_likelihood_peak(int searchEvaluations)
    {
        // The demo's start: about one conditional width off in ν0 (σ ≈ 8e-10 Hz at SNR 43, the scale the worker fixes)
        // and in ln M (σ ≈ 5e-6), two in Φ0 (σ ≈ 0.01 rad), as the median of an earlier, shorter analysis could be.
        var start = Source with { OrbitalFrequency0Hz = Source.OrbitalFrequency0Hz + 1e-9, CentralMassMsun = Source.CentralMassMsun * (1 + 5e-6), Phi0Rad = 1.02 };
        var plan = InspiralFitFixture.Plan($"search_evaluations = {searchEvaluations}\ntemperatures = 3", ("a", start));
        var descriptor = plan.Groups[0].Workers[0];
        var residual = InspiralFitFixture.Residual(descriptor.Bins, Source, 3);
        var worker = (InspiralWorker)plan.CreateWorker(descriptor.Id, 9);
        var model = new ExtremeMassRatioInspiralLikelihood(InspiralFitPlan.Generator(InspiralFitFixture.Month), descriptor.Bins,
            residual.Spectra.A, residual.Spectra.E, residual.InverseA, residual.InverseE);
        double atStart = model.LogLikelihoodRatio(start), atTruth = model.LogLikelihoodRatio(Source);
        double reached = 0;
        for (int u = 0; u < 3; u++) reached = worker.Update(residual, 60).Statistics.LogLikelihood;
        output.WriteLine($"ln L at the start {atStart:F1}, at the truth {atTruth:F1}, after the search and 180 steps {reached:F1}; search statistic {worker.State.SearchStatistic:F1}");
        // A posterior sample lies below the peak by ≈ χ²₁₄/2 (mean 7, 99.9 % below 18.2); 25 covers that with room for
        // the noise moving the peak above the truth's value.
        Assert.True(reached > atTruth - 25, $"ln L {reached:F1} is not within 25 of the truth's {atTruth:F1}");
    }

    [Fact]
    public void The_start_search_brings_a_start_row_far_off_in_phase_and_frequency_to_the_likelihood_peak()
    {
        // 12 conditional widths off in ν0, 4 in ln M and 60 in Φ0 (0.6 rad): a start from which the sampler alone
        // does not reach the peak within hundreds of steps (measured: ln L 576 of 884 after 360 steps without the
        // Levenberg–Marquardt ending of the search).
        var start = Source with { OrbitalFrequency0Hz = Source.OrbitalFrequency0Hz + 1e-8, CentralMassMsun = Source.CentralMassMsun * (1 + 2e-5), Phi0Rad = 1.6 };
        var plan = InspiralFitFixture.Plan("search_evaluations = 300\ntemperatures = 2", ("a", start));
        var descriptor = plan.Groups[0].Workers[0];
        var residual = InspiralFitFixture.Residual(descriptor.Bins, Source, 3);
        var worker = (InspiralWorker)plan.CreateWorker(descriptor.Id, 9);
        var likelihood = new ExtremeMassRatioInspiralLikelihood(InspiralFitPlan.Generator(InspiralFitFixture.Month), descriptor.Bins,
            residual.Spectra.A, residual.Spectra.E, residual.InverseA, residual.InverseE);
        double atStart = likelihood.LogLikelihoodRatio(start), atTruth = likelihood.LogLikelihoodRatio(Source);
        double reached = worker.Update(residual, 20).Statistics.LogLikelihood;
        output.WriteLine($"ln L at the start {atStart:F1}, at the truth {atTruth:F1}, after the search and 20 steps {reached:F1}");
        // Within 25 of the truth's value, as above.
        Assert.True(reached > atTruth - 25, $"ln L {reached:F1} is not within 25 of the truth's {atTruth:F1}");
    }
}
