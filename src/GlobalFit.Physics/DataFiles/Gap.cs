namespace GlobalFit.Physics.DataFiles;

/// <summary>An interval with no usable data, <c>[StartSeconds, EndSeconds)</c>, on the observation's time axis.</summary>
/// <param name="StartSeconds">First instant of the gap (inclusive), s.</param>
/// <param name="EndSeconds">First instant after the gap (exclusive), s.</param>
/// <remarks>A sample taken at time <c>t</c> lies in the gap when <c>StartSeconds ≤ t &lt; EndSeconds</c>.</remarks>
public readonly record struct Gap(double StartSeconds, double EndSeconds)
{
    /// <summary>Length of the gap.</summary>
    /// <value>s.</value>
    public double DurationSeconds => EndSeconds - StartSeconds;

    /// <summary>True when the instant <paramref name="timeSeconds"/> falls inside the gap.</summary>
    public bool Contains(double timeSeconds) => timeSeconds >= StartSeconds && timeSeconds < EndSeconds;
}
