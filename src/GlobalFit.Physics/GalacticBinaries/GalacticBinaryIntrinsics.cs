namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The intrinsic parameters of a galactic binary, those the F-statistic does not maximise over:
/// frequency, drift and sky position.</summary>
/// <remarks>Not validated (see <see cref="GalacticBinaryParameters"/>). The default value is all zeros.</remarks>
/// <param name="FrequencyHz">f0.</param>
/// <param name="FrequencyDerivativeHzS">ḟ.</param>
/// <param name="EclipticLatitudeRad">β.</param>
/// <param name="EclipticLongitudeRad">λ.</param>
public readonly record struct GalacticBinaryIntrinsics(
    double FrequencyHz,
    double FrequencyDerivativeHzS,
    double EclipticLatitudeRad,
    double EclipticLongitudeRad)
{
    /// <summary>The intrinsic part of a full parameter set.</summary>
    public static GalacticBinaryIntrinsics Of(in GalacticBinaryParameters source) =>
        new(source.FrequencyHz, source.FrequencyDerivativeHzS, source.EclipticLatitudeRad, source.EclipticLongitudeRad);

    /// <summary>A full parameter set with these intrinsics and the given extrinsic ones.</summary>
    public GalacticBinaryParameters With(in GalacticBinaryExtrinsics extrinsics) =>
        new(FrequencyHz, FrequencyDerivativeHzS, extrinsics.Amplitude, EclipticLatitudeRad, EclipticLongitudeRad,
            Math.Acos(Math.Clamp(extrinsics.CosInclination, -1.0, 1.0)), extrinsics.PolarisationRad, extrinsics.InitialPhaseRad);
}

/// <summary>The extrinsic parameters of a galactic binary, those the F-statistic maximises over analytically.</summary>
/// <remarks>The default value is all zeros (a zero-amplitude source).</remarks>
/// <param name="Amplitude">A.</param>
/// <param name="CosInclination">cos ι in [−1, 1].</param>
/// <param name="PolarisationRad">ψ.</param>
/// <param name="InitialPhaseRad">φ0.</param>
public readonly record struct GalacticBinaryExtrinsics(double Amplitude, double CosInclination, double PolarisationRad, double InitialPhaseRad);
