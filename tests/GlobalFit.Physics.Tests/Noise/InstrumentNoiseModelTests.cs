using GlobalFit.Physics.Noise;
using Xunit;

namespace GlobalFit.Physics.Tests.Noise;

public class InstrumentNoiseModelTests
{
    private static readonly InstrumentNoiseModel Model = InstrumentNoiseModel.Default;

    // The CSV prints 7 significant figures, so half a unit in the last place is 5e-7 relative; 1e-6 allows
    // for the rounding of the printed value itself.
    private const double SevenFigures = 1e-6;

    // Source: check-values.csv "transfer frequency" (CMP, f* = c/(2πL), L = 2.5e9 m): 1.908538064e-2 Hz, 10 figures.
    [Fact]
    public void Transfer_frequency_of_the_default_arm_is_19_mHz()
    {
        RelativeAssert.Close(1.908538064e-2, InstrumentNoiseSettings.Default.TransferFrequencyHz, 1e-9);
    }

    // Source: check-values.csv rows "S_acc fractional frequency" and "S_oms fractional frequency" (CMP, sheet §D.1).
    [Theory]
    [InlineData(1e-4, 4.312115e-39, 1.581334e-40)]
    [InlineData(1e-3, 2.943102e-42, 1.680157e-42)]
    [InlineData(1e-2, 8.743224e-44, 9.899088e-42)]
    [InlineData(1e-1, 6.193072e-42, 9.883276e-40)]
    public void Component_noises_in_fractional_frequency_match_the_reference(double fHz, double acceleration, double oms)
    {
        RelativeAssert.Close(acceleration, Model.AccelerationPsd(fHz), SevenFigures);
        RelativeAssert.Close(oms, Model.OmsPsd(fHz), SevenFigures);
    }

    // Source: check-values.csv rows "S_X", "S_A = S_E", "S_T TDI 1.5 equal arms" (CMP, sheet §D.2, formula DER).
    [Theory]
    [InlineData(1e-4, 7.645787e-42, 1.146868e-41, 9.541799e-49)]
    [InlineData(1e-3, 5.896638e-43, 8.844449e-43, 1.016770e-46)]
    [InlineData(1e-2, 4.087145e-41, 5.864149e-41, 5.331360e-42)]
    [InlineData(1e-1, 1.199567e-38, 1.504120e-38, 5.904598e-39)]
    public void First_generation_TDI_noise_matches_the_reference(double fHz, double psdX, double psdA, double psdT)
    {
        RelativeAssert.Close(psdX, Model.PsdX(fHz), SevenFigures);
        RelativeAssert.Close(psdA, Model.PsdA(fHz), SevenFigures);
        RelativeAssert.Close(psdA, Model.PsdE(fHz), SevenFigures);
        RelativeAssert.Close(psdT, Model.PsdT(fHz), SevenFigures);
    }

    // Source: check-values.csv row "CSD S_XY TDI 1.5 equal arms" at 1 mHz (CMP, sheet §D.2).
    [Fact]
    public void Cross_spectrum_of_X_and_Y_matches_the_reference()
    {
        RelativeAssert.Close(-2.947811e-43, Model.CsdXY(1e-3), SevenFigures);
    }

    // Identity (sheet §C.3 and §D.2, DER): S_A = S_X − S_XY and S_T = S_X + 2 S_XY for A, E, T built from
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

    // Source: check-values.csv "S_X TDI 2.0 equal arms = 4 sin²(2x) S_X1.5" at 1 and 10 mHz (CMP, sheet §C.2).
    [Theory]
    [InlineData(1e-3, 2.580670e-44)]
    [InlineData(1e-2, 1.227169e-40)]
    public void Second_generation_X_noise_matches_the_reference(double fHz, double expected)
    {
        var second = new InstrumentNoiseModel(new InstrumentNoiseSettings(generation: TdiGeneration.Second));
        RelativeAssert.Close(expected, second.PsdX(fHz), SevenFigures);
    }

    // Source: check-values.csv "S_A/S_X low-frequency limit" = 1.5 (DER, sheet §D.2); the correction is O(x²),
    // about 2e-10 at 1e-6 Hz, so 1e-8.
    [Fact]
    public void A_to_X_ratio_tends_to_one_and_a_half_at_low_frequency()
    {
        Assert.Equal(1.5, Model.PsdA(1e-6) / Model.PsdX(1e-6), 1e-8);
    }

    // Sheet §D.2 low-frequency limit S_T → 8x⁴ S_oms + 8x⁶ S_acc, next terms O(x²) relative: 1e-6 at x ≈ 5e-4.
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
