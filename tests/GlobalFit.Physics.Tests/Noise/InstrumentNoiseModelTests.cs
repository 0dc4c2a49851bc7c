using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Tests.CheckValues;
using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

public class InstrumentNoiseModelTests
{
    private static readonly InstrumentNoiseModel Model = InstrumentNoiseModel.Default;

    // The check values print 7 significant figures, so half a unit in the last place is 5e-7 relative; 1e-6 allows
    // for the rounding of the printed value itself.
    private const double SevenFigures = 1e-6;

    /// <summary>Rows of CheckValues/instrument-noise.csv (each names its source).</summary>
    public static IEnumerable<object[]> ComponentRows => CheckValueTable.Load("instrument-noise").Numbers("f_hz", "s_acc_per_hz", "s_oms_per_hz");

    /// <summary>Rows of CheckValues/instrument-noise.csv (each names its source).</summary>
    public static IEnumerable<object[]> TdiRows => CheckValueTable.Load("instrument-noise").Numbers("f_hz", "s_x_per_hz", "s_a_per_hz", "s_t_per_hz");

    // Source: derived: f* = c/(2πL) = 1.908538064e-2 Hz for L = 2.5e9 m, 10 figures.
    [Fact]
    public void Transfer_frequency_of_the_default_arm_is_19_mHz()
    {
        RelativeAssert.Close(1.908538064e-2, InstrumentNoiseSettings.Default.TransferFrequencyHz, 1e-9);
    }

    // Source: CheckValues/instrument-noise.csv (derived from the allocation of Robson, Cornish & Liu 2019).
    [Theory]
    [MemberData(nameof(ComponentRows))]
    public void Component_noises_in_fractional_frequency_match_the_reference(double fHz, double acceleration, double oms)
    {
        RelativeAssert.Close(acceleration, Model.AccelerationPsd(fHz), SevenFigures);
        RelativeAssert.Close(oms, Model.OmsPsd(fHz), SevenFigures);
    }

    // Source: CheckValues/instrument-noise.csv (derived: equal-arm first-generation TDI of the same allocation).
    [Theory]
    [MemberData(nameof(TdiRows))]
    public void First_generation_TDI_noise_matches_the_reference(double fHz, double psdX, double psdA, double psdT)
    {
        RelativeAssert.Close(psdX, Model.PsdX(fHz), SevenFigures);
        RelativeAssert.Close(psdA, Model.PsdA(fHz), SevenFigures);
        RelativeAssert.Close(psdA, Model.PsdE(fHz), SevenFigures);
        RelativeAssert.Close(psdT, Model.PsdT(fHz), SevenFigures);
    }

    // Source: derived: S_XY = -8 sin²x cos x [S_oms + 4 S_acc] at 1 mHz, evaluated independently, 7 figures.
    [Fact]
    public void Cross_spectrum_of_X_and_Y_matches_the_reference()
    {
        RelativeAssert.Close(-2.947811e-43, Model.CsdXY(1e-3), SevenFigures);
    }

    // Identity (derived from the A/E/T coefficients of TdiCombination): S_A = S_X − S_XY and S_T = S_X + 2 S_XY for A, E, T built from
    // X, Y, Z with equal PSDs and equal real CSDs. Exact algebra, so 1e-12 relative.
    [Theory]
    [InlineData(3e-4)]
    [InlineData(5e-3)]
    [InlineData(0.04)]
    public void A_and_T_follow_from_X_and_the_XY_cross_spectrum(double fHz)
    {
        RelativeAssert.Close(Model.PsdX(fHz) - Model.CsdXY(fHz), Model.PsdA(fHz), 1e-12);
        RelativeAssert.Close(Model.PsdX(fHz) + 2.0 * Model.CsdXY(fHz), Model.PsdT(fHz), 1e-9);
    }

    // Source: derived: second-generation S_X = 4 sin²(2x) S_X(first) for equal static arms, evaluated independently
    // at 1 and 10 mHz, 7 figures.
    [Theory]
    [InlineData(1e-3, 2.580670e-44)]
    [InlineData(1e-2, 1.227169e-40)]
    public void Second_generation_X_noise_matches_the_reference(double fHz, double expected)
    {
        var second = new InstrumentNoiseModel(new InstrumentNoiseSettings(generation: TdiGeneration.Second));
        RelativeAssert.Close(expected, second.PsdX(fHz), SevenFigures);
    }

    // Source: derived: S_A/S_X → 1.5 at low frequency (limits of the formulas in InstrumentNoiseModel); the correction is O(x²),
    // about 2e-10 at 1e-6 Hz, so 1e-8.
    [Fact]
    public void A_to_X_ratio_tends_to_one_and_a_half_at_low_frequency()
    {
        Assert.Equal(1.5, Model.PsdA(1e-6) / Model.PsdX(1e-6), 1e-8);
    }

    // Derived low-frequency limit S_T → 8x⁴ S_oms + 8x⁶ S_acc, next terms O(x²) relative: 1e-6 at x ≈ 5e-4.
    [Fact]
    public void T_noise_follows_its_low_frequency_limit()
    {
        double f = 1e-5, x = f / InstrumentNoiseSettings.Default.TransferFrequencyHz;
        double expected = 8 * Math.Pow(x, 4) * Model.OmsPsd(f) + 8 * Math.Pow(x, 6) * Model.AccelerationPsd(f);
        RelativeAssert.Close(expected, Model.PsdT(f), 1e-6);
    }

    [Fact]
    public void Span_filler_writes_the_scalar_values_bin_by_bin()
    {
        var psd = new double[64];
        Model.FillPsd(AetChannel.T, 1e-4, 7.5e-4, psd);
        for (int k = 0; k < psd.Length; k++)
            Assert.Equal(Model.PsdT(1e-4 + k * 7.5e-4), psd[k]);
    }

    [Fact]
    public void Zero_frequency_gives_an_infinite_PSD_that_inner_products_skip()
    {
        var psd = new double[3];
        Model.FillPsd(AetChannel.A, 0.0, 1e-3, psd);
        Assert.Equal(double.PositiveInfinity, psd[0]);
        Assert.True(double.IsFinite(psd[1]));
    }

    [Theory]
    [InlineData(0.0, 15e-12, 2.5e9, "AccelerationAsd")]
    [InlineData(-3e-15, 15e-12, 2.5e9, "AccelerationAsd")]
    [InlineData(3e-15, double.NaN, 2.5e9, "OmsAsd")]
    [InlineData(3e-15, 15e-12, double.PositiveInfinity, "ArmLengthM")]
    public void Invalid_settings_are_rejected_naming_the_field(double acceleration, double oms, double arm, string field)
    {
        var error = Assert.Throws<ArgumentException>(() => new InstrumentNoiseSettings(acceleration, oms, arm));
        Assert.Equal(field, error.ParamName);
        Assert.Contains(field, error.Message);
    }

    [Fact]
    public void Negative_frequencies_and_bad_grids_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Model.PsdA(-1e-3));
        Assert.Throws<ArgumentException>(() => Model.FillPsd(AetChannel.A, 1e-3, 0.0, new double[4]));
        Assert.Throws<ArgumentException>(() => Model.FillPsd(AetChannel.A, -1e-3, 1e-4, new double[4]));
    }
}
