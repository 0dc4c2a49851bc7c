using GlobalFit.Engine.SourceClasses.GalacticBinaries;

namespace GlobalFit.Engine.Tests.SourceClasses.GalacticBinaries;

public class GalacticBinaryBandSliceTests
{
    private static readonly GalacticBinaryBandSettings Settings = GalacticBinaryBandWorkerTests.SmallSettings with { StepsPerUpdate = 30 };

    [Fact]
    public void A_slice_ends_in_the_same_states_on_one_and_on_two_threads()
    {
        var one = new GalacticBinaryBandSlice(Settings, 30, 5.0, 4, 10, 77);
        var two = new GalacticBinaryBandSlice(Settings, 30, 5.0, 4, 10, 77);
        var costOne = one.Run(2, 30, 1);
        var costTwo = two.Run(2, 30, 2);
        Assert.Equal(one.StateDigest(), two.StateDigest());
        Assert.Equal((2, 4, 40), (costOne.Iterations, costOne.Windows, one.Sources.Length));
        // Kernel time is part of compute, and one window-update costs compute / (iterations × windows).
        Assert.InRange(costTwo.Efficiency, 0.0, 1.0);
        Assert.Equal(costOne.ComputeMs / 1000 / 8, costOne.CoreSecondsPerWindowUpdate, 1e-12);
    }

    [Fact]
    public void A_slice_needs_two_windows()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new GalacticBinaryBandSlice(Settings, 30, 5.0, 1, 10, 77));
        Assert.Equal("windows", error.ParamName);
    }
}
