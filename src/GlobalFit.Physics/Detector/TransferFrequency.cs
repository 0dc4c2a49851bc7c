using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Detector;

/// <summary>The transfer frequency <c>f* = c/(2πL)</c> of an arm and the dimensionless frequency <c>x = f/f*</c>.</summary>
/// <remarks>Definition as in Robson, Cornish &amp; Liu 2019 (arXiv:1803.01944). Above f* a gravitational wave changes appreciably during one
/// light time along an arm, and the long-wavelength response no longer holds. For L = 2.5e9 m, f* = 19.085 mHz
/// (Robson, Cornish &amp; Liu 2019, arXiv:1803.01944, quote 19.09 mHz).</remarks>
public static class TransferFrequency
{
    /// <summary>f* for an arm of length <paramref name="armLengthM"/>.</summary>
    /// <value>Hz.</value>
    /// <exception cref="ArgumentOutOfRangeException">The arm length is not positive and finite.</exception>
    public static double Hz(double armLengthM)
    {
        if (!(armLengthM > 0) || !double.IsFinite(armLengthM))
            throw new ArgumentOutOfRangeException(nameof(armLengthM), armLengthM, "arm length must be positive and finite");
        return PhysicalConstants.SpeedOfLightMS / (2.0 * Math.PI * armLengthM);
    }

    /// <summary><c>x = f/f* = 2πfL/c</c>, the phase a wave of frequency <paramref name="frequencyHz"/> gains over one light time.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The arm length is not positive and finite.</exception>
    public static double Ratio(double frequencyHz, double armLengthM) => frequencyHz / Hz(armLengthM);
}
