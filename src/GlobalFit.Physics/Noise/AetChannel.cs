namespace GlobalFit.Physics.Noise;

/// <summary>The noise-orthogonal TDI channels (shared/reference/detector-noise-gb.md §C.3).</summary>
public enum AetChannel
{
    /// <summary>Channel A = (Z − X)/√2.</summary>
    A,

    /// <summary>Channel E = (X − 2Y + Z)/√6.</summary>
    E,

    /// <summary>Channel T = (X + Y + Z)/√3, nearly blind to gravitational waves at low frequency.</summary>
    T,
}
