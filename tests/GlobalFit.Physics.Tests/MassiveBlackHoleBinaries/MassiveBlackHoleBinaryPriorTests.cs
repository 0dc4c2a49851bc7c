using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class MassiveBlackHoleBinaryPriorTests
{
    private static readonly MassiveBlackHoleBinaryPrior Prior = new(0.0, 1e6);

    [Fact]
    public void Draws_lie_inside_the_support()
    {
        var random = new Random(3);
        for (int i = 0; i < 2000; i++)
            Assert.True(double.IsFinite(Prior.LogPrior(Prior.Draw(random.NextDouble))));
    }

    [Fact]
    public void Log_density_integrates_to_one_over_the_box()
    {
        // Importance sampling with the prior itself would be circular; instead integrate exp(LogPrior) by Monte Carlo with a
        // uniform proposal over a box in the sampled coordinates (log chirp mass, q, spins, t_c, D, sin β, λ, cos ι, ψ, φ),
        // where the Jacobian turns the density into a product of uniform factors up to the D² term. 40000 draws, seed 7:
        // the estimate's relative standard error is ~0.5 % (computed from the sample); we assert 5 standard errors
        // (false-failure rate ~6e-7).
        var random = new Random(7);
        const int draws = 40000;
        double sum = 0, sumSquares = 0;
        // Side lengths: log 𝓜, q, χ1, χ2, t_c, D, sin β, λ, cos ι, ψ, φ.
        double boxVolume = Math.Log(1e3) * 9 * (2 * 0.99) * (2 * 0.99) * 1e6 * (3e5 - 10) * 2 * (2 * Math.PI) * 2 * Math.PI * (2 * Math.PI);
        for (int i = 0; i < draws; i++)
        {
            double logChirp = Math.Log(1e4) + Math.Log(1e3) * random.NextDouble();
            double sinBeta = 2 * random.NextDouble() - 1, cosIota = 2 * random.NextDouble() - 1;
            var p = new MassiveBlackHoleBinaryParameters(Math.Exp(logChirp), 1 + 9 * random.NextDouble(), 0.99 * (2 * random.NextDouble() - 1),
                0.99 * (2 * random.NextDouble() - 1), 1e6 * random.NextDouble(), 10 + (3e5 - 10) * random.NextDouble(), Math.Asin(sinBeta),
                2 * Math.PI * random.NextDouble() * (1 - 1e-16), Math.Acos(cosIota), Math.PI * random.NextDouble(), 2 * Math.PI * random.NextDouble() * (1 - 1e-16));
            // Jacobian from (log 𝓜, sin β, cos ι) back to (𝓜, β, ι): 𝓜 · 1/cos β · 1/sin ι.
            double value = Math.Exp(Prior.LogPrior(p)) * p.ChirpMassMsun / Math.Cos(p.EclipticLatitudeRad) / Math.Sin(p.InclinationRad);
            sum += value;
            sumSquares += value * value;
        }
        double mean = sum / draws;
        double standardError = Math.Sqrt((sumSquares / draws - mean * mean) / draws);
        double estimate = mean * boxVolume;
        double error = standardError * boxVolume;
        Assert.InRange(estimate, 1 - 5 * error, 1 + 5 * error);
    }

    [Fact]
    public void Distance_draws_follow_the_volume_law()
    {
        // P(D < D_max/2) = (D_max³/8 − D_min³)/(D_max³ − D_min³) ≈ 1/8. 20000 draws, seed 11: binomial standard error 0.0023;
        // 5 standard errors (false-failure rate ~6e-7).
        var random = new Random(11);
        int below = 0;
        for (int i = 0; i < 20000; i++)
            if (Prior.Draw(random.NextDouble).DistanceMpc < 1.5e5) below++;
        Assert.Equal(0.125, below / 20000.0, 5 * 0.0023);
    }

    [Fact]
    public void Outside_the_support_the_log_density_is_minus_infinity()
    {
        var p = Prior.FromUnitCube([0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5]);
        Assert.True(double.IsFinite(Prior.LogPrior(p)));
        Assert.Equal(double.NegativeInfinity, Prior.LogPrior(p with { MassRatio = 11 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogPrior(p with { Spin1 = 0.995 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogPrior(p with { CoalescenceTimeS = -1 }));
        Assert.Equal(double.NegativeInfinity, Prior.LogPrior(p with { PolarisationRad = Math.PI }));
    }

    [Fact]
    public void Bad_settings_and_inputs_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new MassiveBlackHoleBinaryPrior(1.0, 1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MassiveBlackHoleBinaryPrior(0, 1, maximumMassRatio: 0.5));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MassiveBlackHoleBinaryPrior(0, 1, maximumSpin: 1.5));
        Assert.Throws<ArgumentOutOfRangeException>(() => Prior.FromUnitCube([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1.5]));
        Assert.Throws<ArgumentException>(() => Prior.FromUnitCube([0.5]));
    }
}
