using System.Numerics;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>Caller-owned buffers for the two basis responses of the F-statistic: u, the A/E/T response to
/// <c>H = e+</c>, and v, the response to <c>H = e×</c>, both with φ0 = 0 and unit amplitude.</summary>
/// <remarks>
/// Derived here (see <see cref="FStatisticAmplitudes"/>; the response is linear in the complex amplitude tensor H): any source with the same (f0, ḟ, β, λ) has the response
/// <c>h̃ = P ũ + Q ṽ</c> with <c>P = e^{iφ0}(A+ cos 2ψ + i A× sin 2ψ)</c>, <c>Q = e^{iφ0}(A+ sin 2ψ − i A× cos 2ψ)</c>.
/// Filled by <see cref="GalacticBinaryTemplateGenerator.FillBasis"/>; the arrays have the generator's largest
/// envelope length and the first <see cref="Count"/> entries are valid. Not thread-safe.
/// </remarks>
public sealed class GalacticBinaryBasis
{
    /// <summary>Creates buffers for envelopes of up to <paramref name="capacity"/> bins.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The capacity is not positive.</exception>
    public GalacticBinaryBasis(int capacity)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(capacity);
        PlusA = new Complex[capacity];
        PlusE = new Complex[capacity];
        PlusT = new Complex[capacity];
        CrossA = new Complex[capacity];
        CrossE = new Complex[capacity];
        CrossT = new Complex[capacity];
    }

    /// <summary>Full-resolution index of the first valid bin.</summary>
    public int FirstBin { get; internal set; }

    /// <summary>Number of valid bins (the envelope length N of the last fill).</summary>
    public int Count { get; internal set; }

    /// <summary>u in channel A (response to e+).</summary>
    public Complex[] PlusA { get; }

    /// <summary>u in channel E.</summary>
    public Complex[] PlusE { get; }

    /// <summary>u in channel T.</summary>
    public Complex[] PlusT { get; }

    /// <summary>v in channel A (response to e×).</summary>
    public Complex[] CrossA { get; }

    /// <summary>v in channel E.</summary>
    public Complex[] CrossE { get; }

    /// <summary>v in channel T.</summary>
    public Complex[] CrossT { get; }
}
