namespace GlobalFit.Physics.Files;

/// <summary>Opens every file globalfit writes. The one place file writes pass through, so that a failing disk can be
/// simulated for all of them at once (<see cref="WriteFaults"/>): every write site is then tested against a disk that
/// fills up at any byte.</summary>
public static class WriteStreams
{
    /// <summary>Opens <paramref name="path"/> for writing as <see cref="FileStream"/> would.</summary>
    public static FileStream Open(string path, FileMode mode, FileAccess access, FileShare share) =>
        WriteFaults.Active ? new FaultyFileStream(path, mode, access, share) : new FileStream(path, mode, access, share);

    // Writes what the remaining budget allows, then fails as a full disk does.
    private sealed class FaultyFileStream(string path, FileMode mode, FileAccess access, FileShare share)
        : FileStream(path, mode, access, share)
    {
        public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            int allowed = WriteFaults.Take(buffer.Length);
            base.Write(buffer[..allowed]);
            if (allowed < buffer.Length) throw WriteFaults.DiskFull();
        }

        public override void WriteByte(byte value) => Write([value]);

        public override Task WriteAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken)
        {
            Write(buffer, offset, count);
            return Task.CompletedTask;
        }

        public override ValueTask WriteAsync(ReadOnlyMemory<byte> buffer, CancellationToken cancellationToken = default)
        {
            Write(buffer.Span);
            return ValueTask.CompletedTask;
        }
    }
}
