using MessagePack;

namespace GlobalFit.Inference.Random;

/// <summary>
/// A seedable xoshiro256** pseudorandom stream whose whole state (four <see cref="ulong"/>s and a cached
/// spare Gaussian) is a small serialisable value. Pass it by <c>ref</c>; copying it forks the sequence.
/// </summary>
/// <remarks>
/// <para>Generator: Blackman &amp; Vigna (2021), "Scrambled linear pseudorandom number generators",
/// ACM Transactions on Mathematical Software 47(4), article 36 (preprint 2018, arXiv:1805.01407);
/// the update and the <c>**</c> scrambler follow the authors' reference <c>xoshiro256starstar.c</c>.</para>
/// <para>Seeding and splitting: a stream for a path (run seed, worker id, chain id, ...) is derived by
/// folding each path element into a 64-bit hash with <see cref="SplitMix64.Mix"/> and expanding the hash
/// into the four state words with <see cref="SplitMix64.Next"/>. We chose hashing over the jump function
/// because a stream is then addressable by its path alone, without knowing how many siblings exist or
/// in what order they were created; with 2^256 states the chance that two derived streams overlap within
/// any practical run length is negligible. <see cref="Jump"/> is still provided for callers that prefer
/// provably disjoint subsequences.</para>
/// <para>Gaussian draws use the 256-layer ziggurat (<see cref="GaussianZiggurat"/>), which needs one 64-bit output per
/// draw on its fast path (about 99 % of draws) instead of the polar method's two uniforms, a logarithm and a square
/// root per pair. The spare-variate fields remain part of the state: streams saved by the earlier polar-method
/// generator may hold a cached variate, which the next draw returns, so such checkpoints still load and continue.</para>
/// <para>The default value (all zero) is not a valid generator state; create streams with
/// <see cref="FromSeed"/> or <see cref="ForPath(ulong, ReadOnlySpan{ulong})"/>.</para>
/// <para>Not thread-safe: give each thread (each chain) its own stream.</para>
/// </remarks>
[MessagePackObject]
public struct RandomStream : IEquatable<RandomStream>
{
    /// <summary>State word 0.</summary>
    [Key(0)] public ulong S0;
    /// <summary>State word 1.</summary>
    [Key(1)] public ulong S1;
    /// <summary>State word 2.</summary>
    [Key(2)] public ulong S2;
    /// <summary>State word 3.</summary>
    [Key(3)] public ulong S3;
    /// <summary>Whether <see cref="SpareGaussian"/> holds an unused standard normal variate (only in states saved by the
    /// earlier polar-method generator; the ziggurat never caches one).</summary>
    [Key(4)] public bool HasSpareGaussian;
    /// <summary>The cached second variate of a polar-method pair, from a state saved by the earlier generator.</summary>
    [Key(5)] public double SpareGaussian;

    /// <summary>Creates a stream from explicit state words (used by tests and deserialisation).</summary>
    /// <param name="s0">State word 0.</param>
    /// <param name="s1">State word 1.</param>
    /// <param name="s2">State word 2.</param>
    /// <param name="s3">State word 3.</param>
    /// <exception cref="ArgumentException">All four words are zero (the generator's only fixed point).</exception>
    public RandomStream(ulong s0, ulong s1, ulong s2, ulong s3)
    {
        if ((s0 | s1 | s2 | s3) == 0)
        {
            throw new ArgumentException("xoshiro256** state must not be all zero.", nameof(s0));
        }

        S0 = s0;
        S1 = s1;
        S2 = s2;
        S3 = s3;
        HasSpareGaussian = false;
        SpareGaussian = 0.0;
    }

    /// <summary>Creates a stream by expanding <paramref name="seed"/> with SplitMix64.</summary>
    /// <param name="seed">Any 64-bit seed, including zero.</param>
    /// <returns>A fresh stream.</returns>
    public static RandomStream FromSeed(ulong seed)
    {
        ulong state = seed;
        // SplitMix64 outputs are a bijection of distinct counter values, so four consecutive outputs
        // are never all zero.
        return new RandomStream(
            SplitMix64.Next(ref state), SplitMix64.Next(ref state),
            SplitMix64.Next(ref state), SplitMix64.Next(ref state));
    }

    /// <summary>Derives the stream for a path below a run seed, e.g. (worker id, chain id).</summary>
    /// <param name="runSeed">The run seed.</param>
    /// <param name="path">Path elements; different paths give statistically independent streams.</param>
    /// <returns>The derived stream.</returns>
    public static RandomStream ForPath(ulong runSeed, ReadOnlySpan<ulong> path)
    {
        ulong hash = SplitMix64.Mix(runSeed);
        foreach (ulong element in path)
        {
            // Mixing the element before combining keeps (a, b) and (b, a) apart; the extra round
            // after combining makes each level a full avalanche of the previous one.
            unchecked
            {
                hash = SplitMix64.Mix(hash + 0x9E3779B97F4A7C15UL * (SplitMix64.Mix(element) | 1UL) + element);
            }
        }

        return FromSeed(hash);
    }

    /// <summary>Derives the stream for a two-level path (worker id, chain id) below a run seed.</summary>
    /// <param name="runSeed">The run seed.</param>
    /// <param name="first">First path element (e.g. worker id).</param>
    /// <param name="second">Second path element (e.g. chain id).</param>
    /// <returns>The derived stream.</returns>
    public static RandomStream ForPath(ulong runSeed, ulong first, ulong second)
    {
        ReadOnlySpan<ulong> path = [first, second];
        return ForPath(runSeed, path);
    }

    /// <summary>Returns the next 64 random bits (xoshiro256** output).</summary>
    /// <returns>A uniformly distributed 64-bit value.</returns>
    public ulong NextUInt64()
    {
        unchecked
        {
            ulong result = RotateLeft(S1 * 5UL, 7) * 9UL;
            ulong t = S1 << 17;
            S2 ^= S0;
            S3 ^= S1;
            S1 ^= S2;
            S0 ^= S3;
            S2 ^= t;
            S3 = RotateLeft(S3, 45);
            return result;
        }
    }

    /// <summary>Returns a uniform double in [0, 1) with 53 random bits.</summary>
    /// <returns>A value in [0, 1).</returns>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Returns a uniform double in (0, 1], safe to take the logarithm of.</summary>
    /// <returns>A value in (0, 1].</returns>
    public double NextDoubleNonZero() => ((NextUInt64() >> 11) + 1UL) * (1.0 / 9007199254740992.0);

    /// <summary>Returns a uniform double in [<paramref name="lower"/>, <paramref name="upper"/>).</summary>
    /// <param name="lower">Inclusive lower bound.</param>
    /// <param name="upper">Exclusive upper bound.</param>
    /// <returns>The draw.</returns>
    public double NextUniform(double lower, double upper) => lower + (upper - lower) * NextDouble();

    /// <summary>Returns the natural log of a uniform (0, 1] draw, as used in Metropolis tests.</summary>
    /// <returns>ln u, at most zero.</returns>
    public double NextLogUniform() => Math.Log(NextDoubleNonZero());

    /// <summary>Returns a uniform integer in [0, <paramref name="count"/>) without modulo bias.</summary>
    /// <param name="count">Number of outcomes; must be positive.</param>
    /// <returns>The draw.</returns>
    /// <remarks>Lemire (2019), "Fast random integer generation in an interval", ACM TOMACS 29(1), art. 3.</remarks>
    public int NextInt(int count)
    {
        if (count <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(count), count, "Count must be positive.");
        }

        ulong range = (ulong)count;
        unchecked
        {
            UInt128 product = (UInt128)NextUInt64() * range;
            ulong low = (ulong)product;
            if (low < range)
            {
                ulong threshold = (0UL - range) % range;
                while (low < threshold)
                {
                    product = (UInt128)NextUInt64() * range;
                    low = (ulong)product;
                }
            }

            return (int)(ulong)(product >> 64);
        }
    }

    /// <summary>Returns a standard normal variate (ziggurat method).</summary>
    /// <returns>A draw from N(0, 1).</returns>
    /// <remarks>Marsaglia &amp; Tsang (2000), "The Ziggurat Method for Generating Random Variables", Journal of
    /// Statistical Software 5(8). One 64-bit output supplies both the layer (low 8 bits) and a signed 53-bit uniform
    /// u ∈ [−1, 1) (high 53 bits), so the two never share bits. A point inside the next layer's width is accepted at
    /// once; otherwise the base layer samples the tail (Marsaglia 1964, Technometrics 6, 101, as in the paper's §4) and
    /// the other layers test a uniform height against the density (the wedge).</remarks>
    public double NextGaussian()
    {
        if (HasSpareGaussian)
        {
            HasSpareGaussian = false;
            return SpareGaussian;
        }

        double[] edges = GaussianZiggurat.Edges;
        double[] ratios = GaussianZiggurat.InnerRatios;
        while (true)
        {
            ulong bits = NextUInt64();
            int layer = (int)(bits & (GaussianZiggurat.LayerCount - 1));
            double u = unchecked((long)bits >> 11) * (1.0 / 4503599627370496.0);
            if (Math.Abs(u) < ratios[layer])
            {
                return u * edges[layer];
            }

            if (layer == 0)
            {
                return GaussianTail(u < 0.0);
            }

            double x = u * edges[layer];
            double[] densities = GaussianZiggurat.Densities;
            double height = densities[layer] + NextDouble() * (densities[layer + 1] - densities[layer]);
            if (height < GaussianZiggurat.Density(x))
            {
                return x;
            }
        }
    }

    /// <summary>Draws an index with probability proportional to non-negative <paramref name="weights"/>.</summary>
    /// <param name="weights">Unnormalised non-negative weights with a positive sum.</param>
    /// <returns>The chosen index.</returns>
    public int NextCategorical(ReadOnlySpan<double> weights)
    {
        double total = 0.0;
        foreach (double weight in weights)
        {
            total += weight;
        }

        double target = NextDouble() * total;
        double cumulative = 0.0;
        for (int i = 0; i < weights.Length; i++)
        {
            cumulative += weights[i];
            if (target < cumulative)
            {
                return i;
            }
        }

        // Rounding can leave target at the very top; return the last index with positive weight.
        for (int i = weights.Length - 1; i >= 0; i--)
        {
            if (weights[i] > 0.0)
            {
                return i;
            }
        }

        throw new ArgumentException("Weights must have a positive sum.", nameof(weights));
    }

    /// <summary>
    /// Advances the stream by 2^128 draws, so that successive jumps give non-overlapping subsequences.
    /// </summary>
    /// <remarks>Jump polynomial from the reference <c>xoshiro256starstar.c</c> (Blackman &amp; Vigna).</remarks>
    public void Jump()
    {
        ReadOnlySpan<ulong> jump =
        [
            0x180EC6D33CFD0ABAUL, 0xD5A61266F0C9392CUL, 0xA9582618E03FC9AAUL, 0x39ABDC4529B1661CUL,
        ];
        ulong s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        foreach (ulong word in jump)
        {
            for (int bit = 0; bit < 64; bit++)
            {
                if ((word & (1UL << bit)) != 0)
                {
                    s0 ^= S0;
                    s1 ^= S1;
                    s2 ^= S2;
                    s3 ^= S3;
                }

                NextUInt64();
            }
        }

        S0 = s0;
        S1 = s1;
        S2 = s2;
        S3 = s3;
        HasSpareGaussian = false;
    }

    /// <inheritdoc />
    public readonly bool Equals(RandomStream other) =>
        S0 == other.S0 && S1 == other.S1 && S2 == other.S2 && S3 == other.S3
        && HasSpareGaussian == other.HasSpareGaussian
        && BitConverter.DoubleToInt64Bits(SpareGaussian) == BitConverter.DoubleToInt64Bits(other.SpareGaussian);

    /// <inheritdoc />
    public override readonly bool Equals(object? obj) => obj is RandomStream other && Equals(other);

    /// <inheritdoc />
    public override readonly int GetHashCode() => HashCode.Combine(S0, S1, S2, S3, HasSpareGaussian, SpareGaussian);

    /// <summary>Bitwise state equality.</summary>
    /// <param name="left">First stream.</param>
    /// <param name="right">Second stream.</param>
    /// <returns>Whether the states are identical.</returns>
    public static bool operator ==(RandomStream left, RandomStream right) => left.Equals(right);

    /// <summary>Bitwise state inequality.</summary>
    /// <param name="left">First stream.</param>
    /// <param name="right">Second stream.</param>
    /// <returns>Whether the states differ.</returns>
    public static bool operator !=(RandomStream left, RandomStream right) => !left.Equals(right);

    // A draw from the normal tail beyond r, by Marsaglia's exponential rejection (Marsaglia & Tsang 2000, §4).
    private double GaussianTail(bool negative)
    {
        double x, y;
        do
        {
            x = -Math.Log(NextDoubleNonZero()) / GaussianZiggurat.TailStart;
            y = -Math.Log(NextDoubleNonZero());
        }
        while (y + y < x * x);

        return negative ? -(GaussianZiggurat.TailStart + x) : GaussianZiggurat.TailStart + x;
    }

    private static ulong RotateLeft(ulong x, int k) => (x << k) | (x >> (64 - k));
}
