namespace GlobalFit.Physics.Detector;

/// <summary>First-generation ("1.5") Michelson TDI combinations X, Y, Z from the six one-way links.</summary>
/// <remarks>
/// <para>The first-generation Michelson combination (for the theory see Tinto &amp; Dhurandhar 2021, Living Rev.
/// Relativ. 24, 1; the formula here is written in our index convention, whose overall sign papers choose differently):
/// with round trips <c>r_ij = y_ij + D_ij y_ji</c> measured at
/// spacecraft i, <c>X = (1 − D_13 D_31) r_12 − (1 − D_12 D_21) r_13</c> ("arm 12 minus arm 13"), and Y, Z by the
/// cyclic relabelling 1 → 2 → 3 → 1. D_ij and D_ji are kept distinct and are read from the links at the time each
/// operator acts, so a nested delay is <c>D_13 D_31 z(t) = z(t − τ_13(t) − τ_31(t − τ_13(t)))</c>.
/// Laser noise cancels exactly when the arms are static (the delay operators then commute), equal or not (derived:
/// substitute <c>y_ij = D_ij p_j − p_i</c> and expand).</para>
/// <para>Sampling the links at arbitrary times is the caller's business; with analytic link signals
/// (<see cref="PlaneWaveLinks"/>) the delays are exact.</para>
/// </remarks>
public static class MichelsonTdi
{
    /// <summary>The Michelson combination centred on spacecraft <paramref name="corner"/> at time <paramref name="timeSeconds"/>:
    /// X for corner 1, Y for 2, Z for 3.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The corner is not 1, 2 or 3.</exception>
    public static double Combination<TLinks>(TLinks links, int corner, double timeSeconds)
        where TLinks : IOneWayLinks
    {
        int j = SpacecraftLabel.Next(corner);
        int k = SpacecraftLabel.Next(j);
        double roundTripViaJ = RoundTripDelaySeconds(links, corner, j, timeSeconds);
        double roundTripViaK = RoundTripDelaySeconds(links, corner, k, timeSeconds);
        return RoundTrip(links, corner, j, timeSeconds) - RoundTrip(links, corner, j, timeSeconds - roundTripViaK)
             - RoundTrip(links, corner, k, timeSeconds) + RoundTrip(links, corner, k, timeSeconds - roundTripViaJ);
    }

    /// <summary>X, Y and Z at one time.</summary>
    public static (double X, double Y, double Z) Xyz<TLinks>(TLinks links, double timeSeconds)
        where TLinks : IOneWayLinks =>
        (Combination(links, 1, timeSeconds), Combination(links, 2, timeSeconds), Combination(links, 3, timeSeconds));

    /// <summary><c>r_ij(t) = y_ij(t) + y_ji(t − τ_ij(t))</c>: the beam from i to j and back, measured at i.</summary>
    private static double RoundTrip<TLinks>(TLinks links, int home, int far, double timeSeconds)
        where TLinks : IOneWayLinks =>
        links.Measurement(home, far, timeSeconds)
        + links.Measurement(far, home, timeSeconds - links.LightTimeSeconds(home, far, timeSeconds));

    /// <summary>Delay of <c>D_ij D_ji</c> at time t: <c>τ_ij(t) + τ_ji(t − τ_ij(t))</c>.</summary>
    private static double RoundTripDelaySeconds<TLinks>(TLinks links, int home, int far, double timeSeconds)
        where TLinks : IOneWayLinks
    {
        double inbound = links.LightTimeSeconds(home, far, timeSeconds);
        return inbound + links.LightTimeSeconds(far, home, timeSeconds - inbound);
    }
}
