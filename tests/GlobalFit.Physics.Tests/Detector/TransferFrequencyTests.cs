using GlobalFit.Physics.Detector;
using Xunit;

namespace GlobalFit.Physics.Tests.Detector;

public sealed class TransferFrequencyTests
{
    [Fact]
    public void Transfer_frequency_of_a_two_and_a_half_gigametre_arm_matches_the_check_value()
    {
        // Source: derived: f* = c/(2 pi L) = 1.908538064e-02 Hz for L = 2.5e9 m (Robson et al. 2019,
        // arXiv:1803.01944, quote 19.09 mHz). 10 figures, so 1e-9 relative.
        Assert.Equal(1.908538064e-2, TransferFrequency.Hz(2.5e9), 1e-9 * 1.908538064e-2);
        Assert.Equal(1.0, TransferFrequency.Ratio(1.908538064e-2, 2.5e9), 1e-9);
    }

    [Fact]
    public void Arm_length_must_be_positive()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => TransferFrequency.Hz(0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => TransferFrequency.Ratio(1e-3, double.NaN));
    }
}
