using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Series;

public class MatchTests
{
    private static Complex[] Chirp(int n, double timeShift, double phase, double df)
    {
        var values = new Complex[n];
        for (int k = 0; k < n; k++)
        {
            double f = (100 + k) * df;
            double envelope = Math.Exp(-Math.Pow((k - n / 2.0) / (n / 6.0), 2));
            values[k] = envelope * Complex.FromPolarCoordinates(1, -2 * Math.PI * f * timeShift + phase + 3e-4 * k * k);
        }
        return values;
    }

    [Fact]
    public void Match_of_a_time_shifted_and_phase_rotated_copy_is_one()
    {
        const double df = 1e-5;
        var w = new[] { Enumerable.Repeat(1.0, 256).ToArray() };
        var a = new[] { Chirp(256, 0, 0, df) };
        // A shift of 1234.5 s is not on the τ grid (grid step 1/(4·256·df) ≈ 97.7 s), so this also
        // exercises the parabolic refinement: a pure grid maximum would fall short by up to ~1e-3 here.
        var b = new[] { Chirp(256, 1234.5, 1.3, df) };
        double overlap = Match.Overlap(a, b, w, df);
        double match = Match.MaximisedOverTimeAndPhase(a, b, w, df);
        Assert.True(overlap < 0.5, $"overlap {overlap} should be poor before maximisation");
        Assert.True(match > 0.9999, $"match {match}");
    }

    [Fact]
    public void Match_is_below_one_for_different_signals_and_zero_for_a_zero_signal()
    {
        const double df = 1e-5;
        var w = new[] { Enumerable.Repeat(1.0, 128).ToArray() };
        var a = new[] { Chirp(128, 0, 0, df) };
        var b = new[] { Chirp(128, 0, 0, df).Select((v, k) => v * Complex.FromPolarCoordinates(1, 2e-3 * k * k)).ToArray() };
        double match = Match.MaximisedOverTimeAndPhase(a, b, w, df);
        Assert.InRange(match, 0.0, 0.99);
        Assert.Equal(0.0, Match.MaximisedOverTimeAndPhase(a, [new Complex[128]], w, df));
    }

    [Fact]
    public void Overlap_of_identical_signals_is_one()
    {
        var w = new[] { Enumerable.Repeat(2.0, 64).ToArray(), Enumerable.Repeat(0.5, 64).ToArray() };
        var a = new[] { Chirp(64, 10, 0.2, 1e-4), Chirp(64, 20, 0.1, 1e-4) };
        Assert.Equal(1.0, Match.Overlap(a, a, w, 1e-4), 1e-12);
    }

    [Fact]
    public void Mismatched_channel_counts_are_rejected()
    {
        var w = new[] { new double[4] };
        Assert.Throws<ArgumentException>(() => Match.Overlap([new Complex[4]], [new Complex[4], new Complex[4]], w, 1));
    }
}
