using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Detector;

/// <summary>Michelson X, Y, Z and the derived A, E, T of one signal on one time axis.</summary>
/// <remarks>Values are fractional-frequency deviations. Immutable once built (the sample arrays belong to it).</remarks>
public sealed class TdiResponse
{
    /// <summary>Groups X, Y, Z (which must share a time axis) and computes A, E, T from them (<see cref="TdiCombination"/>).</summary>
    /// <exception cref="ArgumentException">The channels' time axes differ.</exception>
    public TdiResponse(TimeSeries x, TimeSeries y, TimeSeries z)
    {
        Aet = AetTimeSeries.FromMichelson(x, y, z);
        X = x;
        Y = y;
        Z = z;
    }

    /// <summary>Michelson X (centred on spacecraft 1).</summary>
    public TimeSeries X { get; }

    /// <summary>Michelson Y (centred on spacecraft 2).</summary>
    public TimeSeries Y { get; }

    /// <summary>Michelson Z (centred on spacecraft 3).</summary>
    public TimeSeries Z { get; }

    /// <summary>A, E, T from <see cref="X"/>, <see cref="Y"/>, <see cref="Z"/>.</summary>
    public AetTimeSeries Aet { get; }
}
