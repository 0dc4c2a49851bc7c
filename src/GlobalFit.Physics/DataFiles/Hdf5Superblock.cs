using System.Buffers.Binary;

namespace GlobalFit.Physics.DataFiles;

/// <summary>The two facts of an HDF5 superblock needed to reject a file before handing it to the library:
/// whether the HDF5 signature is there, and how long the file says it is.</summary>
/// <remarks>
/// <para>PureHDF 2.2.0 does not compare the file length with the end-of-file address recorded in the superblock, and
/// read a copy of an observation file with its last bytes (part of the root object header) cut off without complaint.
/// The HDF5 C library refuses such a file ("truncated file"); this check does the same.</para>
/// <para>Layout from the HDF5 File Format Specification version 3.0, §II.A "Disk Format: Level 0A – Format Signature
/// and Superblock": the signature sits at byte 0, 512, 1024, 2048, … (after an optional user block); versions 0 and 1
/// store the sizes of offsets and lengths at bytes 13–14 and the base and end-of-file addresses after 16 (version 0) or
/// 20 (version 1) further bytes; versions 2 and 3 store the sizes at bytes 9–10 and base, extension and end-of-file
/// addresses from byte 12. The end-of-file address is absolute (the spec: "the absolute file address of the first byte
/// past the end of all HDF5 data"); all-ones means "undefined".</para>
/// </remarks>
internal static class Hdf5Superblock
{
    private static ReadOnlySpan<byte> Signature => [0x89, (byte)'H', (byte)'D', (byte)'F', 0x0D, 0x0A, 0x1A, 0x0A];

    /// <summary>What the start of a file says about it.</summary>
    /// <param name="HasSignature">The HDF5 signature was found at one of the allowed offsets.</param>
    /// <param name="RecordedLengthBytes">Length the file must have at least (its end-of-file address), or null
    /// when the superblock version is unknown to this check or the address is undefined.</param>
    public readonly record struct Facts(bool HasSignature, long? RecordedLengthBytes);

    public static Facts Inspect(Stream stream)
    {
        long length = stream.Length;
        Span<byte> header = stackalloc byte[64];
        for (long offset = 0; offset + Signature.Length <= length; offset = offset == 0 ? 512 : checked(offset * 2))
        {
            stream.Position = offset;
            int read = stream.ReadAtLeast(header, header.Length, throwOnEndOfStream: false);
            if (read < Signature.Length || !header[..Signature.Length].SequenceEqual(Signature))
                continue;
            return new Facts(true, RecordedLength(header[..read]));
        }
        return new Facts(false, null);
    }

    private static long? RecordedLength(ReadOnlySpan<byte> header)
    {
        if (header.Length < 9) return null;
        int version = header[8];
        int offsetSize;
        int endAt;
        switch (version)
        {
            case 0 or 1:
                if (header.Length < 15) return null;
                offsetSize = header[13];
                endAt = (version == 0 ? 24 : 28) + 2 * offsetSize; // after the base and free-space info addresses
                break;
            case 2 or 3:
                offsetSize = header[9];
                endAt = 12 + 2 * offsetSize; // after the base and superblock extension addresses
                break;
            default:
                return null;
        }
        if (offsetSize is not (2 or 4 or 8) || endAt + offsetSize > header.Length)
            return null;
        // Unlike other addresses, the end-of-file address is absolute: with a 512-byte user block, h5py 3.7
        // (HDF5 1.10) stored base 512 and an end-of-file address equal to the whole file length.
        ulong? endAddress = Address(header.Slice(endAt, offsetSize));
        return endAddress is null || endAddress.Value > long.MaxValue ? null : (long)endAddress.Value;
    }

    private static ulong? Address(ReadOnlySpan<byte> bytes)
    {
        ulong value = bytes.Length switch
        {
            2 => BinaryPrimitives.ReadUInt16LittleEndian(bytes),
            4 => BinaryPrimitives.ReadUInt32LittleEndian(bytes),
            _ => BinaryPrimitives.ReadUInt64LittleEndian(bytes),
        };
        ulong undefined = bytes.Length == 8 ? ulong.MaxValue : (1UL << (8 * bytes.Length)) - 1;
        return value == undefined ? null : value;
    }
}
