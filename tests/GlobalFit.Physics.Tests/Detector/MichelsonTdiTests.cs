using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class MichelsonTdiTests
{
    /// <summary>Links carrying only laser noise, <c>y_ij = D_ij p_j − p_i</c> (derived: the received laser phase
    /// minus the local one, in our index convention), with static delays that
    /// are whole numbers of samples so the noise sequences can be read exactly.</summary>
    private sealed class LaserNoiseLinks(double[][] laserNoise, int[,] delaySamples, double dtSeconds) : IOneWayLinks
    {
        public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds) =>
            delaySamples[receiver - 1, sender - 1] * dtSeconds;

        public double Measurement(int receiver, int sender, double receptionTimeSeconds)
        {
            int now = checked((int)Math.Round(receptionTimeSeconds / dtSeconds));
            int emitted = now - delaySamples[receiver - 1, sender - 1];
            return laserNoise[sender - 1][emitted] - laserNoise[receiver - 1][now];
        }
    }

    [Theory]
    [InlineData(3, 3, 3, 3, 3, 3)]
    [InlineData(3, 4, 5, 6, 7, 8)]
    public void Michelson_combinations_cancel_laser_noise_exactly_with_static_arms(int d12, int d21, int d23, int d32, int d31, int d13)
    {
        // Source: Tinto & Dhurandhar 2021 (Living Rev. Relativ. 24, 1), first generation; derived: with static arms
        // the delay operators commute and X, Y, Z cancel laser noise
        // exactly, equal arms or not ("TDI 1.5", D_ij and D_ji distinct). Noise is unit-variance Gaussian (fixed
        // seed); what remains is rounding of sums of eight O(1) terms, so 1e-13 absolute. The round trips
        // themselves keep O(1) noise (negative control: the cancellation is TDI's, not the links').
        var random = new Random(20261201);
        const int length = 200;
        var noise = new double[3][];
        for (int s = 0; s < 3; s++)
        {
            noise[s] = new double[length];
            for (int n = 0; n < length; n++)
                noise[s][n] = Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());
        }
        var delays = new int[3, 3];
        (delays[0, 1], delays[1, 0], delays[1, 2], delays[2, 1], delays[2, 0], delays[0, 2]) = (d12, d21, d23, d32, d31, d13);
        const double dt = 0.5;
        var links = new LaserNoiseLinks(noise, delays, dt);

        double worst = 0, roundTripPower = 0;
        for (int n = 40; n < length; n++)
        {
            double t = n * dt;
            var (x, y, z) = MichelsonTdi.Xyz(links, t);
            worst = Math.Max(worst, Math.Max(Math.Abs(x), Math.Max(Math.Abs(y), Math.Abs(z))));
            double roundTrip = links.Measurement(1, 2, t) + links.Measurement(2, 1, t - links.LightTimeSeconds(1, 2, t));
            roundTripPower += roundTrip * roundTrip;
        }
        Assert.True(worst < 1e-13, $"largest residual laser noise {worst:E2}");
        Assert.True(roundTripPower / (length - 40) > 0.5, "round trips should keep the laser noise");
    }

    [Fact]
    public void Corner_must_be_a_spacecraft_label()
    {
        var links = new LaserNoiseLinks([new double[10], new double[10], new double[10]], new int[3, 3], 1.0);
        Assert.Throws<ArgumentOutOfRangeException>(() => MichelsonTdi.Combination(links, 0, 5.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => MichelsonTdi.Combination(links, 4, 5.0));
    }
}
