namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise levels of the noise worker's cold chain: the instrument ASDs of each channel group and the
/// foreground amplitude.</summary>
/// <param name="AccelerationAsdAe">Test-mass acceleration ASD shared by A and E (sample column <c>acceleration_asd_ae_m_s2_rthz</c>), m s⁻² Hz^-1/2.</param>
/// <param name="OmsAsdAe">Optical-metrology ASD shared by A and E (<c>oms_asd_ae_m_rthz</c>), m Hz^-1/2.</param>
/// <param name="AccelerationAsdT">Acceleration ASD of T (<c>acceleration_asd_t_m_s2_rthz</c>), m s⁻² Hz^-1/2; the starting value when T is not fitted.</param>
/// <param name="OmsAsdT">Optical-metrology ASD of T (<c>oms_asd_t_m_rthz</c>), m Hz^-1/2; the starting value when T is not fitted.</param>
/// <param name="ForegroundAmplitude">Multiplier of the published foreground PSD in A and E (<c>foreground_amplitude_relative</c>);
/// 0 when the model has no foreground.</param>
public sealed record NoiseLevels(double AccelerationAsdAe, double OmsAsdAe, double AccelerationAsdT, double OmsAsdT, double ForegroundAmplitude);
