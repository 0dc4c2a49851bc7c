namespace GlobalFit.Physics.Detector;

/// <summary>Positions of the three spacecraft (labelled 1, 2, 3) and the light travel times between them.</summary>
/// <remarks>Positions are heliocentric ecliptic Cartesian coordinates in metres; time is seconds since the
/// orbit epoch, the same time axis as the data. Implementations are immutable and thread-safe.</remarks>
public interface IConstellationOrbits
{
    /// <summary>Nominal arm length L (the mean one for flexing orbits).</summary>
    /// <value>m.</value>
    double ArmLengthM { get; }

    /// <summary>Orbital period of the constellation about the Sun.</summary>
    /// <value>s.</value>
    double PeriodSeconds { get; }

    /// <summary>Position of spacecraft <paramref name="spacecraft"/> (1, 2 or 3) at time <paramref name="timeSeconds"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The spacecraft label is not 1, 2 or 3.</exception>
    Vector3D Position(int spacecraft, double timeSeconds);

    /// <summary>Light travel time <c>L_ij/c</c> of the beam received at spacecraft <paramref name="receiver"/> at
    /// time <paramref name="receptionTimeSeconds"/> and sent by spacecraft <paramref name="sender"/>.</summary>
    /// <value>s.</value>
    /// <exception cref="ArgumentOutOfRangeException">A label is not 1, 2 or 3, or receiver equals sender.</exception>
    double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds);
}
