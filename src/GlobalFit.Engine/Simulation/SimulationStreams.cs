namespace GlobalFit.Engine.Simulation;

/// <summary>Identifiers of the random streams a simulation draws from, as the first element of the stream path
/// under the scenario seed. Changing a value changes every simulated data set, so values are never reused: 1 is the
/// noise, and each source class keeps its own value in its module (galactic binaries 2, massive black-hole binaries 3).</summary>
public static class SimulationStreams
{
    /// <summary>Instrument and foreground noise; the second path element is the channel (0 = A, 1 = E, 2 = T).</summary>
    public const ulong Noise = 1;
}
