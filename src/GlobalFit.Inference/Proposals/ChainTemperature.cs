namespace GlobalFit.Inference.Proposals;

/// <summary>The current inverse temperature of one chain slot, shared with that slot's proposals.</summary>
/// <remarks>The sampler updates it when the ladder adapts; proposals read it to scale their steps.</remarks>
public sealed class ChainTemperature
{
    /// <summary>Creates a handle at inverse temperature <paramref name="inverseTemperature"/>.</summary>
    /// <param name="temperatureIndex">Rung index, 0 = cold.</param>
    /// <param name="inverseTemperature">β in [0, 1].</param>
    public ChainTemperature(int temperatureIndex, double inverseTemperature)
    {
        TemperatureIndex = temperatureIndex;
        InverseTemperature = inverseTemperature;
    }

    /// <summary>Ladder rung of the chain slot; 0 is the cold chain.</summary>
    public int TemperatureIndex { get; }

    /// <summary>β = 1/T of the rung, in [0, 1].</summary>
    public double InverseTemperature { get; internal set; }
}
