using System.Diagnostics;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

public class MassiveBlackHoleBinaryFitWorkerTests(ITestOutputHelper output)
{
    private static MassiveBlackHoleBinaryFitWorker NewWorker(MassiveBlackHoleBinaryFitSettings settings, ulong seed = 5) =>
        new("massive_black_hole_binaries/01", 0, settings, MassiveBlackHoleBinaryTestData.Shape, new RigidOrbits(),
            new MassiveBlackHoleBinaryWorkerState(seed, 0, null, double.NaN, 0, null));

    private static MassiveBlackHoleBinaryData ToData(WorkerResidual residual) => new(residual.Bins, residual.DfHz,
        [residual.Spectra.A, residual.Spectra.E, new Complex[residual.Bins.Count]],
        [residual.InverseA, residual.InverseE, new double[residual.Bins.Count]]);

    [Fact]
    public void Search_finds_the_chirp_mass_and_merger_time_of_a_binary_in_noise()
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings();
        var truth = MassiveBlackHoleBinaryTestData.Binary(5e4);
        var residual = MassiveBlackHoleBinaryTestData.Residual(settings, truth, 21);
        var clock = Stopwatch.StartNew();
        var found = MassiveBlackHoleBinarySearch.Run(new RigidOrbits(), ToData(residual), settings.Prior(), MassiveBlackHoleBinaryTestData.Shape.DurationS, settings.SearchChirpMassStep, 0);
        output.WriteLine($"SNR {MassiveBlackHoleBinaryTestData.Snr(residual, truth):F1}; search: {found.GridPoints} templates in {clock.Elapsed.TotalSeconds:F2} s, " +
            $"max ln L {found.Statistic:F1}, chirp mass {found.Seed.ChirpMassMsun:G5}, q {found.Seed.MassRatio}, tc {found.Seed.CoalescenceTimeS:F0} s (truth {truth.CoalescenceTimeS:F0}), distance {found.Seed.DistanceMpc:G4}");
        // The seed has one amplitude per channel instead of a sky position and one common spin: after the ascent its chirp
        // mass lies within 1 % (measured 0.3 %) and its statistic within 2 % of the likelihood at the truth (measured 47 043
        // against SNR²/2 = 47 930). Its t_c is the arrival at the detector's sky-agnostic best fit, within 1 au/c ≈ 500 s of
        // the arrival at the Sun.
        Assert.InRange(found.Seed.ChirpMassMsun / truth.ChirpMassMsun, 0.99, 1.01);
        Assert.InRange(found.Seed.CoalescenceTimeS - truth.CoalescenceTimeS, -600, 600);
        Assert.InRange(found.Statistic, 0.98 * 47_000, 50_000);
        Assert.Equal(61 * 3, found.GridPoints);
    }

    [Fact]
    public void Search_of_noise_alone_returns_a_weak_statistic()
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings() with { SearchChirpMassStep = 0.2 };
        var residual = MassiveBlackHoleBinaryTestData.Residual(settings, null, 22);
        var found = MassiveBlackHoleBinarySearch.Run(new RigidOrbits(), ToData(residual), settings.Prior(), MassiveBlackHoleBinaryTestData.Shape.DurationS, settings.SearchChirpMassStep, 0);
        output.WriteLine($"noise only: max ln L {found.Statistic:F1} over {found.GridPoints} templates");
        // Each template's statistic is half a chi-squared with 4 degrees of freedom per time shift; the maximum over ~1e6
        // nearly independent shifts and templates lies near ln(1e6) + ln ln(1e6) ≈ 17 (derived: tail of the chi-squared
        // with 4 degrees of freedom), far below the thousands of a loud binary.
        Assert.InRange(found.Statistic, 5, 40);
    }

    [Fact]
    public void Worker_recovers_a_binary_from_its_residual()
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings(steps: 2000) with { Temperatures = 6 };
        var truth = MassiveBlackHoleBinaryTestData.Binary(1e5);
        var residual = MassiveBlackHoleBinaryTestData.Residual(settings, truth, 21);
        var worker = NewWorker(settings);
        var clock = Stopwatch.StartNew();
        WorkerUpdate? last = null;
        for (int update = 0; update < 10; update++)
        {
            last = worker.Update(residual, settings.StepsPerUpdate);
            if (update == 0) output.WriteLine($"search statistic {worker.State.SearchStatistic:F1}");
            var p = worker.Current!.Value;
            output.WriteLine($"update {update + 1}: {clock.Elapsed.TotalSeconds:F1} s, ln L {last.Statistics.LogLikelihood:F1}, acceptance {last.Statistics.Acceptance:F2}, " +
                $"Mc {p.ChirpMassMsun:G6} q {p.MassRatio:F2} tc {p.CoalescenceTimeS:F0} D {p.DistanceMpc:G4} beta {p.EclipticLatitudeRad:F2} lambda {p.EclipticLongitudeRad:F2} recentres {worker.State.Recentres}");
        }
        var full = new MassiveBlackHoleBinaryLikelihood(new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), residual.Bins.Count, 0), ToData(residual));
        double atTruth = full.LogLikelihoodRatio(truth);
        output.WriteLine($"SNR {MassiveBlackHoleBinaryTestData.Snr(residual, truth):F1}; full ln L at the truth {atTruth:F1}, at the final state {full.LogLikelihoodRatio(worker.Current!.Value):F1}");
        var found = worker.Current!.Value;
        // SNR ≈ 155: the chirp mass is measured to ~1e-3 (its Fisher-matrix width), so 1 % is loose. t_c is the arrival
        // time at the Sun: over a month the sky is spread over several modes of nearly equal likelihood, and the Sun-to-detector
        // delay differs between them by up to 1 au/c ≈ 500 s (measured: 406 s in a mode with ln L 3 below the truth's), so
        // t_c is held to 1000 s, the largest difference of that delay over the sky.
        Assert.InRange(found.ChirpMassMsun / truth.ChirpMassMsun, 0.99, 1.01);
        Assert.InRange(found.CoalescenceTimeS - truth.CoalescenceTimeS, -1000, 1000);
        // The worker's ln L is the heterodyned one against its residual; within ~30 of the truth's (the mean of a posterior
        // sample lies d/2 ≈ 5.5 below the peak, which lies about as far above the truth) unless it is in a secondary mode.
        Assert.InRange(last!.Statistics.LogLikelihood, atTruth - 400, atTruth + 30);
        Assert.Equal(200, last.Samples.SampleCount);
        Assert.Equal(MassiveBlackHoleBinaryParameters.ColumnNames, last.Samples.ParameterNames);
    }

    [Fact]
    public void A_restored_worker_continues_bit_for_bit()
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings(steps: 50) with { SearchChirpMassStep = 0.3 };
        var residual = MassiveBlackHoleBinaryTestData.Residual(settings, MassiveBlackHoleBinaryTestData.Binary(1e5), 23);
        var straight = NewWorker(settings);
        straight.Update(residual, 50);
        var expected = straight.Update(residual, 50);

        var first = NewWorker(settings);
        first.Update(residual, 50);
        var restored = MassiveBlackHoleBinaryFitWorker.Restore(first.Id, 0, settings, MassiveBlackHoleBinaryTestData.Shape, new RigidOrbits(), first.SaveState());
        Assert.Equal(first.CurrentTemplate()!.A, restored.CurrentTemplate()!.A);
        var actual = restored.Update(residual, 50);

        Assert.Equal(straight.SaveState(), restored.SaveState());
        Assert.Equal(expected.Samples.Values, actual.Samples.Values);
        Assert.Equal(expected.Template!.A, actual.Template!.A);
        Assert.Equal(expected.Template.E, actual.Template.E);
    }

    [Fact]
    public void A_residual_of_other_bins_or_channels_is_refused_and_handovers_are_refused()
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings();
        var worker = NewWorker(settings);
        var residual = MassiveBlackHoleBinaryTestData.Residual(settings, null, 24);
        var shifted = residual with { Spectra = residual.Spectra with { Bins = new Physics.Series.BinWindow(residual.Bins.First + 1, residual.Bins.Count) } };
        Assert.Contains("needs", Assert.Throws<ArgumentException>(() => worker.Update(shifted, 10)).Message, StringComparison.Ordinal);
        var withT = residual with { Spectra = residual.Spectra with { T = new Complex[residual.Bins.Count] }, InverseT = new double[residual.Bins.Count] };
        Assert.Contains("include_t", Assert.Throws<ArgumentException>(() => worker.Update(withT, 10)).Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => worker.Update(residual, 0));
        Assert.Empty(worker.TakeHandovers());
        Assert.Throws<InvalidOperationException>(() => worker.Accept([new Handover(worker.Id, [1])]));
        Assert.All(worker.CurrentTemplate()!.A, v => Assert.Equal(Complex.Zero, v));
    }
}
