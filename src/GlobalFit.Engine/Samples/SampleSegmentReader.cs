using System.Buffers.Binary;
using System.Globalization;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Files;
using MessagePack;

namespace GlobalFit.Engine.Samples;

/// <summary>Reads and verifies the committed records of one sample file.</summary>
/// <remarks>Everything up to the committed length must be whole, checksummed records of this worker in increasing
/// iteration order; anything else there is damage (a flipped bit, a truncated file, a foreign file) and is reported with
/// the file and the byte offset of the record, because silently skipping it would change the catalogue.</remarks>
internal static class SampleSegmentReader
{
    public readonly record struct Record(long Offset, long EndOffset, SampleBlock Block);

    public static IEnumerable<Record> Records(string path, string workerId, long committedLength)
    {
        if (committedLength == 0) yield break;
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
        if (stream.Length < committedLength)
            throw new InvalidInputException(path, null, $"holds {stream.Length} bytes but {committedLength} were committed: the file was cut short");
        var header = new byte[SampleRecordFormat.HeaderLength];
        long offset = 0;
        long previousIteration = long.MinValue;
        while (offset < committedLength)
        {
            string location = string.Create(CultureInfo.InvariantCulture, $"byte offset {offset}");
            if (committedLength - offset < SampleRecordFormat.HeaderLength)
                throw new InvalidInputException(path, location, "a record header is cut short before the commit point");
            stream.ReadExactly(header);
            if (!header.AsSpan(0, 4).SequenceEqual(SampleRecordFormat.Magic))
                throw new InvalidInputException(path, location, "no record starts here (magic bytes GFSB not found): the file is damaged");
            uint length = BinaryPrimitives.ReadUInt32LittleEndian(header.AsSpan(4));
            uint expectedCrc = BinaryPrimitives.ReadUInt32LittleEndian(header.AsSpan(8));
            long end = offset + SampleRecordFormat.HeaderLength + length;
            if (length > SampleRecordFormat.MaximumPayloadLength || end > committedLength)
                throw new InvalidInputException(path, location, $"the record claims {length} payload bytes, past the commit point at {committedLength}: the length field is damaged");
            var payload = new byte[length];
            stream.ReadExactly(payload);
            if (Crc32.Compute(payload) != expectedCrc)
                throw new InvalidInputException(path, location, "checksum mismatch: the record is damaged");
            var block = Decode(payload, path, location);
            if (block.WorkerId != workerId)
                throw new InvalidInputException(path, location, $"the record belongs to worker '{block.WorkerId}', not to '{workerId}' as the file name says");
            if (block.Iteration <= previousIteration)
                throw new InvalidInputException(path, location, $"iteration {block.Iteration} follows iteration {previousIteration}: records are out of order");
            previousIteration = block.Iteration;
            yield return new Record(offset, end, block);
            offset = end;
        }
    }

    private static SampleBlock Decode(byte[] payload, string path, string location)
    {
        try
        {
            return MessagePackSerializer.Deserialize<SampleBlock>(payload, MessagePackSerializerOptions.Standard)
                ?? throw new InvalidInputException(path, location, "the record holds no sample block");
        }
        catch (MessagePackSerializationException e)
        {
            throw new InvalidInputException(path, location, $"the checksum matches but the payload is not a sample block: {e.Message}", e);
        }
    }
}
