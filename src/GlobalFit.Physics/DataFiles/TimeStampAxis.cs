using GlobalFit.Physics.Files;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Turns an explicit list of sample times into the start time and cadence of a uniform axis,
/// rejecting stamps that are not uniform.</summary>
/// <remarks>The axis is pinned at the first and last stamps, <c>t0 = t[0]</c> and <c>Δt = (t[N−1] − t[0])/(N−1)</c>;
/// every stamp must then lie within <see cref="RelativeTolerance"/>·Δt of <c>t0 + nΔt</c>, plus four units in the
/// last place of the largest stamp for the rounding of the stored float64 values. A cumulative drift is caught
/// as well as a single jump, because each stamp is compared with the fitted grid rather than with its neighbour.</remarks>
internal static class TimeStampAxis
{
    /// <summary>Largest allowed departure from the uniform grid, as a fraction of the cadence.</summary>
    public const double RelativeTolerance = 1e-6;

    /// <summary>Fits the axis, or throws naming the first offending stamp.</summary>
    /// <param name="times">Sample times, s.</param>
    /// <param name="source">The file, for the error.</param>
    /// <param name="path">The dataset, for the error.</param>
    public static (double T0Seconds, double DtSeconds) Fit(ReadOnlySpan<double> times, string source, string path)
    {
        for (int n = 0; n < times.Length; n++)
            if (!double.IsFinite(times[n]))
                throw new InvalidInputException(source, $"{path} sample {n}", $"time stamp is {times[n]}");
        if (times.Length < 2)
            throw new InvalidInputException(source, path, $"holds {times.Length} time stamp(s); at least two are needed to define a cadence");

        double t0 = times[0];
        double last = times[^1];
        double dt = (last - t0) / (times.Length - 1);
        if (!(dt > 0) || !double.IsFinite(dt))
            throw new InvalidInputException(source, path, $"time stamps do not increase (first {t0} s, last {last} s)");

        double tolerance = Tolerance(dt, Math.Max(Math.Abs(t0), Math.Abs(last)));
        for (int n = 1; n < times.Length - 1; n++)
        {
            double expected = t0 + n * dt;
            if (!(Math.Abs(times[n] - expected) <= tolerance))
                throw new InvalidInputException(source, $"{path} sample {n}",
                    $"time stamp {times[n]} s is off the uniform grid t0 + n·dt = {expected} s (t0 {t0} s, dt {dt} s) by more than {tolerance:G3} s: the time axis is not uniform");
        }
        return (t0, dt);
    }

    /// <summary>Allowed departure of a time from its uniform-grid value.</summary>
    public static double Tolerance(double dtSeconds, double largestTimeSeconds) =>
        RelativeTolerance * dtSeconds + 4 * (Math.BitIncrement(largestTimeSeconds) - largestTimeSeconds);
}
