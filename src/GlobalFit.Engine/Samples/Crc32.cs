namespace GlobalFit.Engine.Samples;

/// <summary>The CRC-32 of ISO-HDLC (zlib, PNG, Ethernet): reflected polynomial 0xEDB88320, initial value and final
/// XOR 0xFFFFFFFF. Check value of the ASCII bytes "123456789": 0xCBF43926.</summary>
/// <remarks>Implemented here rather than taken from a package because one table-driven loop is all the sample files
/// need, and the polynomial is fixed by the file format (Catalogue/LAYOUT.md), not by a library's choice.</remarks>
public static class Crc32
{
    private static readonly uint[] Table = BuildTable();

    /// <summary>The CRC-32 of <paramref name="bytes"/>.</summary>
    /// <param name="bytes">The data.</param>
    /// <returns>The checksum.</returns>
    public static uint Compute(ReadOnlySpan<byte> bytes)
    {
        uint crc = 0xFFFFFFFFu;
        foreach (byte b in bytes) crc = Table[(crc ^ b) & 0xFF] ^ (crc >> 8);
        return crc ^ 0xFFFFFFFFu;
    }

    private static uint[] BuildTable()
    {
        var table = new uint[256];
        for (uint n = 0; n < 256; n++)
        {
            uint c = n;
            for (int k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
            table[n] = c;
        }
        return table;
    }
}
