using System.Globalization;

namespace GlobalFit.Physics.Noise;

/// <summary>
/// Which Galactic-confusion fit to use (observation time) and how strongly (amplitude multiplier).
/// Validated on creation and immutable.
/// </summary>
/// <remarks>Only the durations tabulated by Robson, Cornish &amp; Liu 2019 (CQG 36, 105011,
/// arXiv:1803.01944, table accompanying Eq. 14) are accepted: 0.5, 1, 2 and 4 years. The fit parameters
/// do not vary smoothly with T_obs (only the knee frequency falls monotonically), so we do not interpolate
/// between them.</remarks>
public sealed record GalacticConfusionSettings
{
    /// <summary>The observation times (years) for which the published fit exists.</summary>
    public static IReadOnlyList<double> SupportedObservationYears { get; } = [0.5, 1.0, 2.0, 4.0];

    /// <summary>Creates validated settings.</summary>
    /// <param name="observationYears">Observation time: one of <see cref="SupportedObservationYears"/>.</param>
    /// <param name="amplitudeScale">Multiplier of the published fit: 1 = as published, 0 = off; finite and ≥ 0.</param>
    /// <exception cref="ArgumentException">The observation time is not tabulated (the message lists the allowed
    /// ones) or the multiplier is negative or not finite; <see cref="ArgumentException.ParamName"/> names the field.</exception>
    public GalacticConfusionSettings(double observationYears, double amplitudeScale = 1.0)
    {
        if (!SupportedObservationYears.Contains(observationYears))
        {
            string allowed = string.Join(", ", SupportedObservationYears.Select(y => y.ToString(CultureInfo.InvariantCulture)));
            throw new ArgumentException(
                $"{nameof(ObservationYears)} must be one of {allowed} (the durations the Robson et al. 2019 fit tabulates; " +
                $"it is not interpolated), got {observationYears.ToString(CultureInfo.InvariantCulture)}",
                nameof(ObservationYears));
        }
        if (!(amplitudeScale >= 0) || !double.IsFinite(amplitudeScale))
            throw new ArgumentException($"{nameof(AmplitudeScale)} must be finite and non-negative, got {amplitudeScale}", nameof(AmplitudeScale));
        ObservationYears = observationYears;
        AmplitudeScale = amplitudeScale;
    }

    /// <summary>Observation time selecting the fit.</summary>
    /// <value>years (0.5, 1, 2 or 4).</value>
    public double ObservationYears { get; }

    /// <summary>Multiplier of the fitted PSD (1 = published level, 0 = no foreground).</summary>
    public double AmplitudeScale { get; }
}
