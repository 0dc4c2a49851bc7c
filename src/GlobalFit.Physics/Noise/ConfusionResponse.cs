namespace GlobalFit.Physics.Noise;

/// <summary>Which sky-averaged response maps the foreground's strain PSD into the A and E channels.</summary>
/// <remarks>Derived (see <see cref="AetNoiseModel"/>): <c>S_A^conf = S_c · 32x² sin²x · R_A(x)</c>.</remarks>
public enum ConfusionResponse
{
    /// <summary>The exact static equal-arm sky average <see cref="SkyAveragedResponse.ChannelAE"/>.</summary>
    ExactSkyAverage,

    /// <summary>Robson et al.'s approximation <see cref="SkyAveragedResponse.RobsonChannelAEApproximation"/>
    /// (up to 13 % off near f*); kept to reproduce results computed with it.</summary>
    RobsonApproximation,
}
