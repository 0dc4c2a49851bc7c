using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Detector;

/// <summary>The brute-force TDI response to a plane wave: the yardstick for every fast response.</summary>
/// <remarks>
/// <para>Each sample of X, Y, Z is built by <see cref="MichelsonTdi"/> from the exact link formula
/// (<see cref="PlaneWaveLinks"/>) evaluated at the delayed times themselves, with the orbit's light times. Nothing is
/// interpolated, expanded in frequency or held fixed over the record, so the result is exact within the model
/// (plane wave, straight photon paths, the given orbits) up to rounding.</para>
/// <para>Implementation note: 24 link evaluations per sample and no allocation besides the six output arrays.
/// Measured (BenchmarkDotNet, one day at 5 s cadence, shared 2-core machine): 0.17 s with <see cref="RigidOrbits"/>,
/// about ten times more with <see cref="EccentricOrbits"/>, whose light times are iterated and whose positions
/// need a Kepler solve. A year at 15 s cadence takes about 30 s with the rigid orbits.</para>
/// </remarks>
public static class SlowReferenceResponse
{
    /// <summary>Computes X, Y, Z and A, E, T of <paramref name="strain"/> arriving from <paramref name="sky"/>.</summary>
    /// <param name="strain">h+ and h× at the Sun as functions of retarded time.</param>
    /// <param name="sky">Source direction.</param>
    /// <param name="polarisationRad">Polarisation angle ψ.</param>
    /// <param name="orbits">The constellation.</param>
    /// <param name="t0Seconds">Time of the first sample.</param>
    /// <param name="dtSeconds">Cadence.</param>
    /// <param name="count">Number of samples.</param>
    /// <exception cref="ArgumentOutOfRangeException">The start time is not finite, the cadence not positive and finite,
    /// the count not positive, or ψ not finite.</exception>
    public static TdiResponse Compute(
        IPlaneWaveStrain strain,
        SkyPosition sky,
        double polarisationRad,
        IConstellationOrbits orbits,
        double t0Seconds,
        double dtSeconds,
        int count)
    {
        ArgumentNullException.ThrowIfNull(strain);
        ArgumentNullException.ThrowIfNull(orbits);
        if (!double.IsFinite(t0Seconds))
            throw new ArgumentOutOfRangeException(nameof(t0Seconds), t0Seconds, "start time must be finite");
        if (!(dtSeconds > 0) || !double.IsFinite(dtSeconds))
            throw new ArgumentOutOfRangeException(nameof(dtSeconds), dtSeconds, "cadence must be positive and finite");
        if (count <= 0)
            throw new ArgumentOutOfRangeException(nameof(count), count, "sample count must be positive");

        var links = new PlaneWaveLinks(strain, new PolarisationBasis(sky, polarisationRad), orbits);
        var x = new double[count];
        var y = new double[count];
        var z = new double[count];
        for (int n = 0; n < count; n++)
            (x[n], y[n], z[n]) = MichelsonTdi.Xyz(links, t0Seconds + n * dtSeconds);
        return new TdiResponse(
            new TimeSeries(t0Seconds, dtSeconds, x),
            new TimeSeries(t0Seconds, dtSeconds, y),
            new TimeSeries(t0Seconds, dtSeconds, z));
    }

    /// <summary>Computes the response to a monochromatic binary, taking sky position and polarisation from it.</summary>
    /// <exception cref="ArgumentOutOfRangeException">As for the general overload.</exception>
    public static TdiResponse Compute(MonochromaticBinaryStrain binary, IConstellationOrbits orbits, double t0Seconds, double dtSeconds, int count)
    {
        ArgumentNullException.ThrowIfNull(binary);
        return Compute(binary, binary.Sky, binary.PolarisationRad, orbits, t0Seconds, dtSeconds, count);
    }
}
