namespace GlobalFit.Physics.Noise;

/// <summary>The noise-orthogonal TDI channels (Prince et al. 2002, arXiv:gr-qc/0209039; see <see cref="Series.TdiCombination"/>).</summary>
public enum AetChannel
{
    /// <summary>Channel A = (Z − X)/√2.</summary>
    A,

    /// <summary>Channel E = (X − 2Y + Z)/√6.</summary>
    E,

    /// <summary>Channel T = (X + Y + Z)/√3, nearly blind to gravitational waves at low frequency.</summary>
    T,
}
