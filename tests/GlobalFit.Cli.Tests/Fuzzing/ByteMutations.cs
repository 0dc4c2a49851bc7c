using System.Buffers.Binary;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Mutations of binary files: the damage disks, copies and crashes do (flipped bits, cut tails, spliced pieces
/// of another file) and the damage a hostile writer does (sizes and counts replaced by huge or negative numbers).</summary>
internal static class ByteMutations
{
    /// <summary>One mutation of <paramref name="seed"/>, chosen by <paramref name="random"/>; <paramref name="donor"/>
    /// supplies spliced bytes. The result always differs from the seed.</summary>
    public static byte[] Mutate(byte[] seed, byte[] donor, Random random)
    {
        for (int attempt = 0; ; attempt++)
        {
            byte[] result = Once(seed, donor, random);
            if (attempt > 8 || !result.AsSpan().SequenceEqual(seed)) return result;
        }
    }

    private static byte[] Once(byte[] seed, byte[] donor, Random random)
    {
        if (seed.Length == 0) return [(byte)random.Next(256)];
        switch (random.Next(7))
        {
            case 0: return FlipBits(seed, random, 1 + random.Next(8));
            case 1: return seed[..random.Next(seed.Length)];
            case 2: return Splice(seed, donor, random);
            case 3: return WriteHugeNumber(seed, random);
            case 4: return Remove(seed, random);
            case 5: return Duplicate(seed, random);
            default: return Overwrite(seed, random);
        }
    }

    private static byte[] FlipBits(byte[] seed, Random random, int count)
    {
        byte[] copy = (byte[])seed.Clone();
        for (int i = 0; i < count; i++) copy[random.Next(copy.Length)] ^= (byte)(1 << random.Next(8));
        return copy;
    }

    private static byte[] Splice(byte[] seed, byte[] donor, Random random)
    {
        if (donor.Length == 0) return FlipBits(seed, random, 1);
        int at = random.Next(seed.Length), from = random.Next(donor.Length);
        int length = Math.Min(1 + random.Next(256), donor.Length - from);
        byte[] copy = (byte[])seed.Clone();
        Array.Copy(donor, from, copy, at, Math.Min(length, copy.Length - at));
        return copy;
    }

    // Lengths, counts and offsets are 2-, 4- or 8-byte integers in every format read here; writing extreme values at a
    // random aligned place reaches them far more often than random bit flips do.
    private static byte[] WriteHugeNumber(byte[] seed, Random random)
    {
        byte[] copy = (byte[])seed.Clone();
        int width = (1 << random.Next(1, 4)) switch { 2 => 2, 4 => 4, _ => 8 };
        if (copy.Length < width) return FlipBits(seed, random, 1);
        int at = random.Next(copy.Length - width + 1) / width * width;
        var span = copy.AsSpan(at, width);
        ulong value = random.Next(4) switch
        {
            0 => ulong.MaxValue,
            1 => long.MaxValue,
            2 => uint.MaxValue,
            _ => (ulong)random.NextInt64(1L << 31, 1L << 40),
        };
        if (width == 2) BinaryPrimitives.WriteUInt16LittleEndian(span, unchecked((ushort)value));
        else if (width == 4) BinaryPrimitives.WriteUInt32LittleEndian(span, unchecked((uint)value));
        else BinaryPrimitives.WriteUInt64LittleEndian(span, value);
        return copy;
    }

    private static byte[] Remove(byte[] seed, Random random)
    {
        int at = random.Next(seed.Length), length = Math.Min(1 + random.Next(64), seed.Length - at);
        return [.. seed.AsSpan(0, at), .. seed.AsSpan(at + length)];
    }

    private static byte[] Duplicate(byte[] seed, Random random)
    {
        int at = random.Next(seed.Length), length = Math.Min(1 + random.Next(64), seed.Length - at);
        return [.. seed.AsSpan(0, at + length), .. seed.AsSpan(at, length), .. seed.AsSpan(at + length)];
    }

    private static byte[] Overwrite(byte[] seed, Random random)
    {
        byte[] copy = (byte[])seed.Clone();
        int at = random.Next(copy.Length), length = Math.Min(1 + random.Next(16), copy.Length - at);
        random.NextBytes(copy.AsSpan(at, length));
        return copy;
    }
}
