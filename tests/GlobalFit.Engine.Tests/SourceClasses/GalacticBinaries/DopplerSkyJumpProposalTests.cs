using System.Numerics;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public sealed class DopplerSkyJumpProposalTests
{
    private const int FirstBin = 7776;
    private const int Bins = 96;

    // Power-weighted mean frequency of a noise-free template over the window, in bins.
    private static double CentroidBins(GalacticBinaryTemplateGenerator generator, in GalacticBinaryParameters source)
    {
        var window = new BinWindow(FirstBin, Bins);
        var a = new Complex[Bins];
        var e = new Complex[Bins];
        generator.AddResponse(source, window, a, e, Span<Complex>.Empty);
        double weight = 0, sum = 0;
        for (int k = 0; k < Bins; k++)
        {
            double power = a[k].Magnitude * a[k].Magnitude + e[k].Magnitude * e[k].Magnitude;
            weight += power;
            sum += power * (FirstBin + k);
        }
        return sum / weight;
    }

    // The f0 map keeps f0(1 + n̂·v̄/c), the mean observed frequency, so for sources whose Doppler shift dominates (near the
    // ecliptic, along or against the detector's motion, |k| ≈ 1e-4) the template's spectral centroid stays close when the
    // sky jumps to the antipode, while without it the centroid moves by 2 f0 k (1.5 bins here). Tolerance 0.2 bin: the
    // antenna pattern changes with the sky and moves the power centroid of the sidebands too (measured 0.16 bin for the
    // second source; where |k| is small that effect dominates, e.g. 0.5 bin at β = 0.6, λ = 0.4, so such sources are not
    // a test of the Doppler map). The uncompensated move must shift it more than 0.5 bin.
    [Theory]
    [InlineData(0.1, 1.7)]
    [InlineData(-0.3, 4.8)]
    public void Compensating_f0_keeps_the_mean_observed_frequency_of_a_one_month_template(double beta, double lambda)
    {
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 5.0);
        var geometry = DopplerSkyJumpProposal.Geometry(generator.Orbits, generator.StartSeconds, generator.DurationSeconds);
        var proposal = new DopplerSkyJumpProposal(BirthForTests(), geometry, 1.0, 0, 1, new ChainTemperature(0, 1.0));
        double f0 = (FirstBin + 48.3) / generator.DurationSeconds;
        var source = new GalacticBinaryParameters(f0, 0, 1e-22, beta, lambda, 1.0, 0.4, 1.1);
        double k = proposal.DopplerFactor(Math.Sin(beta), lambda);
        double kAntipode = proposal.DopplerFactor(-Math.Sin(beta), lambda + Math.PI);
        var antipode = source with { EclipticLatitudeRad = -beta, EclipticLongitudeRad = lambda + Math.PI };
        double before = CentroidBins(generator, source);
        double compensated = CentroidBins(generator, antipode with { FrequencyHz = f0 * (1 + k) / (1 + kAntipode) });
        double plain = CentroidBins(generator, antipode);
        Assert.True(Math.Abs(compensated - before) < 0.2, $"compensated {compensated - before:F3}, plain {plain - before:F3}, k {k:E3} {kAntipode:E3}");
        Assert.True(Math.Abs(plain - before) > 0.5, $"uncompensated shift {plain - before:F3} bins");
    }

    // k = n̂·v̄/c over a month of the 1-au orbit: at most 2π au/(sidereal year · c) = 9.94e-5 (derived from the orbit's
    // speed) times sinc(θ/2) = 0.9989 for the θ = 0.516 rad the centre turns in 30 days (derived: the mean of a rotating
    // vector). Tolerance 1e-7 (the epicycles of the spacecraft average out in the centroid; rounding far below).
    [Fact]
    public void The_doppler_factor_peaks_at_the_mean_orbital_speed_over_c()
    {
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 5.0);
        var geometry = DopplerSkyJumpProposal.Geometry(generator.Orbits, generator.StartSeconds, generator.DurationSeconds);
        var proposal = new DopplerSkyJumpProposal(BirthForTests(), geometry, 1.0, 0, 1, new ChainTemperature(0, 1.0));
        double largest = 0;
        for (int j = 0; j < 3600; j++) largest = Math.Max(largest, proposal.DopplerFactor(0, j * 2 * Math.PI / 3600));
        double speed = 2 * Math.PI * 1.495978707e11 / (365.256363004 * 86400 * 299792458.0);
        double theta = 2 * Math.PI * 30 / 365.256363004;
        Assert.Equal(speed * Math.Sin(theta / 2) / (theta / 2), largest, 1e-7);
        Assert.Equal(0, proposal.DopplerFactor(1, 0.3), 1e-7);
    }

    // A sky jump whose f0 shift leaves the prior's f0 range is refused (−∞), never clipped, which would break reversibility;
    // only moves that keep k (the "same sky" refresh, the ecliptic reflection, whose mirror keeps n̂·v̄ for v̄ in the
    // ecliptic) keep f0 and may pass. 400 draws: each kernel is chosen about 40 times or more.
    [Fact]
    public void A_jump_that_moves_f0_outside_the_prior_is_refused()
    {
        var (data, birth, _, scale, truth) = SetupWithBirth();
        var geometry = DopplerSkyJumpProposal.Geometry(data.Generator.Orbits, data.Generator.StartSeconds, data.Generator.DurationSeconds);
        var proposal = new DopplerSkyJumpProposal(birth, geometry, scale, truth.FrequencyHz, truth.FrequencyHz * (1 + 1e-12), new ChainTemperature(0, 1.0));
        var current = new double[GalacticBinarySourceVector.Dimension];
        GalacticBinarySourceVector.FromParameters(truth, scale, current);
        var candidate = new double[current.Length];
        var random = RandomStream.FromSeed(11);
        int refused = 0, passed = 0;
        for (int i = 0; i < 400; i++)
        {
            double logRatio = proposal.Propose(current, candidate, ref random);
            if (double.IsNegativeInfinity(logRatio)) { refused++; continue; }
            passed++;
            Assert.Equal(current[GalacticBinarySourceVector.Frequency], candidate[GalacticBinarySourceVector.Frequency]);
            Assert.Equal(proposal.DopplerFactor(current[GalacticBinarySourceVector.SinLatitude], current[GalacticBinarySourceVector.Longitude]),
                proposal.DopplerFactor(candidate[GalacticBinarySourceVector.SinLatitude], candidate[GalacticBinarySourceVector.Longitude]), 1e-9);
        }
        Assert.True(refused > 100 && passed > 50, $"refused {refused}, passed {passed}");
    }

    // The "same sky" refresh is an independence draw from the amplitude conditional at fixed intrinsics, so its log ratio is
    // ln p_ext(x) − ln p_ext(x′) exactly (the f0 Jacobian is 1); checked on the passing draws of a run at the truth.
    [Fact]
    public void The_amplitude_refresh_ratio_is_the_conditional_density_at_the_current_point_over_that_at_the_candidate()
    {
        var (data, birth, _, scale, truth) = SetupWithBirth();
        var geometry = DopplerSkyJumpProposal.Geometry(data.Generator.Orbits, data.Generator.StartSeconds, data.Generator.DurationSeconds);
        var proposal = new DopplerSkyJumpProposal(birth, geometry, scale, truth.FrequencyHz, truth.FrequencyHz * (1 + 1e-12), new ChainTemperature(1, 0.5));
        var current = new double[GalacticBinarySourceVector.Dimension];
        GalacticBinarySourceVector.FromParameters(truth, scale, current);
        var candidate = new double[current.Length];
        var random = RandomStream.FromSeed(12);
        int checkedDraws = 0;
        for (int i = 0; i < 200; i++)
        {
            double logRatio = proposal.Propose(current, candidate, ref random);
            if (double.IsNegativeInfinity(logRatio)) continue;
            double expected = birth.LogExtrinsicDensity(current, 0.5) - birth.LogExtrinsicDensity(candidate, 0.5);
            // Round-off of the amplitude map's inversion: 1e-8 absolute on log densities of order 10.
            Assert.Equal(expected, logRatio, 1e-8);
            checkedDraws++;
        }
        Assert.True(checkedDraws > 20, $"only {checkedDraws} refreshes");
    }

    private static GalacticBinaryBirthDensity BirthForTests() => SetupWithBirth().Birth;

    // One SNR-30 binary in noise over a month (the set-up of GalacticBinaryBirthDensityTests).
    private static (BandTestData Data, GalacticBinaryBirthDensity Birth, GalacticBinaryBand Band, double Scale, GalacticBinaryParameters Truth) SetupWithBirth()
    {
        var window = new BinWindow(FirstBin, Bins);
        var shape = new GalacticBinaryParameters((FirstBin + 40.4) / (30 * 86400.0), 0, 1e-22, 0.4, 2.5, 0.7, 0.9, 1.9);
        var truth = new BandTestData(30, window, [], 1, noise: false).WithSnr(shape, 30);
        var data = new BandTestData(30, window, [truth], 4);
        var band = data.Residual(window);
        double scale = GalacticBinaryBandModel.AverageSnrPerUnitAmplitude(data.Generator, band, truth.FrequencyHz);
        var grid = FStatisticGrid.ForWindow(new BinWindow(FirstBin + 20, 40), data.DfHz, 1, -1e-16, 1e-15, 1, 4, 8);
        var map = new FStatisticCellDensity(FStatisticMap.Compute(new FStatistic(data.Generator), band, grid), 0.1);
        return (data, new GalacticBinaryBirthDensity(new FStatistic(data.Generator), band, map, scale), band, scale, truth);
    }
}
