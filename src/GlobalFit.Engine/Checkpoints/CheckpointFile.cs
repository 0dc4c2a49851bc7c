using System.Buffers.Binary;
using System.Security.Cryptography;
using GlobalFit.Physics.Files;
using MessagePack;

namespace GlobalFit.Engine.Checkpoints;

/// <summary>Writes and reads <c>RUN/checkpoints/</c>: <c>latest.ckpt</c> and the one before it, <c>previous.ckpt</c>.</summary>
/// <remarks>
/// <para>File layout: 8 bytes magic <c>GFCKPT01</c>, 8 bytes little-endian payload length, 32 bytes SHA-256 of the
/// payload, then the MessagePack <see cref="RunCheckpoint"/>. A write goes to <c>latest.tmp</c>, is flushed to disk
/// (fsync), then <c>latest</c> becomes <c>previous</c> and the temporary file becomes <c>latest</c>; a crash at any
/// point leaves at least one complete, verifiable checkpoint.</para>
/// <para>Reading verifies length and checksum; a damaged <c>latest</c> is reported through the warning callback and
/// <c>previous</c> is used instead.</para>
/// </remarks>
public static class CheckpointFile
{
    private const int HeaderBytes = 8 + 8 + 32;
    private static readonly byte[] Magic = "GFCKPT01"u8.ToArray();

    /// <summary>Name of the checkpoint folder inside a run folder.</summary>
    public const string FolderName = "checkpoints";

    /// <summary>The folder inside a run folder.</summary>
    public static string Folder(string runFolder) => Path.Combine(runFolder, FolderName);

    /// <summary>Path of the newest checkpoint.</summary>
    public static string LatestPath(string runFolder) => Path.Combine(Folder(runFolder), "latest.ckpt");

    /// <summary>Path of the one before.</summary>
    public static string PreviousPath(string runFolder) => Path.Combine(Folder(runFolder), "previous.ckpt");

    /// <summary>Writes <paramref name="checkpoint"/> as the newest checkpoint, keeping the previous one.</summary>
    public static void Write(string runFolder, RunCheckpoint checkpoint)
    {
        ArgumentNullException.ThrowIfNull(checkpoint);
        Directory.CreateDirectory(Folder(runFolder));
        string temporary = Path.Combine(Folder(runFolder), "latest.tmp");
        try
        {
            WriteTemporary(temporary, checkpoint);
        }
        catch (Exception e)
        {
            // The previous checkpoints stay as they were; a half-written temporary file is not left behind. The
            // serialiser wraps the stream's I/O errors in its own exception; the I/O cause is what the user needs.
            TryDelete(temporary);
            if (FileWriteException.IoCause(e) is { } cause)
                throw new IOException($"{temporary} cannot be written: {FileProblem.Describe(temporary, cause)}", e);
            throw;
        }
        string latest = LatestPath(runFolder);
        if (File.Exists(latest)) File.Move(latest, PreviousPath(runFolder), overwrite: true);
        File.Move(temporary, latest);
    }

    private static void TryDelete(string path)
    {
        try
        {
            if (File.Exists(path)) File.Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Nothing more can be done here; the write error that brought us here is what gets reported.
        }
    }

    private static void WriteTemporary(string temporary, RunCheckpoint checkpoint)
    {
        using (var stream = WriteStreams.Open(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
        {
            // The payload is serialised straight to the file behind a placeholder header, which is filled in once its
            // length and digest are known: a checkpoint of thousands of workers is never held whole in memory.
            stream.Write(new byte[HeaderBytes]);
            byte[] digest;
            long length;
            using (var hashing = new HashingWriteStream(stream))
            {
                MessagePackSerializer.Serialize(hashing, checkpoint, MessagePackSerializerOptions.Standard);
                digest = hashing.Digest();
                length = hashing.Written;
            }
            Span<byte> header = stackalloc byte[HeaderBytes];
            Magic.CopyTo(header);
            BinaryPrimitives.WriteInt64LittleEndian(header[8..], length);
            digest.CopyTo(header[16..]);
            stream.Position = 0;
            stream.Write(header);
            WriteStreams.FlushToDisk(stream);
        }
    }

    /// <summary>True when the run folder holds at least one checkpoint file.</summary>
    public static bool Exists(string runFolder) => File.Exists(LatestPath(runFolder)) || File.Exists(PreviousPath(runFolder));

    /// <summary>Reads the newest intact checkpoint of this run.</summary>
    /// <param name="runFolder">The run folder.</param>
    /// <param name="warn">Receives a message when the latest checkpoint is damaged or belongs to another run and the
    /// previous one is used.</param>
    /// <param name="configDigest">The digest of the run's resolved configuration; a checkpoint written under another is
    /// another run's and is not used. Null accepts any.</param>
    /// <exception cref="InvalidInputException">No intact checkpoint of this run exists; the message names both files and
    /// what is wrong with each.</exception>
    public static RunCheckpoint Read(string runFolder, Action<string> warn, string? configDigest = null)
    {
        ArgumentNullException.ThrowIfNull(warn);
        string latest = LatestPath(runFolder), previous = PreviousPath(runFolder);
        string? latestProblem = TryRead(latest, configDigest, out var checkpoint);
        if (latestProblem is null) return checkpoint!;
        string? previousProblem = TryRead(previous, configDigest, out checkpoint);
        if (previousProblem is null)
        {
            warn($"checkpoint {latest} is unusable ({latestProblem}); continuing from the previous one, {previous} (iteration {checkpoint!.Iteration})");
            return checkpoint;
        }
        throw new InvalidInputException(latest, null, $"no usable checkpoint: {latestProblem}; {previous}: {previousProblem}");
    }

    private static string? TryRead(string path, string? configDigest, out RunCheckpoint? checkpoint)
    {
        checkpoint = null;
        if (!File.Exists(path)) return "file missing";
        byte[] bytes = File.ReadAllBytes(path);
        if (bytes.Length < HeaderBytes || !bytes.AsSpan(0, 8).SequenceEqual(Magic)) return "not a globalfit checkpoint (bad header)";
        long length = BinaryPrimitives.ReadInt64LittleEndian(bytes.AsSpan(8));
        if (length != bytes.Length - HeaderBytes) return $"truncated: header promises {length} bytes, file holds {bytes.Length - HeaderBytes}";
        var payload = bytes.AsMemory(HeaderBytes);
        Span<byte> digest = stackalloc byte[32];
        SHA256.HashData(payload.Span, digest);
        if (!digest.SequenceEqual(bytes.AsSpan(16, 32))) return "checksum mismatch (the file is corrupted)";
        try
        {
            checkpoint = MessagePackSerializer.Deserialize<RunCheckpoint>(payload, MessagePackSerializerOptions.Standard);
        }
        catch (MessagePackSerializationException e)
        {
            return $"unreadable contents ({e.Message})";
        }
        if (checkpoint.FormatVersion != RunCheckpoint.CurrentFormatVersion)
            return $"format version {checkpoint.FormatVersion}, this build reads {RunCheckpoint.CurrentFormatVersion}";
        if (configDigest is not null && checkpoint.ConfigDigest != configDigest)
            return "it belongs to another run (written under another run.toml; was run.toml edited, or the file copied from another run?)";
        return null;
    }
}
