namespace GlobalFit.Physics.Files;

/// <summary>Simulates a disk that fills up: while injected, files opened through <see cref="WriteStreams"/> accept a
/// given number of bytes in total and then fail with "No space left on device". For fault tests only; process-wide,
/// so such tests must not run beside others.</summary>
public static class WriteFaults
{
    private static long _remaining = -1;
    private static long _written;
    private static string? _firstFailure;

    /// <summary>True while a fault is injected.</summary>
    public static bool Active => Interlocked.Read(ref _remaining) >= 0;

    /// <summary>Bytes written through <see cref="WriteStreams"/> since the last <see cref="Inject"/> or
    /// <see cref="Count"/>.</summary>
    public static long Written => Interlocked.Read(ref _written);

    /// <summary>Lets <paramref name="bytes"/> more bytes be written, then fails every write, until disposed.</summary>
    public static IDisposable Inject(long bytes)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(bytes);
        Interlocked.Exchange(ref _written, 0);
        Interlocked.Exchange(ref _firstFailure, null);
        Interlocked.Exchange(ref _remaining, bytes);
        return new Reset();
    }

    /// <summary>Counts the bytes written (see <see cref="Written"/>) without failing any, until disposed.</summary>
    public static IDisposable Count() => Inject(long.MaxValue);

    internal static int Take(int wanted)
    {
        while (true)
        {
            long remaining = Interlocked.Read(ref _remaining);
            if (remaining < 0) return wanted;
            int granted = (int)Math.Min(wanted, remaining);
            if (Interlocked.CompareExchange(ref _remaining, remaining - granted, remaining) == remaining)
            {
                Interlocked.Add(ref _written, granted);
                return granted;
            }
        }
    }

    internal static IOException DiskFull(string path)
    {
        Interlocked.CompareExchange(ref _firstFailure, path, null);
        return new IOException("No space left on device", unchecked((int)0x8007001C));
    }

    /// <summary>The file whose write failed first since the last <see cref="Inject"/>, or null.</summary>
    public static string? FirstFailure => Volatile.Read(ref _firstFailure);

    private sealed class Reset : IDisposable
    {
        public void Dispose() => Interlocked.Exchange(ref _remaining, -1);
    }
}
