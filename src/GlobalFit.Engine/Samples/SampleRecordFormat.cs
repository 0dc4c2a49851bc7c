using System.Buffers.Binary;
using GlobalFit.Engine.Fitting;
using MessagePack;

namespace GlobalFit.Engine.Samples;

/// <summary>The framing of one record of a sample file (Catalogue/LAYOUT.md): a 12-byte header — the magic bytes
/// <c>GFSB</c>, the payload length and the CRC-32 of the payload, both unsigned 32-bit little-endian — then the payload,
/// a MessagePack <see cref="SampleBlock"/>.</summary>
/// <remarks>The magic makes a misplaced offset fail loudly instead of decoding garbage; the CRC catches flipped bits and
/// torn writes. The MessagePack encoding of a record is a pure function of its values, so identical blocks give
/// identical bytes.</remarks>
internal static class SampleRecordFormat
{
    public const int HeaderLength = 12;

    /// <summary>The largest payload accepted: a sane bound that stops a corrupted length field from asking for gigabytes.</summary>
    public const int MaximumPayloadLength = 1 << 30;

    public static ReadOnlySpan<byte> Magic => "GFSB"u8;

    public static byte[] Encode(SampleBlock block)
    {
        byte[] payload = MessagePackSerializer.Serialize(block, MessagePackSerializerOptions.Standard);
        if (payload.Length > MaximumPayloadLength)
            throw new ArgumentException($"the sample block of worker {block.WorkerId}, iteration {block.Iteration}, encodes to {payload.Length} bytes, more than a record may hold ({MaximumPayloadLength})");
        var record = new byte[HeaderLength + payload.Length];
        Magic.CopyTo(record);
        BinaryPrimitives.WriteUInt32LittleEndian(record.AsSpan(4), (uint)payload.Length);
        BinaryPrimitives.WriteUInt32LittleEndian(record.AsSpan(8), Crc32.Compute(payload));
        payload.CopyTo(record.AsSpan(HeaderLength));
        return record;
    }
}
