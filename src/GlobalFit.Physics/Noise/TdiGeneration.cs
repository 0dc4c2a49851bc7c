namespace GlobalFit.Physics.Noise;

/// <summary>Which time-delay-interferometry generation the noise PSDs describe (equal, static arms).</summary>
/// <remarks>Derived (general second-generation combinations: Tinto &amp; Dhurandhar 2021, Living Rev. Relativ. 24, 1):
/// with equal static arms the second-generation
/// Michelson is <c>X₂ = (1 − D⁴) X₁.₅</c>, so every PSD and CSD (noise and signal alike) gains the factor
/// <c>|1 − e^{−4ix}|² = 4 sin²(2x)</c>.</remarks>
public enum TdiGeneration
{
    /// <summary>First generation ("1.5": distinct delays per direction, static arms).</summary>
    First,

    /// <summary>Second generation (2.0), equal-arm form: first-generation PSDs times <c>4 sin²(2x)</c>.</summary>
    Second,
}
