using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

/// <summary>Relative-tolerance comparison for values spanning many decades.</summary>
internal static class RelativeAssert
{
    public static void Close(double expected, double actual, double relativeTolerance)
    {
        double error = Math.Abs(actual / expected - 1.0);
        Assert.True(error <= relativeTolerance,
            $"expected {expected:R}, got {actual:R}: relative error {error:E3} exceeds {relativeTolerance:E1}");
    }
}
