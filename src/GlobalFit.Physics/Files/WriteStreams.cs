namespace GlobalFit.Physics.Files;

/// <summary>Opens every file globalfit writes. The one place file writes pass through, so that a failing disk can be
/// simulated for all of them at once (<see cref="WriteFaults"/>): every write site is then tested against a disk that
/// fills up at any byte.</summary>
public static class WriteStreams
{
    /// <summary>Opens <paramref name="path"/> for writing as <see cref="FileStream"/> would.</summary>
    public static Stream Open(string path, FileMode mode, FileAccess access, FileShare share)
    {
        var file = new FileStream(path, mode, access, share);
        return WriteFaults.Active ? new FaultyStream(file) : file;
    }

    /// <summary>Flushes <paramref name="stream"/> (opened by <see cref="Open"/>) through to the disk.</summary>
    public static void FlushToDisk(Stream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        switch (stream)
        {
            case FileStream file: file.Flush(flushToDisk: true); break;
            case FaultyStream faulty: faulty.File.Flush(flushToDisk: true); break;
            default: stream.Flush(); break;
        }
    }

    // Passes writes to the file while the budget lasts, then writes what is left of it and fails as a full disk does.
    private sealed class FaultyStream(FileStream file) : Stream
    {
        public FileStream File { get; } = file;

        public override bool CanRead => File.CanRead;

        public override bool CanSeek => File.CanSeek;

        public override bool CanWrite => File.CanWrite;

        public override long Length => File.Length;

        public override long Position
        {
            get => File.Position;
            set => File.Position = value;
        }

        public override void Flush() => File.Flush();

        public override int Read(byte[] buffer, int offset, int count) => File.Read(buffer, offset, count);

        public override long Seek(long offset, SeekOrigin origin) => File.Seek(offset, origin);

        public override void SetLength(long value) => File.SetLength(value);

        public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            int allowed = WriteFaults.Take(buffer.Length);
            File.Write(buffer[..allowed]);
            if (allowed < buffer.Length) throw WriteFaults.DiskFull(File.Name);
        }

        public override void WriteByte(byte value) => Write([value]);

        protected override void Dispose(bool disposing)
        {
            if (disposing) File.Dispose();
            base.Dispose(disposing);
        }
    }
}
