namespace GlobalFit.Inference.Random;

/// <summary>
/// The SplitMix64 generator, used only to expand seeds into <see cref="RandomStream"/> states and to
/// hash stream paths.
/// </summary>
/// <remarks>
/// Steele, Lea &amp; Flood (2014), "Fast splittable pseudorandom number generators", OOPSLA;
/// the constants are those of Vigna's reference <c>splitmix64.c</c>, which Blackman &amp; Vigna recommend
/// for seeding xoshiro generators.
/// </remarks>
public static class SplitMix64
{
    /// <summary>Advances <paramref name="state"/> by the golden-ratio increment and returns the mixed output.</summary>
    /// <param name="state">The 64-bit generator state, updated in place.</param>
    /// <returns>The next 64-bit output.</returns>
    public static ulong Next(ref ulong state)
    {
        unchecked
        {
            state += 0x9E3779B97F4A7C15UL;
            return Mix(state);
        }
    }

    /// <summary>The SplitMix64 output function (a bijective 64-bit finaliser).</summary>
    /// <param name="value">The value to mix.</param>
    /// <returns>The mixed value.</returns>
    public static ulong Mix(ulong value)
    {
        unchecked
        {
            ulong z = value;
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            return z ^ (z >> 31);
        }
    }
}
