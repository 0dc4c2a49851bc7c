namespace GlobalFit.Engine.Simulation;

/// <summary>Identifiers of the random streams a simulation draws from, as the first element of the stream path
/// under the scenario seed. Changing a value changes every simulated data set, so values are never reused.</summary>
public static class SimulationStreams
{
    /// <summary>Instrument and foreground noise; the second path element is the channel (0 = A, 1 = E, 2 = T).</summary>
    public const ulong Noise = 1;

    /// <summary>The galactic-binary population; the second path element is 0.</summary>
    public const ulong GalacticBinaryPopulation = 2;
}
